import type { Distribution } from '@shared/schemas/production';

/**
 * Quantile p of sorted values by linear interpolation between order statistics: h = (n − 1)·p,
 * Q = x[⌊h⌋] + (h − ⌊h⌋)·(x[⌊h⌋+1] − x[⌊h⌋]) (Hyndman & Fan, The American Statistician 50(4), 1996, definition 7).
 */
export function quantileOfSorted(sorted: readonly number[], p: number): number {
  const h = (sorted.length - 1) * p;
  const low = Math.floor(h);
  const high = Math.min(low + 1, sorted.length - 1);
  return sorted[low] + (h - low) * (sorted[high] - sorted[low]);
}

/** Count, mean, sample standard deviation (n − 1), min, p5, p50, p95, max; null for no values. */
export function distributionOf(values: readonly number[]): Distribution | null {
  const finite = values.filter((value) => Number.isFinite(value));
  if (finite.length === 0) return null;
  const sorted = [...finite].sort((a, b) => a - b);
  const count = sorted.length;
  const mean = sorted.reduce((sum, value) => sum + value, 0) / count;
  const squares = sorted.reduce((sum, value) => sum + (value - mean) ** 2, 0);
  return {
    count,
    mean,
    standardDeviation: count > 1 ? Math.sqrt(squares / (count - 1)) : null,
    min: sorted[0],
    p5: quantileOfSorted(sorted, 0.05),
    p50: quantileOfSorted(sorted, 0.5),
    p95: quantileOfSorted(sorted, 0.95),
    max: sorted[count - 1],
  };
}
