import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { designSynchronizedSweep, renderSweep } from '@shared/dsp';
import { createApiKey, signUp } from '../support/actors';
import { auth, idempotencyKey, measureContext, wav, type MeasureContext } from './analyses-fixtures';

let m: MeasureContext;
beforeAll(async () => {
  m = await measureContext();
});
afterAll(async () => {
  await m?.close();
});

const fs = 48_000;
const sweepLevelDbfs = -12;
const sweepParameters = { startHz: 20, stopHz: 20_000, approximateDurationSeconds: 2, sampleRateHz: fs, levelDbfs: sweepLevelDbfs, trailingSilenceSeconds: 0.5 };
const gain = 0.5;
const dbfsAtOnePascal = -30;
const distanceM = 2;
const driveVoltageVrms = 2;
const nominalImpedanceOhm = 4;
const onePascalDbSpl = 20 * Math.log10(1 / 20e-6); // 93.979 dB SPL (ISO 1683 reference pressure 20 µPa)

let stimulusId = '';
let calibrationId = '';

async function responseAnalysis(body: Record<string, unknown>, samples: Float64Array) {
  const capture = await m.api().post('/v1/captures').set(auth(m.key)).set(idempotencyKey()).attach('file', wav([samples]), 'kb65-24-000321.wav');
  expect(capture.status, JSON.stringify(capture.body)).toBe(201);
  const response = await m.api().post('/v1/analyses').set(auth(m.key)).set(idempotencyKey()).set('Prefer', 'wait=30')
    .send({ kind: 'frequency_response', captureId: capture.body.id, stimulusId, dut: { model: 'KB-65 woofer', serial: 'KB65-24-000321' }, ...body });
  expect(response.status, JSON.stringify(response.body)).toBe(200);
  return response.body as { id: string; status: string };
}

const deriveSensitivity = (sensitivity: Record<string, unknown>, extra: Record<string, unknown> = {}, key = m.key) =>
  m.api().post('/v1/analyses').set(auth(key)).set(idempotencyKey()).set('Prefer', 'wait=30')
    .send({ kind: 'sensitivity', sensitivity: { deviceType: 'loudspeaker', ...sensitivity }, conditions: { nominalImpedanceOhm }, dut: { model: 'KB-65 woofer', serial: 'KB65-24-000321' }, ...extra });

describe('sensitivity derived from a stored response analysis', () => {
  let calibrated: { id: string };
  beforeAll(async () => {
    const stimulus = await m.api().post('/v1/stimuli').set(auth(m.key)).set(idempotencyKey()).send({ type: 'sweep', parameters: sweepParameters });
    stimulusId = stimulus.body.id;
    const calibration = await m.owner.agent.post('/v1/calibrations').set(idempotencyKey()).send({ source: 'entered_dbfs', rigId: 'kb-line2-rig1', inputChannel: 0, dbfsAtOnePascal });
    expect(calibration.status, JSON.stringify(calibration.body)).toBe(201);
    calibrationId = calibration.body.id;
    const sweep = renderSweep(designSynchronizedSweep(sweepParameters));
    calibrated = await responseAnalysis({ calibration: { calibrationId }, conditions: { distanceM, driveVoltageVrms } }, sweep.map((x) => gain * x));
  });

  it('computes the closed-form sensitivity of a pure gain through a known calibration', async () => {
    // A pure gain g reads 20·log10(g) dB re the stimulus; calibrated: L = 20·log10(g) + L_sweep,dBFS − dBFS@1Pa + 93.98
    // dB SPL at every frequency (AES17 dBFS; ISO 1683 20 µPa), so the power mean over any band is L itself.
    const levelDbSpl = 20 * Math.log10(gain) + sweepLevelDbfs - dbfsAtOnePascal + onePascalDbSpl;
    // Inverse-square law to 1 m: + 20·log10(r / 1 m); per 2.83 V: + 20·log10(2.83 / V); per 1 W into Z: V = √(1 W·Z)
    // (IEC 60268-5 rating terms, from memory).
    const atOneMetre = levelDbSpl + 20 * Math.log10(distanceM / 1);
    const per2p83Volts = atOneMetre + 20 * Math.log10(2.83 / driveVoltageVrms);
    const perWatt = atOneMetre + 20 * Math.log10(Math.sqrt(nominalImpedanceOhm) / driveVoltageVrms);
    const response = await deriveSensitivity({ responseAnalysisId: calibrated.id, bandHz: [300, 3000] });
    expect(response.status, JSON.stringify(response.body)).toBe(200);
    expect(response.body.status, JSON.stringify(response.body.error)).toBe('succeeded');
    const { figures, conventions } = response.body.result;
    expect(figures.measuredLevelDbSpl).toBeCloseTo(levelDbSpl, 1);
    expect(Math.abs(figures.measuredLevelDbSpl - levelDbSpl)).toBeLessThan(0.02);
    expect(Math.abs(figures.levelAtOneMetreDbSpl - atOneMetre)).toBeLessThan(0.02);
    expect(Math.abs(figures.dbSplAt2p83VoltsOneMetre - per2p83Volts)).toBeLessThan(0.02);
    expect(Math.abs(figures.dbSplAtOneWattOneMetre - perWatt)).toBeLessThan(0.02);
    expect(figures).toMatchObject({ bandHz: [300, 3000], bandAverage: 'power', measuredDistanceM: distanceM, driveVoltageVrms, sourceAnalysisId: calibrated.id });
    expect(conventions.sensitivity).toContain('power mean');
    expect(conventions.sensitivity).toContain('300–3000 Hz');
    expect(conventions.sensitivity).toContain(`measured at ${distanceM} m for ${driveVoltageVrms} V RMS`);
    expect(conventions.sensitivity).toContain('2.83 V RMS and to 1 W into 4 Ω');
    expect(conventions.source).toContain(calibrationId);
    // The levels rest on the source's calibration: it is the analysis's calibration, and no uncalibrated warning.
    expect(response.body.calibration.id).toBe(calibrationId);
    expect(response.body.warnings.map((w: { code: string }) => w.code)).not.toContain('uncalibrated');
    expect(response.body.captureId).toBeNull();
  });

  it('refuses an uncalibrated source, a failed one and another organisation\'s with 422 naming the reason', async () => {
    const sweep = renderSweep(designSynchronizedSweep(sweepParameters));
    const uncalibrated = await responseAnalysis({ conditions: { distanceM, driveVoltageVrms } }, sweep);
    const refusedUncalibrated = await deriveSensitivity({ responseAnalysisId: uncalibrated.id });
    expect(refusedUncalibrated.status).toBe(422);
    expect(refusedUncalibrated.body).toMatchObject({ code: 'source_analysis_unusable', reason: 'uncalibrated' });
    expect(refusedUncalibrated.body.errors[0].pointer).toBe('#/sensitivity/responseAnalysisId');

    // An offset past the end of the capture is only found when the job reads the samples: the analysis fails.
    const failed = await responseAnalysis({ calibration: { calibrationId }, conditions: { distanceM, driveVoltageVrms }, options: { captureOffsetSeconds: 60 } }, sweep);
    expect(failed.status).toBe('failed');
    const refusedFailed = await deriveSensitivity({ responseAnalysisId: failed.id });
    expect(refusedFailed.status).toBe(422);
    expect(refusedFailed.body).toMatchObject({ code: 'source_analysis_unusable', reason: 'not_succeeded', sourceStatus: 'failed' });

    const outsider = await signUp(m.context, { organisationName: 'Other Org' });
    const outsiderKey = (await createApiKey(outsider.agent, ['analyses:read', 'analyses:write'], { name: 'other rig' })).secret;
    const foreign = await deriveSensitivity({ responseAnalysisId: calibrated.id }, {}, outsiderKey);
    expect(foreign.status).toBe(422);
    expect(foreign.body.reason).toBe('not_found');
  });

  it('refuses conflicting conditions, a band off the curve and inputs that do not belong', async () => {
    const conflict = await deriveSensitivity({ responseAnalysisId: calibrated.id }, { conditions: { nominalImpedanceOhm, driveVoltageVrms: 2.83 } });
    expect(conflict.status).toBe(422);
    expect(conflict.body.reason).toBe('conditions_conflict');
    const offCurve = await deriveSensitivity({ responseAnalysisId: calibrated.id, bandHz: [300, 40_000] });
    expect(offCurve.status).toBe(422);
    expect(offCurve.body.errors[0].pointer).toBe('#/sensitivity/bandHz');
    const withCalibration = await deriveSensitivity({ responseAnalysisId: calibrated.id }, { calibration: { calibrationId } });
    expect(withCalibration.status).toBe(400);
    expect(withCalibration.body.errors[0].pointer).toBe('#/calibration');
    const microphone = await deriveSensitivity({ responseAnalysisId: calibrated.id, deviceType: 'microphone' });
    expect(microphone.status).toBe(400);
    expect(microphone.body.errors[0].pointer).toBe('#/sensitivity/deviceType');
  });
});
