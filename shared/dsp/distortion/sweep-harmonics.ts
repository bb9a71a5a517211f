import type { OctaveFraction } from '../curves/curve';
import { harmonicSpectrum, readSpectrum } from './harmonic-spectra';
import { planHarmonicWindows, type HarmonicWindow } from './harmonic-windows';
import { classifyAgainstFloor } from './noise-floor';
import { densityAt, windowedNoiseAmplitude, type NoiseDensity } from './sweep-noise';

export interface SweepHarmonicsInput {
  buffer: Float64Array;
  sampleRateHz: number;
  rateConstantSeconds: number;
  /** Sweep peak amplitude re full scale (the deconvolution divided by it). */
  sweepAmplitude: number;
  /** τ_1, exact linear peak position, samples from t = 0. */
  linearPeakSamples: number;
  linearPostPeakSamples: number;
  prePeakSeconds: number;
  /** Fundamental-frequency grid. */
  gridHz: Float64Array;
  /** Orders ≥ 2 to read (ascending). */
  orders: readonly number[];
  /** min(Nyquist, sweep stop, stated limit): order n is read at f0 only where n·f0 ≤ this. */
  bandLimitHz: number;
  /** The sweep's [f1, f2]: no fundamental excitation outside, so no distortion figure there either. */
  sweepBandHz: [number, number];
  smoothing: OctaveFraction;
  withPhase: boolean;
  marginDb: number;
  noise: NoiseDensity | null;
}

/** HD_n(f0) = |H_n(n·f0)| / |H_1(f0)| on the fundamental axis; NaN where n·f0 is above the band limit. */
export interface OrderCurve {
  order: number;
  plan: HarmonicWindow;
  ratio: Float64Array;
  isUpperBound: Uint8Array;
  /** Expected noise in the same window, re |H_1(f0)|; NaN where unknown or dropped. */
  floorRatio: Float64Array;
  /** arg H_n(n·f0) in degrees, bulk delay τ_n removed; NaN where dropped. */
  phaseDeg: Float64Array | null;
}

export interface SweepHarmonics {
  linearPlan: HarmonicWindow;
  /** |H_1(f0)| on the grid, re the stimulus. */
  linearMagnitude: Float64Array;
  /** |H_1(f0)| over the expected noise in the linear window, dB; null without a noise estimate. */
  linearSignalToNoiseDb: Float64Array | null;
  orders: OrderCurve[];
}

/** Read the linear and every harmonic spectrum of one deconvolution buffer onto the fundamental grid. */
export function sweepHarmonics(input: SweepHarmonicsInput): SweepHarmonics {
  const { buffer, sampleRateHz: fs, gridHz, noise } = input;
  const design = { rateConstantSeconds: input.rateConstantSeconds, sampleRateHz: fs, amplitude: input.sweepAmplitude };
  const plans = planHarmonicWindows({
    linearPeakSamples: input.linearPeakSamples,
    sampleRateHz: fs,
    rateConstantSeconds: input.rateConstantSeconds,
    orders: input.orders,
    prePeakSeconds: input.prePeakSeconds,
    linearPostPeakSamples: input.linearPostPeakSamples,
  });
  const linearPlan = plans.get(1) as HarmonicWindow;
  const linearSpectrum = harmonicSpectrum(buffer, fs, linearPlan);
  const linearMagnitude = readSpectrum(linearSpectrum, gridHz, input.smoothing, false).magnitude;
  let linearSignalToNoiseDb: Float64Array | null = null;
  if (noise) {
    const floor = windowedNoiseAmplitude(densityAt(noise, gridHz), gridHz, linearSpectrum.windowSumSquares, design);
    linearSignalToNoiseDb = linearMagnitude.map((h1, i) => 20 * Math.log10(h1 / floor[i]));
  }
  const orders: OrderCurve[] = [];
  for (const order of input.orders) {
    const plan = plans.get(order) as HarmonicWindow;
    const inBand: number[] = [];
    for (let i = 0; i < gridHz.length; i++) {
      const f0 = gridHz[i];
      if (order * f0 <= input.bandLimitHz && f0 >= input.sweepBandHz[0] && f0 <= input.sweepBandHz[1]) inBand.push(i);
    }
    const ratio = new Float64Array(gridHz.length).fill(Number.NaN);
    const floorRatio = new Float64Array(gridHz.length).fill(Number.NaN);
    const isUpperBound = new Uint8Array(gridHz.length);
    const phaseDeg = input.withPhase ? new Float64Array(gridHz.length).fill(Number.NaN) : null;
    if (inBand.length > 0) {
      const harmonicHz = Float64Array.from(inBand, (i) => order * gridHz[i]);
      const spectrum = harmonicSpectrum(buffer, fs, plan);
      const reading = readSpectrum(spectrum, harmonicHz, input.smoothing, input.withPhase);
      const floor = noise ? windowedNoiseAmplitude(densityAt(noise, harmonicHz), harmonicHz, spectrum.windowSumSquares, design) : null;
      inBand.forEach((gridIndex, j) => {
        const h1 = linearMagnitude[gridIndex];
        const measured = reading.magnitude[j] / h1;
        if (floor) {
          const classified = classifyAgainstFloor(measured * measured, (floor[j] / h1) ** 2, input.marginDb);
          ratio[gridIndex] = classified.rms;
          isUpperBound[gridIndex] = classified.isUpperBound ? 1 : 0;
          floorRatio[gridIndex] = floor[j] / h1;
        } else {
          ratio[gridIndex] = measured;
        }
        if (phaseDeg && reading.phaseDeg) phaseDeg[gridIndex] = reading.phaseDeg[j];
      });
    }
    orders.push({ order, plan, ratio, isUpperBound, floorRatio, phaseDeg });
  }
  return { linearPlan, linearMagnitude, linearSignalToNoiseDb, orders };
}
