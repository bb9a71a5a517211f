import { describe, expect, it } from 'vitest';
import { cosine, polynomial, polynomialHarmonics } from '../distortion/test-signals';
import { isEngineError } from '../errors';
import { thrownBy } from '../test-support/thrown-by';
import { analyzeToneDistortion } from './tone-distortion';

const FS = 48_000;

describe('tone distortion analysis', () => {
  const amplitude = 0.5;
  const truth = polynomialHarmonics(amplitude, 0.2, 0.1);
  const samples = polynomial(cosine(96_000, 997, FS, amplitude), 0.2, 0.1);

  it('reports HD_n, both THD forms, THD+N and the fundamental level with their conventions', () => {
    // Trigonometric power identities (HD2, HD3 of the polynomial); fundamental 0.509375 → −5.8591 dBFS (AES17 peak).
    const result = analyzeToneDistortion({ samples, sampleRateHz: FS }, { analysisSegment: { startSeconds: 0.5, durationSeconds: 1 } });
    expect(result.kind).toBe('tone_distortion');
    const { figures } = result;
    expect(Math.abs(figures.harmonics[0].valuePercent / 100 / truth.hd2 - 1)).toBeLessThan(0.01);
    expect(Math.abs(figures.harmonics[1].valuePercent / 100 / truth.hd3 - 1)).toBeLessThan(0.01);
    expect(figures.fundamentalLevelDbfs).toBeCloseTo(20 * Math.log10(0.509375), 3);
    expect(figures.thdHeadline.form).toBe('thd_f');
    expect(figures.thdHeadline.valuePercent).toBe(figures.thdF.valuePercent);
    // Without noise THD+N equals THD_R: residual = harmonics only, over √(V1² + residual²).
    expect(figures.thdPlusNoise.valuePercent).toBeCloseTo(figures.thdR.valuePercent, 3);
    expect(figures.sinadDb).toBeCloseTo(-figures.thdF.valueDb, 3);
    for (const key of ['window', 'thdDefinition', 'harmonicOrders', 'thdPlusNoiseBandwidth', 'noiseFloor']) {
      expect(typeof result.conventions[key]).toBe('string');
    }
  });

  it('shows each harmonic in the residual spectrum at about its HD (within the BH-7 scallop loss, 0.49 dB)', () => {
    const result = analyzeToneDistortion({ samples, sampleRateHz: FS });
    const { frequencyHz, levelDbRelFundamental } = result.curves.residualSpectrum;
    const nearest = (f: number) => frequencyHz.reduce((best, g, i) => (Math.abs(Math.log(g / f)) < Math.abs(Math.log(frequencyHz[best] / f)) ? i : best), 0);
    const second = levelDbRelFundamental[nearest(2 * 997)]!;
    expect(second).toBeLessThanOrEqual(20 * Math.log10(truth.hd2) + 0.01);
    expect(second).toBeGreaterThan(20 * Math.log10(truth.hd2) - 0.5);
  });

  it('converts the level with a stated calibration (1 Pa = 93.98 dB SPL re 20 µPa, ISO 1683 reference)', () => {
    const tone = cosine(48_000, 1000, FS, 0.1); // −20 dBFS
    const result = analyzeToneDistortion({ samples: tone, sampleRateHz: FS }, { levelCalibration: { dbfsAtOnePascal: -20 } });
    expect(result.figures.fundamentalLevelDbSpl as number).toBeCloseTo(93.979, 2);
  });

  it('flags results within 10 dB of the loopback channel', () => {
    const result = analyzeToneDistortion({ samples, sampleRateHz: FS, loopbackSamples: samples });
    expect(result.figures.chainResidual?.thdNearChainResidual).toBe(true);
    expect(result.warnings.map((w) => w.code)).toContain('near_chain_residual');
  });

  it('warns about clipping, too few cycles and dropped orders', () => {
    const clipped = cosine(4800, 50, FS, 1.4).map((v) => Math.max(-1, Math.min(1, v)));
    const codes = analyzeToneDistortion({ samples: clipped, sampleRateHz: FS }).warnings.map((w) => w.code);
    expect(codes).toContain('clipping');
    expect(codes).toContain('too_few_cycles'); // 5 cycles; BH-7 needs 16
    const high = analyzeToneDistortion({ samples: cosine(48_000, 5000, FS, 0.5), sampleRateHz: FS });
    expect(high.figures.droppedOrders).toEqual([5, 6, 7, 8, 9, 10]);
    expect(high.warnings.map((w) => w.code)).toContain('harmonics_beyond_band_dropped');
  });

  it('throws EngineError only on bad inputs', () => {
    const attempts = [
      () => analyzeToneDistortion(null as never),
      () => analyzeToneDistortion({ samples: [1, 2, 3] as never, sampleRateHz: FS }),
      () => analyzeToneDistortion({ samples, sampleRateHz: 0 }),
      () => analyzeToneDistortion({ samples, sampleRateHz: FS }, { method: 'coherent' }),
      () => analyzeToneDistortion({ samples, sampleRateHz: FS }, { method: 'coherent', toneFrequencyHz: 997.3 }),
      () => analyzeToneDistortion({ samples, sampleRateHz: FS }, { toneFrequencyHz: 30_000 }),
      () => analyzeToneDistortion({ samples, sampleRateHz: FS }, { window: 'hann' as never }),
      () => analyzeToneDistortion({ samples, sampleRateHz: FS }, { maxOrder: 1 }),
      () => analyzeToneDistortion({ samples, sampleRateHz: FS }, { analysisSegment: { startSeconds: 5 } }),
      () => analyzeToneDistortion({ samples, sampleRateHz: FS }, { levelCalibration: {} as never }),
      () => analyzeToneDistortion({ samples, sampleRateHz: FS, loopbackSamples: new Float64Array(100) }),
      () => analyzeToneDistortion({ samples: new Float64Array(100).fill(Number.NaN), sampleRateHz: FS }),
      () => analyzeToneDistortion({ samples: new Float64Array(4800), sampleRateHz: FS }),
    ];
    for (const attempt of attempts) expect(isEngineError(thrownBy(attempt))).toBe(true);
  });
});
