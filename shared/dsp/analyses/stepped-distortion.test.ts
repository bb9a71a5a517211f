import { describe, expect, it } from 'vitest';
import { polynomial, polynomialHarmonics } from '../distortion/test-signals';
import { isEngineError } from '../errors';
import { designSteppedSine, renderSteppedSine } from '../stimuli/stepped-sine';
import { thrownBy } from '../test-support/thrown-by';
import { analyzeSteppedDistortion } from './stepped-distortion';

const FS = 48_000;
const plan = designSteppedSine({ startHz: 50, stopHz: 5000, bandsPerOctave: 3, sampleRateHz: FS, levelDbfs: -6 });
const stimulus = renderSteppedSine(plan);

type Orders = { order: number; percent: (number | null)[]; isUpperBound: boolean[] }[];

describe('stepped-sine distortion', () => {
  it('recovers the polynomial harmonics at every step within 1 % (trigonometric power identities)', () => {
    // y = x + a2·x² + a3·x³ on A·sin θ: HD2 = (a2·A/2)/(1 + 3·a3·A²/4), HD3 = (a3·A²/4)/(1 + 3·a3·A²/4).
    // The ramps between steps lie outside the analysis windows, so every window sees a steady tone of amplitude A.
    const truth = polynomialHarmonics(plan.amplitude, 0.2, 0.1);
    const result = analyzeSteppedDistortion({ sampleRateHz: FS, channels: [polynomial(stimulus, 0.2, 0.1)] }, plan);
    expect(result.kind).toBe('stepped_sine');
    const orders = result.curves.orders as Orders;
    const frequencies = result.curves.frequencyHz as number[];
    expect(frequencies.length).toBe(plan.steps.length);
    frequencies.forEach((f, i) => {
      expect(Math.abs(orders[0].percent[i]! / 100 / truth.hd2 - 1)).toBeLessThan(0.01);
      expect(Math.abs(orders[1].percent[i]! / 100 / truth.hd3 - 1)).toBeLessThan(0.01);
      const thdF = (result.curves.thdFPercent as number[])[i] / 100;
      expect(Math.abs(thdF / Math.hypot(truth.hd2, truth.hd3) - 1)).toBeLessThan(0.01);
      // Orders above the 20 kHz limit are dropped: 10·f ≤ 20 kHz keeps all nine up to 2 kHz.
      expect((result.curves.ordersUsed as number[])[i]).toBe(Math.min(9, Math.floor(20_000 / f) - 1));
    });
    expect(result.conventions.window).toContain('coherent');
    const summary = result.figures.thdF as { atReference: { valuePercent: number } };
    expect(Math.abs(summary.atReference.valuePercent / 100 / Math.hypot(truth.hd2, truth.hd3) - 1)).toBeLessThan(0.01);
  });

  it('flags every step when the loopback channel carries the same distortion (chain residual)', () => {
    const distorted = polynomial(stimulus, 0.05, 0);
    const result = analyzeSteppedDistortion({ sampleRateHz: FS, channels: [distorted, distorted] }, plan, { loopbackChannel: 1 });
    expect((result.curves.nearChainResidual as boolean[]).every(Boolean)).toBe(true);
    expect(result.warnings.map((w) => w.code)).toContain('near_chain_residual');
  });

  it('throws EngineError only on bad inputs', () => {
    const good = { sampleRateHz: FS, channels: [stimulus] };
    const attempts = [
      () => analyzeSteppedDistortion({ sampleRateHz: 44_100, channels: [stimulus] }, plan),
      () => analyzeSteppedDistortion(good, plan, { method: 'fast' as never }),
      () => analyzeSteppedDistortion(good, plan, { loopbackChannel: 4 }),
      () => analyzeSteppedDistortion(good, plan, { thdPlusNoise: { lowHz: 20_000, highHz: 20 } }),
      () => analyzeSteppedDistortion({ sampleRateHz: FS, channels: [new Float64Array(10)] }, plan),
      () => analyzeSteppedDistortion(good, { ...plan.parameters, bandsPerOctave: 5 }),
    ];
    for (const attempt of attempts) expect(isEngineError(thrownBy(attempt))).toBe(true);
  });
});
