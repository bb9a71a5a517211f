export interface HistogramBin {
  /** Inclusive lower edge. */
  fromValue: number;
  /** Exclusive upper edge (the last bin also holds a value equal to it). */
  toValue: number;
  count: number;
}

export interface Histogram {
  bins: HistogramBin[];
  binWidth: number;
}

const MAX_BINS = 16;

/** Removes the float dust of repeated additions (86.00000000000001 → 86). */
const clean = (value: number) => Number(value.toPrecision(12));

/** The smallest 1, 2, 2.5 or 5 × 10^e at or above `raw`, so bin edges read as round numbers. */
export function niceBinWidth(raw: number): number {
  if (!(raw > 0) || !Number.isFinite(raw)) return 1;
  const decade = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 2.5, 5, 10].find((factor) => factor * decade >= raw * (1 - 1e-12)) ?? 10;
  return clean(step * decade);
}

/**
 * Counts values into equal bins. The number of classes follows Sturges' rule, k = ⌈log2 n⌉ + 1 (H. A. Sturges,
 * "The choice of a class interval", JASA 21(153), 1926), the width is (max − min) / k rounded up to a round
 * number, and the edges sit on multiples of that width. A given `binWidth` overrides the rule.
 */
export function histogram(values: readonly number[], options: { binWidth?: number } = {}): Histogram {
  const finite = values.filter((value) => Number.isFinite(value));
  if (finite.length === 0) return { bins: [], binWidth: options.binWidth ?? 1 };
  const min = Math.min(...finite);
  const max = Math.max(...finite);
  const classes = Math.ceil(Math.log2(finite.length)) + 1;
  let binWidth = options.binWidth ?? niceBinWidth(max > min ? (max - min) / classes : Math.abs(min) / 100 || 1);
  // Never more than MAX_BINS bars, whatever the spread.
  while ((max - min) / binWidth >= MAX_BINS) binWidth = niceBinWidth(binWidth * 1.01);
  const start = clean(Math.floor(min / binWidth + 1e-9) * binWidth);
  const binCount = Math.floor((max - start) / binWidth + 1e-9) + 1;
  const bins: HistogramBin[] = Array.from({ length: binCount }, (_, i) => ({
    fromValue: clean(start + i * binWidth),
    toValue: clean(start + (i + 1) * binWidth),
    count: 0,
  }));
  for (const value of finite) {
    const index = Math.min(binCount - 1, Math.floor((value - start) / binWidth + 1e-9));
    bins[index].count += 1;
  }
  return { bins, binWidth };
}
