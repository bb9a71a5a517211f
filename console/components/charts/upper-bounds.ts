/**
 * Splits a curve into the values that were measured and the values that are only upper bounds ("less than":
 * not measurably above the noise), so the two can be drawn differently. A bound point next to a measured one
 * repeats the measured neighbour in the bound series, so the dashed part joins the solid line without a gap.
 */
export function splitUpperBounds(values: ArrayLike<number | null>, isUpperBound: ArrayLike<boolean>): { measured: (number | null)[]; bounds: (number | null)[] } {
  const measured: (number | null)[] = [];
  const bounds: (number | null)[] = [];
  for (let i = 0; i < values.length; i++) {
    const value = values[i];
    const bound = Boolean(isUpperBound[i]);
    measured.push(bound ? null : value);
    const touchesBound = Boolean(isUpperBound[i - 1]) || Boolean(isUpperBound[i + 1]);
    bounds.push(bound || touchesBound ? value : null);
  }
  return { measured, bounds };
}

