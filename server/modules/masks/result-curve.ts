import type { MagnitudeCurve } from '@shared/dsp';

/**
 * The frequency-response curve of a stored result (`curves.frequencyHz` + `curves.magnitudeDb`, as the sweep,
 * stepped-sine and spectrum kinds write them), or null when the result has none.
 */
export function responseCurveOf(result: unknown): MagnitudeCurve | null {
  const curves = (result as { curves?: { frequencyHz?: unknown; magnitudeDb?: unknown } } | null)?.curves;
  const frequencyHz = curves?.frequencyHz;
  const magnitudeDb = curves?.magnitudeDb;
  if (!Array.isArray(frequencyHz) || !Array.isArray(magnitudeDb) || frequencyHz.length !== magnitudeDb.length || frequencyHz.length < 2) return null;
  if (!frequencyHz.every((f) => typeof f === 'number') || !magnitudeDb.every((m) => typeof m === 'number')) return null;
  return { frequencyHz: Float64Array.from(frequencyHz as number[]), magnitudeDb: Float64Array.from(magnitudeDb as number[]) };
}
