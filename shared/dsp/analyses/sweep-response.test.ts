import { describe, expect, it } from 'vitest';
import { levelAtFrequencyDb } from '../curves';
import { EngineError } from '../errors';
import { designSynchronizedSweep, renderSweep, type SweepParameters } from '../stimuli/sweep';
import { analyzeSweepResponse } from './sweep-response';
import type { SweepResponseOptions } from './sweep-response-options';
import type { SweepResponseResult } from './sweep-response-types';
import {
  addSignals,
  biquadGroupDelaySeconds,
  biquadResponse,
  butterworthHighPass2,
  butterworthLowPass2,
  cascade,
  delaySamples,
  firstOrderLowPass,
  rbjPeaking,
  whiteNoise,
  type Biquad,
} from './test-support/published-filters';

const fs = 48000;
const params: SweepParameters = { startHz: 20, stopHz: 20000, approximateDurationSeconds: 3, sampleRateHz: fs, levelDbfs: -6 };
const sweep = renderSweep(designSynchronizedSweep(params));

function capture(...channels: Float64Array[]) {
  return { sampleRateHz: fs, channels };
}

function worstErrorDb(result: SweepResponseResult, filters: Biquad[], fromHz: number, toHz: number, offsetDb = 0): number {
  let worst = 0;
  result.curves.frequencyHz.forEach((f, i) => {
    if (f < fromHz || f > toHz) return;
    worst = Math.max(worst, Math.abs(result.curves.magnitudeDb[i] - offsetDb - biquadResponse(filters, f, fs).magnitudeDb));
  });
  return worst;
}

describe('sweep frequency response', () => {
  it('recovers an RBJ peaking filter behind a pure delay and noise within ±0.1 dB, and the delay within one sample', () => {
    // RBJ Audio EQ Cookbook peaking biquad, exactly +6 dB at f0; H(e^jω) evaluated directly from its coefficients.
    const peaking = rbjPeaking(1000, 6, 2, fs);
    const dut = addSignals(delaySamples(cascade(sweep, [peaking]), 37), whiteNoise(sweep.length, 1e-4, 7));
    const result = analyzeSweepResponse(capture(dut), params);
    expect(biquadResponse([peaking], 1000, fs).magnitudeDb).toBeCloseTo(6, 10);
    expect(worstErrorDb(result, [peaking], 100, 10000)).toBeLessThan(0.1);
    expect(Math.abs(result.figures.delaySamples - 37)).toBeLessThan(1);
    expect(result.figures.delayMs).toBeCloseTo((1000 * result.figures.delaySamples) / fs, 12);
    expect(result.kind).toBe('frequency_response');
  });

  it('recovers Butterworth band edges: −3.01 dB at each cut-off and ±0.1 dB over 100 Hz–10 kHz', () => {
    // Butterworth 2nd order by the bilinear transform, pre-warped: |H(fc)|² = 1/2 → −3.0103 dB.
    const filters = [butterworthHighPass2(55, fs), butterworthLowPass2(5000, fs)];
    const result = analyzeSweepResponse(capture(cascade(sweep, filters)), params, { grid: { pointsPerOctave: 48, startHz: 40, stopHz: 12000 } });
    expect(worstErrorDb(result, filters, 100, 10000)).toBeLessThan(0.1);
    expect(biquadResponse([butterworthLowPass2(5000, fs)], 5000, fs).magnitudeDb).toBeCloseTo(-3.0103, 4);
    const curve = { frequencyHz: Float64Array.from(result.curves.frequencyHz), magnitudeDb: Float64Array.from(result.curves.magnitudeDb) };
    expect(levelAtFrequencyDb(curve, 5000)).toBeCloseTo(-3.0103 + biquadResponse([butterworthHighPass2(55, fs)], 5000, fs).magnitudeDb, 1);
    const upper = result.figures.bandLimits?.limits.find((limit) => limit.dropDb === 3)?.upper;
    expect(upper?.status).toBe('found');
    // the −3 dB point re 1 kHz: the high-pass adds a hair at 1 kHz, so the crossing lies within 1 % of fc
    if (upper?.status === 'found') expect(Math.abs(upper.frequencyHz / 5000 - 1)).toBeLessThan(0.01);
  });

  it('divides out a non-flat interface and its latency through the loopback channel', () => {
    // Dual-channel H = Y/X (Kirkeby et al. 1998 regularisation outside the band): the interface must cancel.
    const interfaceFilters = [rbjPeaking(3000, -8, 1.5, fs), firstOrderLowPass(15000, fs)];
    const played = delaySamples(cascade(sweep, interfaceFilters), 123);
    const dut = rbjPeaking(400, -5, 3, fs);
    const measurement = addSignals(delaySamples(cascade(played, [dut]), 60), whiteNoise(sweep.length, 1e-5, 3));
    const result = analyzeSweepResponse(capture(measurement, played), params, { referenceChannel: 1 });
    expect(worstErrorDb(result, [dut], 100, 10000)).toBeLessThan(0.1);
    expect(Math.abs(result.figures.delaySamples - 60)).toBeLessThan(1);
    expect(result.conventions.magnitudeReference).toMatch(/loopback/);
    // Without the loopback the interface shows (−8 dB at 3 kHz) and the latency adds to the delay.
    const direct = analyzeSweepResponse(capture(measurement, played), params);
    expect(worstErrorDb(direct, [dut], 2900, 3100)).toBeGreaterThan(7);
    expect(Math.abs(direct.figures.delaySamples - 183)).toBeLessThan(1);
  });

  it('reports the lowest valid frequency of a gate and marks the points below it', () => {
    // Frequency resolution of a T-long record is 1/T (common practice): a 5 ms gate is valid above ≈ 200 Hz.
    const result = analyzeSweepResponse(capture(sweep), params, { gate: { lengthSeconds: 0.005 } });
    expect(result.figures.lowestValidFrequencyHz).toBeCloseTo(200, 9);
    expect(result.figures.gated).toBe(true);
    result.curves.frequencyHz.forEach((f, i) => expect(result.curves.belowLowestValidFrequency[i]).toBe(f < 200));
    expect(result.warnings.map((w) => w.code)).toContain('gate_limits_low_frequency');
    expect(result.conventions.gate).toMatch(/time gate/);
    const tukey = analyzeSweepResponse(capture(sweep), params, { gate: { lengthSeconds: 0.01, preRollSeconds: 0.003, shape: 'tukey', taperFraction: 0.2 } });
    expect(tukey.figures.lowestValidFrequencyHz).toBeCloseTo(100, 9);
    expect(tukey.conventions.gate).toMatch(/Tukey/);
  });

  it('gives the group delay of a pure delay and of a 1st-order low-pass', () => {
    // Ideal delay: τ_g = τ at all f (analytic). 1st-order low-pass: τ_g(f) = (1/ωc)/(1 + (f/fc)²) → 1/(2π·fc) at DC
    // (analytic); the bilinear version is compared with its exact digital group delay too.
    const delayed = analyzeSweepResponse(capture(delaySamples(sweep, 48)), params);
    delayed.curves.frequencyHz.forEach((f, i) => {
      // within 0.25 sample from 100 Hz (band-edge ripple of the 20 Hz sweep start), 0.005 sample from 300 Hz
      if (f >= 100 && f <= 10000) expect(Math.abs(delayed.curves.groupDelayMs[i] - 1)).toBeLessThan(0.005);
      if (f >= 300 && f <= 10000) expect(Math.abs(delayed.curves.groupDelayMs[i] - 1)).toBeLessThan(0.0001);
    });
    const lowPass = firstOrderLowPass(1000, fs);
    const filtered = analyzeSweepResponse(capture(cascade(sweep, [lowPass])), params);
    const tauDc = 1 / (2 * Math.PI * 1000); // 159.15 µs
    // the bilinear transform keeps τ(0) within 0.2 % of the analog 1/(2π·fc) at fc = fs/48
    expect(Math.abs(biquadGroupDelaySeconds([lowPass], 0, fs) - tauDc) / tauDc).toBeLessThan(0.002);
    filtered.curves.frequencyHz.forEach((f, i) => {
      if (f < 200 || f > 5000) return;
      const analog = tauDc / (1 + (f / 1000) ** 2);
      expect(Math.abs(filtered.curves.groupDelayMs[i] / 1000 - analog) / tauDc).toBeLessThan(0.01);
      expect(Math.abs(filtered.curves.groupDelayMs[i] / 1000 - biquadGroupDelaySeconds([lowPass], f, fs))).toBeLessThan(2e-7); // 0.01 sample
    });
  });

  it('states absolute SPL from a calibration and refers it to 1 m', () => {
    // L_SPL = L_rel + L_drive − L(1 Pa) + 20·log10(1/20 µPa) (ISO 1683 reference 20 µPa; AES17 dBFS);
    // 0.5 m → 1 m by the inverse-square law: −20·log10(2) = −6.0206 dB.
    const options: SweepResponseOptions = {
      calibration: { dbfsAtOnePascal: -30 },
      conditions: { distanceMetres: 0.5 },
      referTo: { distanceMetres: 1 },
    };
    const result = analyzeSweepResponse(capture(sweep), params, options);
    const at1k = result.curves.frequencyHz.findIndex((f) => Math.abs(f - 1000) < 1e-6);
    expect(result.curves.magnitudeDb[at1k]).toBeCloseTo(-6 + 30 + 93.9794 - 6.0206, 2);
    expect(result.conventions.magnitudeReference).toMatch(/dB SPL re 20 µPa/);
    expect(result.warnings.map((w) => w.code)).toContain('far_field_assumption');
  });

  it('normalises, smooths and tabulates a flat system to 0 dB', () => {
    const result = analyzeSweepResponse(capture(delaySamples(sweep, 10)), params, {
      smoothing: { octaveFraction: 6, averaging: 'complex' },
      normalisation: { kind: 'band_mean', lowHz: 200, highHz: 5000 },
      grid: { pointsPerOctave: 24 },
    });
    result.curves.frequencyHz.forEach((f, i) => {
      if (f >= 100 && f <= 10000) expect(Math.abs(result.curves.magnitudeDb[i])).toBeLessThan(0.02);
    });
    result.curves.frequencyHz.forEach((f, i) => expect(result.curves.nearSweepEdge[i]).toBe(f < 40 || f > 20000 * 2 ** (-1 / 6)));
    const third = result.curves.thirdOctave?.find((row) => row.nominalLabel === '1000');
    expect(third?.exactHz).toBe(1000);
    expect(Math.abs(third?.bandLevelDb ?? 99)).toBeLessThan(0.02);
  });

  it('warns about sample-rate mismatch, short captures, clipping and low SNR', () => {
    const at441 = { ...params, sampleRateHz: 44100 };
    const mismatch = analyzeSweepResponse(capture(sweep), at441);
    expect(mismatch.warnings.map((w) => w.code)).toContain('sample_rate_mismatch');
    expect(worstErrorDb(mismatch, [], 100, 10000)).toBeLessThan(0.1);

    const design = designSynchronizedSweep(params);
    const short = sweep.slice(0, design.leadingSilenceSampleCount + Math.round(0.9 * design.sweepSampleCount));
    expect(analyzeSweepResponse(capture(short), params).warnings.map((w) => w.code)).toContain('capture_shorter_than_stimulus');

    const clipped = sweep.map((v) => Math.max(-0.3, Math.min(0.3, v)));
    expect(analyzeSweepResponse(capture(clipped.map((v) => v / 0.3)), params).warnings.map((w) => w.code)).toContain('clipping');

    // White noise of RMS 0.1 against a −6 dBFS sweep leaves < 20 dB SNR at high frequencies (pink sweep, white noise).
    const offset = analyzeSweepResponse(capture(sweep.map((v) => v + 0.01)), params);
    expect(offset.warnings.map((w) => w.code)).toContain('dc_offset');
    const narrowParams = { ...params, startHz: 100, stopHz: 10000 };
    const narrowSweep = renderSweep(designSynchronizedSweep(narrowParams));
    const wide = analyzeSweepResponse(capture(narrowSweep), narrowParams, { grid: { startHz: 20, stopHz: 20000 } });
    expect(wide.warnings.map((w) => w.code)).toContain('response_outside_sweep_band');
    expect(wide.curves.outsideSweepBand[0]).toBe(true);

    const noisy = analyzeSweepResponse(capture(addSignals(sweep, whiteNoise(sweep.length, 0.1, 11))), params);
    expect(noisy.warnings.map((w) => w.code)).toContain('low_snr');
    const clean = analyzeSweepResponse(capture(addSignals(sweep, whiteNoise(sweep.length, 1e-4, 11))), params);
    expect(clean.warnings.map((w) => w.code)).not.toContain('low_snr');
    // SNR estimate against the actual scatter: where it says ≥ 40 dB the error stays below 20·log10(1 + 10^(−2)) dB
    const noisyCurve = analyzeSweepResponse(capture(addSignals(sweep, whiteNoise(sweep.length, 0.01, 12))), params);
    noisyCurve.curves.frequencyHz.forEach((f, i) => {
      const snr = noisyCurve.curves.snrDb?.[i] ?? 0;
      if (f >= 100 && snr >= 40) expect(Math.abs(noisyCurve.curves.magnitudeDb[i])).toBeLessThan(20 * Math.log10(1.01) * 3);
    });
  });

  it('gives the same result bit for bit on a second run', () => {
    const input = addSignals(cascade(sweep, [rbjPeaking(2000, 4, 1, fs)]), whiteNoise(sweep.length, 1e-4, 5));
    const options: SweepResponseOptions = { smoothing: { octaveFraction: 3 }, gate: { lengthSeconds: 0.02 } };
    const first = JSON.stringify(analyzeSweepResponse(capture(input), params, options));
    const second = JSON.stringify(analyzeSweepResponse(capture(Float64Array.from(input)), params, options));
    expect(second).toBe(first);
  });

  it('throws only EngineError for bad options and inputs', () => {
    const bad: unknown[] = [
      { measurementChannel: 1 },
      { measurementChannel: -1 },
      { referenceChannel: 0 },
      { smoothing: { octaveFraction: 0 } },
      { smoothing: { octaveFraction: 96 } },
      { smoothing: { octaveFraction: 3, averaging: 'median' } },
      { gate: { lengthSeconds: 0 } },
      { gate: { lengthSeconds: 0.01, shape: 'triangle' } },
      { gate: { preRollSeconds: 0.001 } },
      { grid: { pointsPerOctave: 0 } },
      { grid: { startHz: 2000, stopHz: 1000 } },
      { grid: { startHz: 30000 } },
      { normalisation: { kind: 'at_2khz' } },
      { normalisation: { kind: 'band_mean', lowHz: 500 } },
      { bandLimits: { dropsDb: [] } },
      { bandLimits: { toleranceDb: -3 } },
      { calibration: { dbfsAtOnePascal: 'x' } },
      { referTo: { distanceMetres: 1 } },
      { conditions: { temperatureCelsius: 500 } },
      { captureOffsetSeconds: -1 },
      { captureOffsetSeconds: 100 },
      { analysisWindowSeconds: 0 },
      { smoothng: { octaveFraction: 3 } },
      'fast',
      null,
    ];
    for (const options of bad) {
      expect(() => analyzeSweepResponse(capture(sweep), params, options as SweepResponseOptions), JSON.stringify(options)).toThrow(EngineError);
    }
    const badInputs: [unknown, unknown][] = [
      [{ sampleRateHz: fs, channels: [] }, params],
      [{ sampleRateHz: 0, channels: [sweep] }, params],
      [{ sampleRateHz: fs, channels: [Array.from(sweep)] }, params],
      [{ sampleRateHz: fs, channels: [Float64Array.from([1, Number.NaN, 2])] }, params],
      [{ sampleRateHz: fs, channels: [sweep, sweep.subarray(1)] }, params],
      [capture(sweep), { ...params, stopHz: 30000 }],
      [capture(sweep), { ...params, startHz: 20000, stopHz: 20 }],
      [capture(sweep), null],
      [capture(new Float64Array(100)), params],
    ];
    for (const [input, stimulus] of badInputs) {
      expect(() => analyzeSweepResponse(input as never, stimulus as SweepParameters), JSON.stringify(stimulus)).toThrow(EngineError);
    }
  });
});
