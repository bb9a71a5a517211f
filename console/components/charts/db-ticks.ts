/** Steps a dB axis may use: 1-2-5 per decade, so tick labels stay round numbers (common practice, no source). */
const DB_STEPS = [0.1, 0.2, 0.5, 1, 2, 5, 10, 20, 50, 100];

/** The smallest step that keeps the tick count at or below `maxTicks` over `spanDb`. */
export function dbTickStep(spanDb: number, maxTicks = 8): number {
  if (!(spanDb > 0)) return 1;
  for (const step of DB_STEPS) {
    if (spanDb / step <= maxTicks) return step;
  }
  return DB_STEPS[DB_STEPS.length - 1];
}

/** Multiples of `stepDb` inside [minDb, maxDb]. */
export function dbTicks(minDb: number, maxDb: number, stepDb: number): number[] {
  const ticks: number[] = [];
  const first = Math.ceil(minDb / stepDb - 1e-9);
  for (let k = first; k * stepDb <= maxDb + stepDb * 1e-9; k++) ticks.push(Number((k * stepDb).toFixed(6)));
  return ticks;
}

/**
 * The range a dB axis shows for data spanning [minDb, maxDb]: at least `minimumSpanDb` (so a flat response
 * is not blown up into noise), widened to whole ticks on both sides.
 */
export function dbAxisRange(minDb: number, maxDb: number, minimumSpanDb = 20, maxTicks = 8): [number, number] {
  if (!Number.isFinite(minDb) || !Number.isFinite(maxDb)) return [-minimumSpanDb / 2, minimumSpanDb / 2];
  let low = Math.min(minDb, maxDb);
  let high = Math.max(minDb, maxDb);
  if (high - low < minimumSpanDb) {
    const centre = (high + low) / 2;
    low = centre - minimumSpanDb / 2;
    high = centre + minimumSpanDb / 2;
  }
  const step = dbTickStep(high - low, maxTicks);
  return [Math.floor(low / step) * step, Math.ceil(high / step) * step];
}

/** Ticks of a log axis: 1, 2 and 5 times each power of ten inside [min, max] (min > 0); powers of ten only past three decades. */
export function logTicks(min: number, max: number): number[] {
  if (!(min > 0) || !(max >= min)) return [];
  const ticks: number[] = [];
  const mantissas = Math.log10(max / min) > 3.01 ? [1] : [1, 2, 5];
  for (let exponent = Math.floor(Math.log10(min) + 1e-9); 10 ** exponent <= max * (1 + 1e-9); exponent++) {
    for (const mantissa of mantissas) {
      const value = Number((mantissa * 10 ** exponent).toPrecision(3));
      if (value >= min * (1 - 1e-9) && value <= max * (1 + 1e-9)) ticks.push(value);
    }
  }
  return ticks;
}

/**
 * Whole decades around [min, max] for a log axis, from `minimumDecades` to `maximumDecades` wide: values far
 * below the largest (numerical residue, a harmonic the device does not make) fall off the bottom instead of
 * squashing the curves that matter.
 */
export function logAxisRange(min: number, max: number, minimumDecades = 2, maximumDecades = 4): [number, number] {
  if (!(min > 0) || !(max > 0)) return [0.01, 10];
  let low = Math.floor(Math.log10(min) + 1e-9);
  const high = Math.ceil(Math.log10(max) - 1e-9);
  if (high - low < minimumDecades) low = high - minimumDecades;
  if (high - low > maximumDecades) low = high - maximumDecades;
  return [Number((10 ** low).toPrecision(1)), Number((10 ** high).toPrecision(1))];
}
