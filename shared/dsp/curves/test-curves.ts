import type { MagnitudeCurve } from './curve';

/** Test helper: a curve through the given [frequencyHz, levelDb] points. */
export function curveThrough(points: [number, number][]): MagnitudeCurve {
  return {
    frequencyHz: Float64Array.from(points, ([f]) => f),
    magnitudeDb: Float64Array.from(points, ([, level]) => level),
  };
}

/** Test helper: `levelDb(f)` sampled at `pointsPerOctave` points per octave (base 2) from startHz up to stopHz. */
export function sampledCurve(levelDb: (f: number) => number, startHz: number, stopHz: number, pointsPerOctave: number): MagnitudeCurve {
  const count = Math.floor(pointsPerOctave * Math.log2(stopHz / startHz) + 1e-9) + 1;
  const frequencyHz = new Float64Array(count);
  for (let i = 0; i < count; i++) frequencyHz[i] = startHz * 2 ** (i / pointsPerOctave);
  return { frequencyHz, magnitudeDb: frequencyHz.map(levelDb) };
}
