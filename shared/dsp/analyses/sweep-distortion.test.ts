import { describe, expect, it } from 'vitest';
import { chebyshev, polynomial, polynomialHarmonics, whiteNoise } from '../distortion/test-signals';
import { isEngineError } from '../errors';
import { designSynchronizedSweep, renderSweep, type SweepDesign } from '../stimuli/sweep';
import { analyzeSweepResponseAndDistortion } from './response-and-distortion';
import { analyzeSweepDistortion, type SweepDistortionResult } from './sweep-distortion';

const FS = 48_000;
const design = designSynchronizedSweep({ startHz: 20, stopHz: 20_000, approximateDurationSeconds: 4, sampleRateHz: FS, levelDbfs: -6 });
const sweep = renderSweep(design);
const amplitude = design.amplitude; // the polynomial acts on the sweep's instantaneous amplitude

function capture(...channels: Float64Array[]) {
  return { sampleRateHz: FS, channels };
}

function orderPercent(result: SweepDistortionResult, order: number): (number | null)[] {
  const curve = result.curves.harmonicDistortion.orders.find((o) => o.order === order);
  if (!curve) throw new Error(`order ${order} missing`);
  return curve.percent;
}

function eachIn(result: { curves: { harmonicDistortion: { frequencyHz: number[] } } }, lowHz: number, highHz: number, check: (index: number, frequencyHz: number) => void) {
  let count = 0;
  result.curves.harmonicDistortion.frequencyHz.forEach((f, i) => {
    if (f >= lowHz && f <= highHz) {
      check(i, f);
      count++;
    }
  });
  expect(count).toBeGreaterThan(10);
}

function errorDb(measuredPercent: number | null, truthRatio: number): number {
  if (measuredPercent === null) return Number.POSITIVE_INFINITY;
  return 20 * Math.log10(measuredPercent / 100 / truthRatio);
}

describe('sweep distortion: memoryless polynomial', () => {
  // Trigonometric power identities: y = x + a2·x² + a3·x³ on A·sin φ gives HD2 = (a2·A/2)/(1 + 3·a3·A²/4) and
  // HD3 = (a3·A²/4)/(1 + 3·a3·A²/4), whatever φ(t) is, so they hold along the sweep (A = its amplitude).
  const truth = polynomialHarmonics(amplitude, 0.2, 0.1);
  const result = analyzeSweepDistortion(capture(polynomial(sweep, 0.2, 0.1)), design, { includePhase: true });

  it('recovers HD2 and HD3 within ±0.2 dB over 200 Hz–5 kHz, read at n·f0', () => {
    eachIn(result, 200, 5000, (i) => {
      expect(Math.abs(errorDb(orderPercent(result, 2)[i], truth.hd2))).toBeLessThan(0.2);
      expect(Math.abs(errorDb(orderPercent(result, 3)[i], truth.hd3))).toBeLessThan(0.2);
      // THD_F = √(HD2² + HD3²) here; THD_R = THD_F/√(1 + THD_F²) (definitions).
      const thdF = Math.hypot(truth.hd2, truth.hd3);
      expect(Math.abs(errorDb(result.curves.harmonicDistortion.thdFPercent[i], thdF))).toBeLessThan(0.2);
      expect(Math.abs(errorDb(result.curves.harmonicDistortion.thdRPercent[i], thdF / Math.sqrt(1 + thdF * thdF)))).toBeLessThan(0.2);
    });
  });

  it('gives the harmonics the phase of the trigonometric identities (synchronized sweep, Novak et al., JAES 63(10) 2015)', () => {
    // sin²φ = (1 − cos 2φ)/2 → the 2nd harmonic is −cos 2φ = sin(2φ − 90°); sin³φ = (3 sin φ − sin 3φ)/4 → 180°.
    const phase2 = result.curves.harmonicDistortion.orders[0].phaseDeg!;
    const phase3 = result.curves.harmonicDistortion.orders[1].phaseDeg!;
    eachIn(result, 300, 3000, (i) => {
      expect(Math.abs(phase2[i]! + 90)).toBeLessThan(2);
      expect(Math.abs(Math.abs(phase3[i]!) - 180)).toBeLessThan(2);
    });
  });

  it('drops orders above the band limit and says which it used', () => {
    const { frequencyHz, ordersUsed, highestOrderUsed } = result.curves.harmonicDistortion;
    frequencyHz.forEach((f, i) => {
      // Below the sweep's start (the grid's first point, 19.95 Hz) there was no excitation: no orders at all.
      const expected = f < 20 ? 0 : Math.min(10, Math.floor(20_000 / f));
      expect(highestOrderUsed[i]).toBe(expected >= 2 ? expected : 0);
      expect(ordersUsed[i]).toBe(Math.max(0, expected - 1));
    });
    expect(result.warnings.map((w) => w.code)).toContain('harmonics_beyond_band_dropped');
  });

  it('states both THD forms and the headline', () => {
    expect(result.conventions.thdDefinition).toContain('THD_F');
    expect(result.conventions.thdDefinition).toContain('THD_R');
    expect(result.conventions.thdHeadline).toBe('thd_f');
    const at1k = result.figures.thdF.atReference!;
    expect(Math.abs(errorDb(at1k.valuePercent, Math.hypot(truth.hd2, truth.hd3)))).toBeLessThan(0.2);
  });
});

describe('sweep distortion: Chebyshev injection of high orders', () => {
  // T_n(cos θ) = cos(nθ) (standard identity): x + A·h·T_n(x/A) on a sweep of amplitude A adds exactly an n-th
  // harmonic of relative amplitude h.
  const injected: [number, number][] = [
    [12, 0.002],
    [20, 0.001],
  ];
  const y = sweep.map((v) => v + injected.reduce((sum, [order, h]) => sum + amplitude * h * chebyshev(order, v / amplitude), 0));
  const result = analyzeSweepDistortion(capture(y), design, { maxOrder: 20 });

  it('reads HD12 and HD20 within ±0.3 dB over 100–900 Hz', () => {
    eachIn(result, 100, 900, (i) => {
      for (const [order, h] of injected) expect(Math.abs(errorDb(orderPercent(result, order)[i], h))).toBeLessThan(0.3);
    });
  });

  it('gives the screening energy √(Σ|H_n(n f0)|²)/|H_1(f0)| of orders 10–35 and counts the orders used', () => {
    const screening = result.curves.screening!;
    // From 200 Hz: about 2.6× the lowest trustworthy frequency of order 35 (its window is 13 ms on this 4 s sweep);
    // below that, the empty orders' short windows leak enough to add a few tenths of a dB.
    eachIn(result, 200, 900, (i, f) => {
      expect(Math.abs(errorDb(screening.percent[i], Math.hypot(0.002, 0.001)))).toBeLessThan(0.3);
      expect(screening.ordersUsed[i]).toBe(Math.max(0, Math.min(35, Math.floor(20_000 / f)) - 9));
    });
    expect(result.conventions.screening).toContain('√(Σ');
    const windows = screening.orderWindows;
    // Later orders get shorter windows: L·ln(n/(n−1)) shrinks with n.
    for (let i = 1; i < windows.length; i++) expect(windows[i].windowPostPeakSeconds).toBeLessThan(windows[i - 1].windowPostPeakSeconds);
  });
});

describe('sweep distortion: the axis check on a Hammerstein system', () => {
  // y = x + 0.1·LP(x²) + 0.02·x³ with LP a first-order bilinear low-pass at 1 kHz, |LP(f)| = 1/√(1 + (tan(πf/fs)/
  // tan(πfc/fs))²) (bilinear transform of 1/(1 + s/ωc), pre-warped at fc). For x = A·sin φ the 2nd harmonic
  // leaves the squarer at 2·f0, so the stepped-tone truth is HD2(f0) = 0.05·A·|LP(2·f0)| / (1 + 0.015·A²);
  // the wrong-axis reading |H2(f0)|/|H1(f0)| would give 0.05·A·|LP(f0)| / (1 + 0.015·A²).
  const fc = 1000;
  const omega = Math.tan((Math.PI * fc) / FS);
  const lowPassGain = (f: number) => 1 / Math.sqrt(1 + (Math.tan((Math.PI * f) / FS) / omega) ** 2);
  const k = omega / (1 + omega);
  const a1 = (omega - 1) / (omega + 1);
  const squared = sweep.map((v) => v * v);
  const filtered = new Float64Array(squared.length);
  for (let n = 0; n < squared.length; n++) {
    filtered[n] = k * (squared[n] + (n > 0 ? squared[n - 1] : 0)) - (n > 0 ? a1 * filtered[n - 1] : 0);
  }
  const y = sweep.map((v, n) => v + 0.1 * filtered[n] + 0.02 * v * v * v);
  const result = analyzeSweepDistortion(capture(y), design, { maxOrder: 3, screening: false });
  const fundamental = 1 + 0.015 * amplitude * amplitude;
  const truth = (f0: number) => (0.05 * amplitude * lowPassGain(2 * f0)) / fundamental;
  const wrongAxis = (f0: number) => (0.05 * amplitude * lowPassGain(f0)) / fundamental;

  it('matches the stepped-tone truth at n·f0 and not the wrong-axis reading', () => {
    const grid = result.curves.harmonicDistortion.frequencyHz;
    const index = grid.findIndex((f) => Math.abs(f - 299.4) < 1); // 1/48-octave base-10 point nearest 300 Hz
    const f0 = grid[index];
    const measured = orderPercent(result, 2)[index]!;
    expect(Math.abs(errorDb(measured, truth(f0)))).toBeLessThan(0.1);
    // The readings differ by about 1 dB at 300 Hz, and the analysis is clearly on the right one.
    expect(Math.abs(20 * Math.log10(truth(f0) / wrongAxis(f0)))).toBeGreaterThan(0.9);
    expect(Math.abs(errorDb(measured, wrongAxis(f0)))).toBeGreaterThan(0.8);
  });

  it('tracks the truth over 200 Hz–2 kHz within ±0.2 dB', () => {
    eachIn(result, 200, 2000, (i, f) => {
      expect(Math.abs(errorDb(orderPercent(result, 2)[i], truth(f)))).toBeLessThan(0.2);
    });
  });
});

describe('sweep distortion: noise floor', () => {
  // Deconvolution scales capture noise of density s(f) by |G(f)| = 2√(f/L)/(fs·A), so a window w over the IR
  // carries E|N(f)|² = Σw²·s(f)·|G(f)|² (Parseval; Novak et al. 2015 for G). The noise-only order 5 of a
  // linear system must read about that floor, and be reported as a bound.
  const noiseRms = 1e-4;
  const noisy = (y: Float64Array, seed: number) => {
    const noise = whiteNoise(y.length, noiseRms, seed);
    return y.map((v, i) => v + noise[i]);
  };

  it('reports orders with no content as upper bounds at about the predicted floor', () => {
    const result = analyzeSweepDistortion(capture(noisy(sweep, 3)), design, { maxOrder: 5, screening: false });
    const fifth = result.curves.harmonicDistortion.orders.find((o) => o.order === 5)!;
    let sumRatioSquared = 0;
    let count = 0;
    eachIn(result, 100, 3000, (i) => {
      expect(fifth.isUpperBound[i]).toBe(true);
      expect(result.curves.harmonicDistortion.thdIsUpperBound[i]).toBe(true);
      // A bound is measured + floor; the noise-only measurement averages to the floor itself.
      const measured = fifth.percent[i]! - fifth.floorPercent[i]!;
      sumRatioSquared += (measured / fifth.floorPercent[i]!) ** 2;
      count++;
    });
    expect(Math.abs(10 * Math.log10(sumRatioSquared / count))).toBeLessThan(1.5);
    expect(result.warnings.map((w) => w.code)).toContain('harmonic_below_noise_floor');
  });

  it('keeps a strong harmonic as a measured value', () => {
    const truth = polynomialHarmonics(amplitude, 0.2, 0);
    const result = analyzeSweepDistortion(capture(noisy(polynomial(sweep, 0.2, 0), 4)), design, { maxOrder: 3, screening: false });
    const second = result.curves.harmonicDistortion.orders[0];
    eachIn(result, 200, 5000, (i) => {
      expect(second.isUpperBound[i]).toBe(false);
      expect(Math.abs(errorDb(second.percent[i], truth.hd2))).toBeLessThan(0.2);
    });
  });
});

describe('response and distortion from one deconvolution', () => {
  it('reuses the response deconvolution and reads distortion on the response grid', () => {
    const truth = polynomialHarmonics(amplitude, 0.2, 0.1);
    const result = analyzeSweepResponseAndDistortion(capture(polynomial(sweep, 0.2, 0.1)), design, { distortion: { screening: false } });
    expect(result.kind).toBe('response_and_distortion');
    expect(result.conventions.distortionDeconvolution).toContain('reused');
    expect(result.curves.harmonicDistortion.frequencyHz).toEqual(result.curves.frequencyHz);
    const second = result.curves.harmonicDistortion.orders[0];
    eachIn(result, 200, 5000, (i) => expect(Math.abs(errorDb(second.percent[i], truth.hd2))).toBeLessThan(0.2));
  });
});

describe('sweep distortion: bad inputs', () => {
  const good = capture(sweep);
  const attempts: [string, () => unknown][] = [
    ['no capture', () => analyzeSweepDistortion(null as never, design)],
    ['no stimulus', () => analyzeSweepDistortion(good, null as never)],
    ['K too large', () => analyzeSweepDistortion(good, design, { maxOrder: 1000 })],
    ['K not an integer', () => analyzeSweepDistortion(good, design, { maxOrder: 2.5 })],
    ['unknown option', () => analyzeSweepDistortion(good, design, { maxOrdr: 5 } as never)],
    ['channel out of range', () => analyzeSweepDistortion(good, design, { measurementChannel: 3 })],
    ['screening reversed', () => analyzeSweepDistortion(good, design, { screening: { fromOrder: 20, toOrder: 10 } })],
    ['bad smoothing', () => analyzeSweepDistortion(good, design, { octaveFraction: 0 })],
    ['bad margin', () => analyzeSweepDistortion(good, design, { marginDb: -3 })],
    ['bad headline', () => analyzeSweepDistortion(good, design, { thdHeadline: 'thd' as never })],
    ['empty grid', () => analyzeSweepDistortion(good, design, { grid: { startHz: 5000, stopHz: 100 } })],
    ['NaN sample', () => analyzeSweepDistortion(capture(Float64Array.from([...sweep.subarray(0, 1000), Number.NaN])), design)],
    ['capture too short', () => analyzeSweepDistortion(capture(new Float64Array(100)), design as SweepDesign)],
  ];
  for (const [label, attempt] of attempts) {
    it(`throws EngineError: ${label}`, () => {
      let caught: unknown;
      try {
        attempt();
      } catch (error) {
        caught = error;
      }
      expect(isEngineError(caught)).toBe(true);
    });
  }
});
