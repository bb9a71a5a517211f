import { describe, expect, it } from 'vitest';
import { differenceToReference, prepareOverlay, type OverlayCurve } from './overlay';

// A curve that is a straight line in dB against log f: L(f) = L0 + s·log2(f / 1 kHz). Reading it anywhere on the
// engine's interpolation (straight lines in dB against log f) is exact, so every expected value is closed form.
function line(id: string, levelAt1kHzDb: number, slopeDbPerOctave: number, pointsPerOctave = 3): OverlayCurve {
  const frequencyHz: number[] = [];
  for (let k = -6 * pointsPerOctave; k <= 4 * pointsPerOctave; k++) frequencyHz.push(1000 * 2 ** (k / pointsPerOctave));
  return { id, label: id, frequencyHz, magnitudeDb: frequencyHz.map((f) => levelAt1kHzDb + slopeDbPerOctave * Math.log2(f / 1000)) };
}

describe('overlay normalisation and difference', () => {
  it('puts every curve at 0 dB at 1 kHz with "at 1 kHz"', () => {
    const { curves } = prepareOverlay([line('a', 86, 0), line('b', 80.5, -1)], 'at_1khz');
    for (const curve of curves) {
      const index = curve.frequencyHz.findIndex((f) => Math.abs(f - 1000) < 1e-9);
      expect(curve.magnitudeDb[index]).toBeCloseTo(0, 12);
    }
    expect(curves.map((curve) => curve.referenceLevelDb)).toEqual([86, 80.5]);
  });

  it('takes the power mean over 300 Hz – 3 kHz as 0 dB with "band mean": a flat curve lands on 0 dB everywhere', () => {
    // Power mean of a constant is the constant (closed form).
    const { curves } = prepareOverlay([line('flat', 90, 0)], 'band_mean');
    expect(Math.max(...curves[0].magnitudeDb.map(Math.abs))).toBeLessThan(1e-9);
  });

  it('keeps levels as stored with "none" and drops nulls', () => {
    const curve = { id: 'n', label: 'n', frequencyHz: [100, 200, 400], magnitudeDb: [1, null, 3] };
    const [prepared] = prepareOverlay([curve], 'none').curves;
    expect(Array.from(prepared.frequencyHz)).toEqual([100, 400]);
    expect(Array.from(prepared.magnitudeDb)).toEqual([1, 3]);
    expect(prepared.referenceLevelDb).toBeNull();
  });

  it('reads curves on the same grid onto one shared frequency array, and the levels stay each curve\'s own', () => {
    // Closed form: line() levels are L0 + s·log2(f / 1 kHz) on the grid 1 kHz·2^(k/3).
    const a = line('a', 86, 0);
    const b = line('b', 80, -1);
    const { curves } = prepareOverlay([a, b], 'none');
    expect(curves[1].frequencyHz).toBe(curves[0].frequencyHz);
    curves[1].frequencyHz.forEach((f, i) => expect(curves[1].magnitudeDb[i]).toBeCloseTo(80 - Math.log2(f / 1000), 12));
    // A second normalisation of the same curves reads them again from the cache and still normalises each one.
    const again = prepareOverlay([a, b], 'at_1khz').curves;
    expect(again[0].frequencyHz).toBe(curves[0].frequencyHz);
    expect(again.map((curve) => curve.referenceLevelDb)).toEqual([86, 80]);
  });

  it('reports a curve that cannot be normalised instead of failing the overlay', () => {
    const high = { id: 'tweeter', label: 'tweeter', frequencyHz: [2000, 4000, 8000], magnitudeDb: [1, 2, 3] };
    const { curves, problems } = prepareOverlay([high, line('a', 86, 0)], 'at_1khz');
    expect(curves.map((curve) => curve.id)).toEqual(['a']);
    expect(problems[0].id).toBe('tweeter');
  });

  it('shows each curve minus the reference on a common 1/48-octave grid over the shared span', () => {
    // (L0 + s·x) − (L0' + s'·x) = ΔL0 + Δs·x with x = log2(f / 1 kHz): closed form on every grid point.
    const { curves } = prepareOverlay([line('ref', 86, 0), line('plus3', 89, 0), line('tilt', 86, 0.5, 5)], 'none');
    const result = differenceToReference(curves, 'ref')!;
    expect(result.gridHz[0]).toBeGreaterThanOrEqual(1000 * 2 ** -6 - 1e-9);
    expect(result.gridHz.length).toBeGreaterThan(400);
    const byId = Object.fromEntries(result.differences.map((d) => [d.id, d.differenceDb]));
    expect(byId.ref.every((d) => Math.abs(d) < 1e-12)).toBe(true);
    expect(byId.plus3.every((d) => Math.abs(d - 3) < 1e-9)).toBe(true);
    result.gridHz.forEach((f, i) => expect(byId.tilt[i]).toBeCloseTo(0.5 * Math.log2(f / 1000), 9));
  });
});
