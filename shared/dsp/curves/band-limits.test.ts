import { describe, expect, it } from 'vitest';
import { bandLimits } from './band-limits';
import type { LimitPoint } from './curve';
import { curveThrough, sampledCurve } from './test-curves';

function foundHz(point: LimitPoint): number {
  if (point.status !== 'found') throw new Error(`expected a found limit, got ${point.status}`);
  return point.frequencyHz;
}

// 2nd-order Butterworth high-pass: |H|² = (f/fc)⁴/(1 + (f/fc)⁴) (closed form; −10·log10 2 = −3.0103 dB at fc).
const FC_HZ = 100;
const butterworthDb = (f: number) => 10 * Math.log10((f / FC_HZ) ** 4 / (1 + (f / FC_HZ) ** 4));
/** Frequency where the Butterworth level is `levelDb`: (f/fc)⁴ = g/(1 − g), g = 10^(L/10). */
const butterworthFrequencyAt = (levelDb: number) => {
  const g = 10 ** (levelDb / 10);
  return FC_HZ * (g / (1 - g)) ** 0.25;
};

describe('band limits (−X dB points)', () => {
  // 48 points per octave from 12.5 Hz, so fc = 12.5·2³ is a grid point.
  const butterworth = sampledCurve(butterworthDb, 12.5, 12800, 48);

  it('puts the −3.0103 dB point of a 2nd-order Butterworth high-pass at fc (closed form)', () => {
    const result = bandLimits(butterworth, {
      reference: { kind: 'at_frequency', frequencyHz: 12800 },
      dropsDb: [10 * Math.log10(2), 3, 6, 10],
    });
    const referenceDb = butterworthDb(12800);
    expect(result.reference.levelDb).toBeCloseTo(referenceDb, 12);
    expect(foundHz(result.limits[0].lower)).toBeCloseTo(FC_HZ, 2);
    for (const limit of result.limits.slice(1)) {
      const exactHz = butterworthFrequencyAt(referenceDb - limit.dropDb);
      expect(Math.abs(foundHz(limit.lower) / exactHz - 1)).toBeLessThan(2e-4);
      // The reference is at the top of the data: nothing above it falls 3 dB.
      expect(limit.upper).toEqual({ status: 'beyond_measured_range', measuredEdgeHz: 12800 });
    }
  });

  it('finds the −6 dB point of a 1st-order low-pass at fc·√(10^0.6 − 1) (closed form)', () => {
    const cornerHz = 2000;
    const curve = sampledCurve((f) => -10 * Math.log10(1 + (f / cornerHz) ** 2), 20, 40960, 48);
    const result = bandLimits(curve, { reference: { kind: 'at_frequency', frequencyHz: 20 }, dropsDb: [6] });
    const referenceDb = -10 * Math.log10(1 + (20 / cornerHz) ** 2);
    const exactHz = cornerHz * Math.sqrt(10 ** ((6 - referenceDb) / 10) - 1);
    expect(Math.abs(foundHz(result.limits[0].upper) / exactHz - 1)).toBeLessThan(2e-4);
  });

  it('walks a piecewise 6 dB/octave curve to hand-computed crossings, and reports not-reached limits as such', () => {
    // Constructed: −12 dB at 100 Hz rising 6 dB/oct to 0 dB at 400 Hz, flat to 10 kHz, falling 6 dB/oct to −6 dB at 20 kHz.
    const curve = curveThrough([[100, -12], [400, 0], [10000, 0], [20000, -6]]);
    const result = bandLimits(curve, { reference: { kind: 'at_frequency', frequencyHz: 1000 } });
    const [three, six, ten] = result.limits;
    expect(foundHz(three.lower)).toBeCloseTo(400 * 2 ** -0.5, 9);
    expect(foundHz(three.upper)).toBeCloseTo(10000 * 2 ** 0.5, 6);
    expect(foundHz(six.lower)).toBeCloseTo(200, 9);
    expect(foundHz(ten.lower)).toBeCloseTo(100 * 2 ** (1 / 3), 9);
    // Touching the threshold at the last point is not a crossing below it; −10 dB is never reached above.
    expect(six.upper).toEqual({ status: 'beyond_measured_range', measuredEdgeHz: 20000 });
    expect(ten.upper).toEqual({ status: 'beyond_measured_range', measuredEdgeHz: 20000 });
  });

  it('reports "beyond measured range" (not the data edge) when the roll-off starts below the data', () => {
    const fromTwoHundred = sampledCurve(butterworthDb, 200, 12800, 48);
    const result = bandLimits(fromTwoHundred, { reference: { kind: 'at_frequency', frequencyHz: 1000 }, dropsDb: [10] });
    expect(result.limits[0].lower).toEqual({ status: 'beyond_measured_range', measuredEdgeHz: 200 });
  });

  it('steps over dips narrower than the stated width (IEC 60268-5 style, 1/9 octave, from memory)', () => {
    // Constructed: a −15 dB dip at 5 kHz spanning ±0.04 octave (its −10 dB width is 0.0267 octave), then a
    // 12 dB/octave roll-off above 10 kHz reaching −10 dB at 10 kHz·2^(10/12).
    const curve = curveThrough([
      [20, 0],
      [5000 * 2 ** -0.04, 0],
      [5000, -15],
      [5000 * 2 ** 0.04, 0],
      [10000, 0],
      [20000, -12],
    ]);
    const reference = { kind: 'at_frequency' as const, frequencyHz: 1000 };
    const strict = bandLimits(curve, { reference, dropsDb: [10] });
    expect(foundHz(strict.limits[0].upper)).toBeCloseTo(5000 * 2 ** (-0.04 + (0.04 * 10) / 15), 6);
    const lenient = bandLimits(curve, { reference, dropsDb: [10], ignoreExcursionsNarrowerThanOctaves: 1 / 9 });
    expect(foundHz(lenient.limits[0].upper)).toBeCloseTo(10000 * 2 ** (10 / 12), 6);
    expect(lenient.ignoredExcursionsNarrowerThanOctaves).toBeCloseTo(1 / 9, 15);
    // A dip wider than the stated width still counts.
    const wide = bandLimits(curve, { reference, dropsDb: [10], ignoreExcursionsNarrowerThanOctaves: 0.02 });
    expect(foundHz(wide.limits[0].upper)).toBeCloseTo(foundHz(strict.limits[0].upper), 9);
  });

  it('flags a reference band whose edge already lies below the threshold', () => {
    const curve = curveThrough([[100, -20], [300, -20], [310, 0], [3000, 0], [5000, 0]]);
    const result = bandLimits(curve, {
      reference: { kind: 'band_mean', fromHz: 300, toHz: 3000, average: 'power' },
      dropsDb: [10],
    });
    expect(result.limits[0].lower).toEqual({ status: 'outside_at_reference_band', atHz: 300 });
    expect(result.limits[0].upper.status).toBe('beyond_measured_range');
  });
});
