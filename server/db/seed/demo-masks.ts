import type { MaskVersionContent } from '@shared/schemas/masks';
import { firstOrderLowPass, rbjHighPass, rbjPeaking, type Biquad } from '@shared/dsp/response/biquad';
import type { ProductPlan } from './demo-products';

/** Limits drawn by hand around a product's design curve, relative to its level at a reference frequency. */
export interface DrawnMaskPlan {
  name: string;
  product: ProductPlan;
  referenceHz: number;
  fromHz: number;
  toHz: number;
  toleranceDb: number;
  note: string;
}

/** |H(e^{jω})| of a biquad in dB at `frequencyHz` (the transfer function the coefficients define). */
function biquadLevelDb(filter: Biquad, frequencyHz: number, sampleRateHz: number): number {
  const w = (2 * Math.PI * frequencyHz) / sampleRateHz;
  const evaluate = ([c0, c1, c2]: [number, number, number]) => {
    const re = c0 + c1 * Math.cos(w) + c2 * Math.cos(2 * w);
    const im = -c1 * Math.sin(w) - c2 * Math.sin(2 * w);
    return Math.hypot(re, im);
  };
  return 20 * Math.log10(evaluate(filter.b) / evaluate(filter.a));
}

/** The design's level at `frequencyHz`, dB re its passband gain (the chain of the simulated device). */
function designLevelDb(product: ProductPlan, frequencyHz: number): number {
  const { nominal } = product;
  const fs = product.sweep.sampleRateHz;
  return [rbjHighPass(nominal.highPassHz, nominal.highPassQ, fs), rbjPeaking(nominal.peakHz, nominal.peakGainDb, nominal.peakQ, fs), firstOrderLowPass(nominal.lowPassHz, fs)]
    .map((filter) => biquadLevelDb(filter, frequencyHz, fs))
    .reduce((sum, level) => sum + level, 0);
}

/** Upper and lower limit lines on a 1/6-octave grid: design curve ± tolerance, relative to the reference frequency. */
export function drawnMaskContent(plan: DrawnMaskPlan): MaskVersionContent {
  const reference = designLevelDb(plan.product, plan.referenceHz);
  const frequencies: number[] = [];
  for (let f = plan.fromHz; f < plan.toHz * 0.999; f *= 2 ** (1 / 6)) frequencies.push(Math.round(f * 10) / 10);
  frequencies.push(plan.toHz);
  const relative = frequencies.map((frequencyHz) => ({ frequencyHz, levelDb: designLevelDb(plan.product, frequencyHz) - reference }));
  const rounded = (value: number) => Math.round(value * 100) / 100;
  return {
    levelReference: 'relative',
    referenceLevel: { kind: 'at_frequency', frequencyHz: plan.referenceHz },
    upper: relative.map((point) => ({ frequencyHz: point.frequencyHz, levelDb: rounded(point.levelDb + plan.toleranceDb) })),
    lower: relative.map((point) => ({ frequencyHz: point.frequencyHz, levelDb: rounded(point.levelDb - plan.toleranceDb) })),
    note: plan.note,
  };
}
