import { describe, expect, it } from 'vitest';
import { aWeightingDb } from '../../units/weighting';
import { WINDOW_DEFINITIONS } from '../windows';
import { chebyshev, cosine, fourierSeries, polynomial, polynomialHarmonics, whiteNoise } from './test-signals';
import { thdRFromThdF } from './thd';
import { analyzeToneRecord, type ToneRecordOptions } from './tone-record';

const FS = 48_000;

function options(overrides: Partial<ToneRecordOptions> = {}): ToneRecordOptions {
  return {
    method: 'windowed',
    window: 'blackman_harris_7',
    maxOrder: 10,
    upperLimitHz: 20_000,
    marginDb: 10,
    thdPlusNoiseBand: { lowHz: 20, highHz: 20_000, weighting: 'none' },
    screeningOrders: null,
    ...overrides,
  };
}

function hd(analysis: ReturnType<typeof analyzeToneRecord>, order: number): number {
  const harmonic = analysis.harmonics.find((h) => h.order === order);
  if (!harmonic) throw new Error(`order ${order} missing`);
  return harmonic.rms / analysis.fundamentalRmsForRatios;
}

const CASES = [
  { label: 'coherent, 1000 Hz on a bin', method: 'coherent' as const, window: 'blackman_harris_7' as const, frequencyHz: 1000, length: 48_000 },
  { label: 'windowed BH-7, 997 Hz (AES17 test frequency)', method: 'windowed' as const, window: 'blackman_harris_7' as const, frequencyHz: 997, length: 48_000 },
  { label: 'windowed BH-4, 123.4 Hz, 0.25 s', method: 'windowed' as const, window: 'blackman_harris_4' as const, frequencyHz: 123.4, length: 12_000 },
];

describe('tone distortion: memoryless polynomial', () => {
  // Trigonometric power identities: y = x + a2·x² + a3·x³ on A·cos θ gives HD2 = (a2·A/2)/(1 + 3·a3·A²/4) and
  // HD3 = (a3·A²/4)/(1 + 3·a3·A²/4). Example A = 0.5, a2 = 0.2, a3 = 0.1 → HD2 = 4.908 %, HD3 = 0.6135 %.
  const amplitude = 0.5;
  const truth = polynomialHarmonics(amplitude, 0.2, 0.1);
  for (const c of CASES) {
    it(`recovers HD2 and HD3 within 1 % (${c.label})`, () => {
      const y = polynomial(cosine(c.length, c.frequencyHz, FS, amplitude, 0.3), 0.2, 0.1);
      const analysis = analyzeToneRecord(y, FS, options({ method: c.method, window: c.window, toneFrequencyHz: c.method === 'coherent' ? c.frequencyHz : undefined }));
      expect(truth.hd2).toBeCloseTo(0.04908, 5);
      expect(truth.hd3).toBeCloseTo(0.006135, 6);
      expect(Math.abs(hd(analysis, 2) / truth.hd2 - 1)).toBeLessThan(0.01);
      expect(Math.abs(hd(analysis, 3) / truth.hd3 - 1)).toBeLessThan(0.01);
      expect(Math.abs(analysis.fundamentalHz - c.frequencyHz)).toBeLessThan(1e-3);
      // Fundamental amplitude a1·A + 3/4·a3·A³ = 0.509375 (cos³ identity).
      expect(Math.abs(analysis.fundamentalPeak / 0.509375 - 1)).toBeLessThan(1e-4);
    });
  }
});

describe('tone distortion: Chebyshev injection', () => {
  // T_n(cos θ) = cos(nθ) (standard identity): x + h·A·T_n(x/A) adds exactly an n-th harmonic of amplitude h·A.
  it('reads exact harmonics of order 2, 7, 12 and 20 and the screening energy of orders 10–35', () => {
    const amplitude = 0.5;
    const injected = new Map([
      [2, 0.01],
      [7, 0.003],
      [12, 0.002],
      [20, 0.0005],
    ]);
    const x = cosine(48_000, 500, FS, amplitude);
    const y = x.map((v) => v + [...injected].reduce((sum, [order, h]) => sum + h * amplitude * chebyshev(order, v / amplitude), 0));
    const analysis = analyzeToneRecord(y, FS, options({ maxOrder: 20, screeningOrders: { fromOrder: 10, toOrder: 35 } }));
    for (const [order, h] of injected) expect(Math.abs(hd(analysis, order) / h - 1)).toBeLessThan(1e-4);
    const screening = analysis.screening!;
    expect(screening.ordersUsed).toBe(26); // 35·500 Hz = 17.5 kHz, all below 20 kHz
    expect(Math.abs(screening.ratio / Math.hypot(0.002, 0.0005) - 1)).toBeLessThan(1e-4);
  });
});

describe('tone distortion: band-limited square, triangle and sawtooth', () => {
  // Fourier series (standard): square b_n = 1/n (odd n), triangle b_n = ±1/n² (odd n), sawtooth b_n = ±1/n (all n).
  // THD_F of the series cut at K is √(Σ_{n=2..K} b_n²)/b_1; K = 5 → 0.38873 / 0.118092 / 0.68089, K = 10 →
  // 0.42879 / 0.120477 / 0.74146. Infinite limits √(π²/8−1), √(π⁴/96−1), √(π²/6−1) bound them from above.
  const waves = [
    { name: 'square', coefficient: (n: number) => (n % 2 === 1 ? 1 / n : 0), limit: Math.sqrt(Math.PI ** 2 / 8 - 1) },
    { name: 'triangle', coefficient: (n: number) => (n % 2 === 1 ? (n % 4 === 1 ? 1 : -1) / (n * n) : 0), limit: Math.sqrt(Math.PI ** 4 / 96 - 1) },
    { name: 'sawtooth', coefficient: (n: number) => (n % 2 === 1 ? 1 : -1) / n, limit: Math.sqrt(Math.PI ** 2 / 6 - 1) },
  ];
  const published: Record<string, Record<number, number>> = {
    square: { 5: 0.38873, 10: 0.42879 },
    triangle: { 5: 0.118092, 10: 0.120477 },
    sawtooth: { 5: 0.68089, 10: 0.74146 },
  };
  for (const wave of waves) {
    for (const maxOrder of [5, 10]) {
      for (const method of ['coherent', 'windowed'] as const) {
        it(`${wave.name}, K = ${maxOrder}, ${method}`, () => {
          let partial = 0;
          for (let n = 2; n <= maxOrder; n++) partial += wave.coefficient(n) ** 2;
          const expectedThdF = Math.sqrt(partial) / wave.coefficient(1);
          expect(expectedThdF).toBeCloseTo(published[wave.name][maxOrder], 4);
          expect(expectedThdF).toBeLessThan(wave.limit);
          const frequencyHz = method === 'coherent' ? 1000 : 1001.7;
          const signal = fourierSeries(48_000, frequencyHz, FS, (n) => 0.25 * wave.coefficient(n), maxOrder);
          const analysis = analyzeToneRecord(signal, FS, options({ method, maxOrder, toneFrequencyHz: method === 'coherent' ? frequencyHz : undefined }));
          const thdF = analysis.thd.thdF.valuePercent / 100;
          const thdR = analysis.thd.thdR.valuePercent / 100;
          expect(Math.abs(thdF / expectedThdF - 1)).toBeLessThan(0.005);
          expect(Math.abs(thdR / thdRFromThdF(expectedThdF) - 1)).toBeLessThan(0.005);
          expect(Math.abs(thdR - thdF / Math.sqrt(1 + thdF * thdF))).toBeLessThan(1e-12);
        });
      }
    }
  }
});

describe('tone distortion: noise floor', () => {
  // White noise of variance σ² puts σ²·2/N of RMS² into each one-sided bin (Parseval), so a harmonic measured over
  // its window's main lobe of L = 2h+1 bins competes with 2·L·σ²/N of noise (statistics, standard).
  const length = 48_000;
  const noiseRms = 1e-4;
  // Coherent analysis reads one bin; the windowed one sums the BH-7 main lobe.
  const lobeBins = { windowed: 2 * WINDOW_DEFINITIONS.blackman_harris_7.mainLobeHalfWidthBins + 1, coherent: 1 };
  const noiseInBandwidth = (method: keyof typeof lobeBins) => Math.sqrt((2 * lobeBins[method] * noiseRms ** 2) / length);

  function capture(aboveNoiseDb: number, seed: number, method: keyof typeof lobeBins = 'windowed') {
    const harmonicRms = noiseInBandwidth(method) * 10 ** (aboveNoiseDb / 20);
    const tone = cosine(length, 1000, FS, 0.5);
    const third = cosine(length, 3000, FS, harmonicRms * Math.SQRT2, 1.1);
    const noise = whiteNoise(length, noiseRms, seed);
    return { signal: tone.map((v, n) => v + third[n] + noise[n]), hd3: harmonicRms / (0.5 / Math.SQRT2) };
  }

  for (const method of ['windowed', 'coherent'] as const) {
    it(`reports a harmonic 5 dB above the noise as a bound and one 30 dB above as a value (${method})`, () => {
      const toneOptions = options({ method, toneFrequencyHz: method === 'coherent' ? 1000 : undefined });
      const weak = capture(5, 11, method);
      const weakAnalysis = analyzeToneRecord(weak.signal, FS, toneOptions);
      const weakThird = weakAnalysis.harmonics.find((h) => h.order === 3)!;
      expect(weakThird.isUpperBound).toBe(true);
      expect(weakThird.rms / weakAnalysis.fundamentalRmsForRatios).toBeGreaterThan(weak.hd3);
      expect(weakAnalysis.thd.thdF.isUpperBound).toBe(true);

      const strong = capture(30, 12, method);
      const strongAnalysis = analyzeToneRecord(strong.signal, FS, toneOptions);
      const strongThird = strongAnalysis.harmonics.find((h) => h.order === 3)!;
      expect(strongThird.isUpperBound).toBe(false);
      expect(Math.abs(20 * Math.log10(strongThird.rms / strongAnalysis.fundamentalRmsForRatios / strong.hd3))).toBeLessThan(0.5);
    });
  }

  it('takes the floor from a stimulus-off record when one is given', () => {
    const weak = capture(5, 21);
    const silent = whiteNoise(30_000, noiseRms, 22);
    const analysis = analyzeToneRecord(weak.signal, FS, options(), silent);
    const third = analysis.harmonics.find((h) => h.order === 3)!;
    expect(third.isUpperBound).toBe(true);
    // The floor read from the silent record agrees with the closed form within 1 dB.
    expect(Math.abs(20 * Math.log10(third.floorRms / noiseInBandwidth('windowed')))).toBeLessThan(1);
    expect(analysis.noiseFloorDescription).toContain('stimulus-off');
  });
});

describe('tone distortion: THD+N', () => {
  // White noise of RMS σ spreads evenly over 0…fs/2, so a band [f_lo, f_hi] holds σ²·(f_hi − f_lo)/(fs/2) of it;
  // with no harmonics, THD+N = R/√(V_1² + R²) and SINAD = 20·log10(V_1/R) (noise power ∝ bandwidth, closed form).
  const length = 96_000;
  const amplitude = 0.5;
  const noiseRms = 3e-3;
  const noise = whiteNoise(length, noiseRms, 5);
  const noisy = cosine(length, 997, FS, amplitude).map((v, n) => v + noise[n]);
  for (const band of [
    { lowHz: 20, highHz: 20_000 },
    { lowHz: 400, highHz: 8_000 },
  ]) {
    it(`matches the closed form within 0.2 dB in ${band.lowHz}–${band.highHz} Hz`, () => {
      const analysis = analyzeToneRecord(noisy, FS, options({ thdPlusNoiseBand: { ...band, weighting: 'none' } }));
      const v1 = amplitude / Math.SQRT2;
      const residual = noiseRms * Math.sqrt((band.highHz - band.lowHz) / (FS / 2));
      const expectedDb = 20 * Math.log10(residual / Math.hypot(v1, residual));
      const measuredDb = 20 * Math.log10(analysis.thdPlusNoise.ratio);
      expect(Math.abs(measuredDb - expectedDb)).toBeLessThan(0.2);
      expect(Math.abs(analysis.thdPlusNoise.sinadDb + measuredDb)).toBeLessThan(0.01);
    });
  }

  it('A-weighted residual of white noise matches σ²·∫|A(f)|²df/(fs/2) within 0.2 dB (IEC 61672-1 weighting)', () => {
    const analysis = analyzeToneRecord(noisy, FS, options({ thdPlusNoiseBand: { lowHz: 20, highHz: 20_000, weighting: 'a' } }));
    let integral = 0;
    for (let f = 20; f < 20_000; f += 1) integral += 10 ** (aWeightingDb(f + 0.5) / 10);
    const expectedResidual = noiseRms * Math.sqrt(integral / (FS / 2));
    expect(Math.abs(20 * Math.log10(analysis.thdPlusNoise.residualRms / expectedResidual))).toBeLessThan(0.2);
  });
});
