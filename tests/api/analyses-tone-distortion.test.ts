import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { auth, idempotencyKey, measureContext, wav, type MeasureContext } from './analyses-fixtures';

let m: MeasureContext;
beforeAll(async () => {
  m = await measureContext();
});
afterAll(async () => {
  await m?.close();
});

const fs = 48_000;
const toneHz = 1000;
const A = 0.5;
const a2 = 0.2;
const a3 = 0.1;

/** y = x + a2·x² + a3·x³ with x = A·cos(2π f n / fs): a memoryless polynomial nonlinearity. */
function bentTone(seconds: number): Float64Array {
  return Float64Array.from({ length: Math.round(seconds * fs) }, (_, n) => {
    const x = A * Math.cos((2 * Math.PI * toneHz * n) / fs);
    return x + a2 * x * x + a3 * x * x * x;
  });
}

// Closed form from the power-reduction identities cos²θ = (1 + cos 2θ)/2, cos³θ = (3 cos θ + cos 3θ)/4:
// fundamental A(1 + 3a3A²/4), 2nd harmonic a2A²/2, 3rd harmonic a3A³/4, so relative to the fundamental
// HD2 = (a2·A/2)/(1 + 3a3A²/4) and HD3 = (a3·A²/4)/(1 + 3a3A²/4); THD_F = √(HD2² + HD3²) by its definition
// (RMS sum of the harmonics over the fundamental; common practice, no source).
const fundamentalPeak = A * (1 + (3 * a3 * A * A) / 4);
const hd2 = (a2 * A) / 2 / (1 + (3 * a3 * A * A) / 4);
const hd3 = (a3 * A * A) / 4 / (1 + (3 * a3 * A * A) / 4);

async function upload(bytes: Buffer) {
  const response = await m.api().post('/v1/captures').set(auth(m.key)).set(idempotencyKey()).attach('file', bytes, 'kb-t25-24-000031-tone.wav');
  expect(response.status, JSON.stringify(response.body)).toBe(201);
  return response.body.id as string;
}

const createAnalysis = (body: Record<string, unknown>) => m.api().post('/v1/analyses').set(auth(m.key)).set(idempotencyKey()).set('Prefer', 'wait=30').send(body);

describe('kind tone_distortion', () => {
  it('reads HD2, HD3 and THD_F of a known polynomial nonlinearity, and the calibrated fundamental level', async () => {
    const captureId = await upload(wav([bentTone(1)]));
    const calibration = await m.owner.agent.post('/v1/calibrations').set(idempotencyKey()).send({ source: 'entered_dbfs', rigId: 'kb-line2-rig1', inputChannel: 0, dbfsAtOnePascal: -20 });
    expect(calibration.status, JSON.stringify(calibration.body)).toBe(201);
    const response = await createAnalysis({
      kind: 'tone_distortion',
      captureId,
      // Coherent: 1000 whole cycles in one second at 48 kHz, one clock (rectangular window, exact bins).
      options: { toneFrequencyHz: toneHz, method: 'coherent', maxOrder: 5 },
      calibration: { calibrationId: calibration.body.id },
      dut: { model: 'KB-T25 tweeter', serial: 'KBT25-24-000031' },
    });
    expect(response.status, JSON.stringify(response.body)).toBe(200);
    expect(response.body.status, JSON.stringify(response.body.error)).toBe('succeeded');
    expect(response.body.kind).toBe('tone_distortion');
    const { figures, conventions } = response.body.result;
    expect(figures.fundamentalFrequencyHz).toBeCloseTo(toneHz, 6);
    const byOrder = new Map((figures.harmonics as { order: number; valuePercent: number }[]).map((h) => [h.order, h.valuePercent / 100]));
    expect(Math.abs(byOrder.get(2)! / hd2 - 1)).toBeLessThan(1e-6);
    expect(Math.abs(byOrder.get(3)! / hd3 - 1)).toBeLessThan(1e-6);
    expect(byOrder.get(4)!).toBeLessThan(1e-7);
    expect(Math.abs(figures.thdF.valuePercent / 100 / Math.hypot(hd2, hd3) - 1)).toBeLessThan(1e-6);
    // AES17: a sine of peak P reads 20·log10(P) dBFS; 1 Pa RMS = 20·log10(1/20 µPa) = 93.98 dB SPL (ISO 1683 reference).
    // Stored results keep 7 significant digits (conventions.numberPrecision): at 100 dB that is 0.0001 dB.
    expect(conventions.numberPrecision).toMatch(/7 significant digits/);
    expect(Math.abs(figures.fundamentalLevelDbfs - 20 * Math.log10(fundamentalPeak))).toBeLessThanOrEqual(1e-5);
    expect(Math.abs(figures.fundamentalLevelDbSpl - (20 * Math.log10(fundamentalPeak) + 20 + 20 * Math.log10(1 / 20e-6)))).toBeLessThanOrEqual(1e-4);
    for (const key of ['magnitudeReference', 'window', 'thdDefinition', 'harmonicOrders', 'thdPlusNoiseBandwidth', 'noiseFloor']) expect(typeof conventions[key], key).toBe('string');
    expect(response.body.calibration.id).toBe(calibration.body.id);
    expect(response.body.warnings.map((w: { code: string }) => w.code)).not.toContain('uncalibrated');
  });

  it('takes the tone frequency from a calibrator_check stimulus', async () => {
    const stimulus = await m.api().post('/v1/stimuli').set(auth(m.key)).set(idempotencyKey())
      .send({ type: 'calibrator_check', parameters: { frequencyHz: toneHz, durationSeconds: 2, sampleRateHz: fs, levelDbfs: -6 } });
    expect(stimulus.status, JSON.stringify(stimulus.body)).toBe(201);
    const captureId = await upload(wav([bentTone(2)]));
    const response = await createAnalysis({ kind: 'tone_distortion', captureId, stimulusId: stimulus.body.id, options: { method: 'coherent' } });
    expect(response.body.status, JSON.stringify(response.body.error)).toBe('succeeded');
    expect(response.body.result.figures.fundamentalFrequencyHz).toBeCloseTo(toneHz, 6);
    expect(Math.abs(response.body.result.figures.harmonics[0].valuePercent / 100 / hd2 - 1)).toBeLessThan(1e-6);
  });

  it('refuses what cannot work before queueing (422/400 with pointers)', async () => {
    const captureId = await upload(wav([bentTone(1)]));
    const tooHigh = await createAnalysis({ kind: 'tone_distortion', captureId, options: { toneFrequencyHz: 30_000 } });
    expect(tooHigh.status).toBe(400);
    expect(tooHigh.body.errors[0].pointer).toBe('#/options/toneFrequencyHz');
    const badWindow = await createAnalysis({ kind: 'tone_distortion', captureId, options: { window: 'hann' } });
    expect(badWindow.status).toBe(422);
    expect(badWindow.body.errors[0].pointer).toBe('#/options/window');
    const sweep = await m.api().post('/v1/stimuli').set(auth(m.key)).set(idempotencyKey())
      .send({ type: 'sweep', parameters: { startHz: 20, stopHz: 20_000, approximateDurationSeconds: 1, sampleRateHz: fs } });
    const wrongStimulus = await createAnalysis({ kind: 'tone_distortion', captureId, stimulusId: sweep.body.id });
    expect(wrongStimulus.status).toBe(422);
    expect(wrongStimulus.body.code).toBe('analysis_input_mismatch');
    const noCapture = await createAnalysis({ kind: 'tone_distortion' });
    expect(noCapture.status).toBe(400);
    expect(noCapture.body.errors[0].pointer).toBe('#/captureId');
  });
});
