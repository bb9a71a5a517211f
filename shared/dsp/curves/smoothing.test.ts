import { describe, expect, it } from 'vitest';
import { EngineError } from '../errors';
import type { LinearSpectrum } from './curve';
import { logFrequencyGrid } from './grid';
import { smoothCurve, smoothSpectrum } from './smoothing';
import { sampledCurve as logSampledCurve } from './test-curves';

const BIN_HZ = 48000 / 524288;

function spectrumFrom(power: (bin: number) => number, bins = 262145): LinearSpectrum {
  const re = new Float64Array(bins);
  const im = new Float64Array(bins);
  for (let k = 0; k < bins; k++) re[k] = Math.sqrt(power(k));
  return { re, im, binSpacingHz: BIN_HZ };
}

/** Mean of P·W over a window in ln f for P = e^(x·t), t ∈ [−1, 1]: rectangular sinh(x)/x; Hann sinh(x)·π²/(x(x²+π²)). */
function slopeGainDb(x: number, window: 'rectangular' | 'hann'): number {
  const mean = window === 'rectangular' ? Math.sinh(x) / x : (Math.sinh(x) * Math.PI ** 2) / (x * (x * x + Math.PI ** 2));
  return 10 * Math.log10(mean);
}

describe('fractional-octave smoothing', () => {
  const grid = logFrequencyGrid({ pointsPerOctave: 12, startHz: 20, stopHz: 20000 });

  it('leaves a constant spectrum unchanged, every fraction, window and averaging (closed form)', () => {
    const spectrum = spectrumFrom(() => 0.25, 4097);
    spectrum.re.fill(0.3);
    spectrum.im.fill(0.4);
    const expectedDb = 20 * Math.log10(0.5);
    for (const octaveFraction of ['none', 1, 3, 6, 48] as const) {
      for (const window of ['hann', 'rectangular'] as const) {
        for (const averaging of ['power', 'complex'] as const) {
          const out = smoothSpectrum(spectrum, grid.filter((f) => f < 180), { octaveFraction, window, averaging });
          for (const level of out.magnitudeDb) expect(level).toBeCloseTo(expectedDb, 10);
          if (averaging === 'complex') for (const phase of out.phaseDeg!) expect(phase).toBeCloseTo((Math.atan2(0.4, 0.3) * 180) / Math.PI, 10);
        }
      }
    }
  });

  it('leaves a constant log-sampled curve unchanged (closed form)', () => {
    const curve = logSampledCurve(() => 87.5, 20, 20000, 48);
    const out = smoothCurve(curve, { octaveFraction: 3 });
    for (const level of out.magnitudeDb) expect(level).toBeCloseTo(87.5, 11);
  });

  it('power-smooths a single-bin notch to the hand-computed value', () => {
    // Constructed: |H|² = 1 except 0 at bin m; power is linear in f between bins, so the notch removes a triangle
    // whose 1/f-weighted area is D = (m+1)·ln((m+1)/m) − (m−1)·ln(m/(m−1)); a rectangular 1/3-octave window over ln f
    // covering it gives 1 − D/(ln 2 / 3).
    const m = 1000;
    const spectrum = spectrumFrom((k) => (k === m ? 0 : 1), 8193);
    const out = smoothSpectrum(spectrum, Float64Array.of(m * BIN_HZ), { octaveFraction: 3, window: 'rectangular' });
    const deficit = (m + 1) * Math.log((m + 1) / m) - (m - 1) * Math.log(m / (m - 1));
    const expected = 10 * Math.log10(1 - deficit / (Math.LN2 / 3));
    expect(out.magnitudeDb[0]).toBeCloseTo(expected, 10);
    expect(expected).toBeCloseTo(-0.01887, 4);
  });

  it('1/3-octave power smoothing of a dB-linear slope adds 10·log10(sinh x / x) (closed form)', () => {
    // L = s·log2(f/1 kHz); P = e^(β·ln f) with β = s·ln10/(10·ln2); the window spans ln f ± ln2/6, so x = β·ln2/6.
    const slopeDbPerOctave = 12;
    const beta = (slopeDbPerOctave * Math.LN10) / (10 * Math.LN2);
    const x = (beta * Math.LN2) / 6;
    const level = (f: number) => slopeDbPerOctave * Math.log2(f / 1000);
    const curve = logSampledCurve(level, 20, 20000, 24);
    const out = smoothCurve(curve, { octaveFraction: 3, window: 'rectangular' }, Float64Array.of(100, 1000, 5000));
    const gain = slopeGainDb(x, 'rectangular');
    expect(gain).toBeCloseTo(0.1525, 3);
    out.magnitudeDb.forEach((smoothed, i) => expect(smoothed - level(out.frequencyHz[i])).toBeCloseTo(gain, 10));

    // The same slope as linear FFT bins (power linear in f between bins: exact to the bin interpolation).
    const spectrum = spectrumFrom((k) => (k === 0 ? 0 : (k * BIN_HZ / 1000) ** (slopeDbPerOctave / (10 * Math.log10(2)))));
    const fromBins = smoothSpectrum(spectrum, Float64Array.of(1000, 5000), { octaveFraction: 3, window: 'rectangular' });
    fromBins.magnitudeDb.forEach((smoothed, i) => expect(smoothed - level(fromBins.frequencyHz[i])).toBeCloseTo(gain, 6));
  });

  it('the variance-matched 16-sub-band Hann window follows the exact Hann mean on a slope (closed form)', () => {
    // Exact Hann mean of e^(x·t): sinh(x)·π²/(x·(x² + π²)); 24 dB/octave slope.
    const slopeDbPerOctave = 24;
    const beta = (slopeDbPerOctave * Math.LN10) / (10 * Math.LN2);
    const level = (f: number) => slopeDbPerOctave * Math.log2(f / 1000);
    const curve = logSampledCurve(level, 20, 20000, 96);
    const toleranceDb = { 1: 0.005, 3: 1e-4, 6: 1e-5 } as const;
    for (const octaveFraction of [1, 3, 6] as const) {
      const x = (beta * Math.LN2) / (2 * octaveFraction);
      const out = smoothCurve(curve, { octaveFraction, window: 'hann' }, Float64Array.of(1000));
      expect(Math.abs(out.magnitudeDb[0] - level(1000) - slopeGainDb(x, 'hann'))).toBeLessThan(toleranceDb[octaveFraction]);
    }
  });

  it('interpolates between bins where a band is narrower than one bin (closed form)', () => {
    // Constructed: |H|² = k at bin k, linear in f; the 1/48-octave window around 1.3 bins lies inside [1, 2] bins,
    // and the ln f mean of a linear P = f over [a, b] is (b − a)/ln(b/a).
    const spectrum = spectrumFrom((k) => k, 64);
    const centre = 1.3;
    const a = centre * 2 ** (-1 / 96);
    const b = centre * 2 ** (1 / 96);
    const out = smoothSpectrum(spectrum, Float64Array.of(centre * BIN_HZ), { octaveFraction: 48, window: 'rectangular' });
    expect(out.magnitudeDb[0]).toBeCloseTo(10 * Math.log10((b - a) / Math.log(b / a)), 12);
    const plain = smoothSpectrum(spectrum, Float64Array.of(centre * BIN_HZ), { octaveFraction: 'none' });
    expect(plain.magnitudeDb[0]).toBeCloseTo(10 * Math.log10(1.3), 12);
  });

  it('keeps its precision 140 dB below the rest of the spectrum (constructed)', () => {
    // Power 1 below 1 kHz, 1e-14 above 2 kHz: octave-restarted prefix sums keep the quiet band exact.
    const spectrum = spectrumFrom((k) => (k * BIN_HZ < 1000 ? 1 : k * BIN_HZ > 2000 ? 1e-14 : 1e-7));
    const out = smoothSpectrum(spectrum, Float64Array.of(10000, 20000), { octaveFraction: 6 });
    for (const level of out.magnitudeDb) expect(level).toBeCloseTo(-140, 8);
  });

  it('gives the same result from linear bins and from a log-sampled copy of the same response (constructed)', () => {
    // A resonance |H|² = 1/((1 − r²)² + (r/Q)²), r = f/500 Hz, Q = 5, 1/6 octave Hann.
    const power = (f: number) => {
      const r = f / 500;
      return 1 / ((1 - r * r) ** 2 + (r / 5) ** 2);
    };
    const spectrum = spectrumFrom((k) => power(k * BIN_HZ));
    const curve = logSampledCurve((f) => 10 * Math.log10(power(f)), 10, 24000, 384);
    const at = Float64Array.of(100, 400, 500, 630, 4000);
    const fromBins = smoothSpectrum(spectrum, at, { octaveFraction: 6 });
    const fromCurve = smoothCurve(curve, { octaveFraction: 6 }, at);
    fromBins.magnitudeDb.forEach((level, i) => expect(level).toBeCloseTo(fromCurve.magnitudeDb[i], 3));
  });

  it('complex smoothing keeps a constant phase and returns it (closed form)', () => {
    const curve = logSampledCurve(() => 6, 100, 10000, 24);
    curve.phaseDeg = curve.frequencyHz.map(() => -45);
    const out = smoothCurve(curve, { octaveFraction: 6, averaging: 'complex' });
    out.magnitudeDb.forEach((level) => expect(level).toBeCloseTo(6, 10));
    out.phaseDeg!.forEach((phase) => expect(phase).toBeCloseTo(-45, 10));
    expect(smoothCurve(curve, { octaveFraction: 6 }).phaseDeg).toBeUndefined();
  });

  it('rejects bad options and inputs with EngineErrors', () => {
    const spectrum = spectrumFrom(() => 1, 1025);
    const code = (run: () => unknown) => {
      try {
        run();
      } catch (error) {
        expect(error).toBeInstanceOf(EngineError);
        return (error as EngineError).code;
      }
      return 'no error';
    };
    for (const octaveFraction of [0, 49, 1.5]) {
      expect(code(() => smoothSpectrum(spectrum, Float64Array.of(100), { octaveFraction }))).toBe('smoothing_fraction_invalid');
    }
    expect(code(() => smoothSpectrum(spectrum, Float64Array.of(30000), { octaveFraction: 3 }))).toBe('grid_outside_data');
    expect(code(() => smoothSpectrum(spectrum, Float64Array.of(0), { octaveFraction: 3 }))).toBe('grid_outside_data');
    spectrum.re[7] = Number.NaN;
    expect(code(() => smoothSpectrum(spectrum, Float64Array.of(50), { octaveFraction: 3 }))).toBe('spectrum_value_not_finite');
    const curve = logSampledCurve(() => 0, 100, 1000, 3);
    expect(code(() => smoothCurve(curve, { octaveFraction: 3, averaging: 'complex' }))).toBe('phase_required');
    expect(code(() => smoothCurve(curve, { octaveFraction: 3 }, Float64Array.of(50)))).toBe('grid_outside_data');
  });
});
