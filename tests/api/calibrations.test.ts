import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { writeWav } from '@shared/dsp';
import { manualClock } from '@server/lib/clock';
import { resolveCalibrationForAnalysis } from '@server/modules/calibrations/calibrations.service';
import { setOrganisationPlan } from '@server/modules/usage/organisation-plan.service';
import { bearer, createApiKey, organisationWithRoles, signUp, type OrganisationWithRoles, type SignedUp } from '../support/actors';
import { createTestContext, type TestContext } from '../support/test-app';

const clock = manualClock(new Date(Math.ceil(Date.now() / 60_000) * 60_000));
let context: TestContext;
let kb: OrganisationWithRoles;
let other: SignedUp;
let rigKey: string;
let keyCounter = 0;

beforeAll(async () => {
  context = await createTestContext({ clock });
  kb = await organisationWithRoles(context);
  other = await signUp(context, { organisationName: 'Other Lab' });
  await setOrganisationPlan(context.deps, kb.organisationId, { planId: 'line', limitOverrides: { requestsPerMinute: 100_000 } });
  rigKey = (await createApiKey(kb.owner.agent, ['captures:write', 'captures:read', 'calibrations:write', 'calibrations:read'])).secret;
});
afterAll(async () => {
  await context?.close();
});

// 20·log10(1 Pa / 20 µPa) = 93.9794 dB: ISO 1683 reference pressure for sound in air.
const DB_SPL_OF_ONE_PASCAL = 20 * Math.log10(1 / 20e-6);

function toneWav(amplitude: number, frequencyHz: number, channel: number): Buffer {
  const sampleRateHz = 48_000;
  const frames = sampleRateHz; // 1 s
  const channels = [new Float64Array(frames), new Float64Array(frames)];
  for (let n = 0; n < frames; n++) channels[channel][n] = amplitude * Math.sin((2 * Math.PI * frequencyHz * n) / sampleRateHz);
  return Buffer.from(writeWav({ sampleRateHz, channels, encoding: 'float32' }));
}

async function uploadCapture(wav: Buffer): Promise<string> {
  const response = await request(context.app)
    .post('/v1/captures')
    .set(bearer(rigKey))
    .set('Idempotency-Key', `cal-upload-${++keyCounter}-${Date.now()}`)
    .attach('file', wav, { filename: 'kb-m10-calibrator.wav', contentType: 'audio/wav' });
  expect(response.status, JSON.stringify(response.body)).toBe(201);
  return response.body.id as string;
}

const createCalibration = (body: Record<string, unknown>, token = rigKey) =>
  request(context.app).post('/v1/calibrations').set(bearer(token)).set('Idempotency-Key', `cal-${++keyCounter}-${Date.now()}`).send(body);

describe('calibrations', () => {
  it('measures the chain sensitivity from a calibrator capture', async () => {
    // A 94 dB SPL calibrator read as a sine of peak 0.1 = −20 dBFS (AES17: full-scale sine = 0 dBFS) on input 1.
    const captureId = await uploadCapture(toneWav(0.1, 1000, 1));
    const response = await createCalibration({
      source: 'calibrator_capture',
      rigId: 'kb-line2-rig1',
      inputChannel: 1,
      captureId,
      channel: 1,
      statedLevelDbSpl: 94,
      statedFrequencyHz: 1000,
      notes: 'KB-M10 measurement mic, class 1 calibrator',
    });
    expect(response.status, JSON.stringify(response.body)).toBe(201);
    expect(response.headers.location).toBe(`/v1/calibrations/${response.body.id}`);
    // dBFS at 1 Pa = L_tone − (L_cal − 93.979 dB) = −20 − 0.0206 = −20.0206 dB.
    expect(response.body.dbfsAtOnePascal).toBeCloseTo(-20 - (94 - DB_SPL_OF_ONE_PASCAL), 2);
    expect(response.body).toMatchObject({ source: 'calibrator_capture', rigId: 'kb-line2-rig1', inputChannel: 1, status: 'valid', validUntil: null });
    expect(response.body.details).toMatchObject({ captureId, channel: 1, statedLevelDbSpl: 94, statedFrequencyHz: 1000 });
    expect(response.body.details.measuredFrequencyHz).toBeCloseTo(1000, 1);
    expect(response.body.details.toneLevelDbfs).toBeCloseTo(-20, 2);
  });

  it('refuses a capture that holds no steady calibrator tone', async () => {
    const captureId = await uploadCapture(toneWav(0.1, 1000, 1));
    const silentChannel = await createCalibration({ source: 'calibrator_capture', rigId: 'kb-line2-rig1', inputChannel: 0, captureId, channel: 0, statedLevelDbSpl: 94 });
    expect(silentChannel.status).toBe(422);
    expect(silentChannel.body.code).toBe('calibration_invalid');
    const wrongFrequency = await createCalibration({ source: 'calibrator_capture', rigId: 'kb-line2-rig1', inputChannel: 1, captureId, channel: 1, statedLevelDbSpl: 94, statedFrequencyHz: 250 });
    expect(wrongFrequency.status).toBe(422);
    const missing = await createCalibration({ source: 'calibrator_capture', rigId: 'kb-line2-rig1', inputChannel: 1, captureId: 'cap_doesnotexist000000', statedLevelDbSpl: 94 });
    expect(missing.status).toBe(404);
    expect(missing.body.errors[0].pointer).toBe('#/captureId');
  });

  it('converts a microphone sensitivity and ADC full scale to dBFS at 1 Pa', async () => {
    // 12.5 mV/Pa into a converter whose full-scale sine is 1.0 V RMS: 20·log10(0.0125 / 1.0) = −38.062 dBFS
    // (IEC 60268-4 sensitivity in V/Pa; AES17 full scale). The same converter quoted as 1.4142 V peak gives the same.
    const rms = await createCalibration({ source: 'entered_microphone', rigId: 'kb-line1-rig3', inputChannel: 0, microphoneMillivoltsPerPascal: 12.5, adcFullScaleVoltsRms: 1.0 });
    expect(rms.status, JSON.stringify(rms.body)).toBe(201);
    expect(rms.body.dbfsAtOnePascal).toBeCloseTo(-38.0618, 3);
    expect(rms.body.details.dbvPerPascal).toBeCloseTo(-38.0618, 3);
    const peak = await createCalibration({ source: 'entered_microphone', rigId: 'kb-line1-rig3', inputChannel: 1, microphoneMillivoltsPerPascal: 12.5, adcFullScaleVoltsPeak: Math.SQRT2 });
    expect(peak.body.dbfsAtOnePascal).toBeCloseTo(-38.0618, 3);
    const both = await createCalibration({ source: 'entered_microphone', rigId: 'kb-line1-rig3', inputChannel: 1, microphoneMillivoltsPerPascal: 12.5, adcFullScaleVoltsRms: 1, adcFullScaleVoltsPeak: 1.4 });
    expect(both.status).toBe(400);
  });

  it('lists and gets calibrations, filtered by rig and input', async () => {
    await createCalibration({ source: 'entered_dbfs', rigId: 'kb-line3-rig1', inputChannel: 0, dbfsAtOnePascal: -30 });
    await createCalibration({ source: 'entered_dbfs', rigId: 'kb-line3-rig1', inputChannel: 1, dbfsAtOnePascal: -31 });
    const list = await kb.viewer.agent.get('/v1/calibrations').query({ rigId: 'kb-line3-rig1', inputChannel: 1 });
    expect(list.status).toBe(200);
    expect(list.body.data.map((item: { dbfsAtOnePascal: number }) => item.dbfsAtOnePascal)).toEqual([-31]);
    const one = await kb.viewer.agent.get(`/v1/calibrations/${list.body.data[0].id}`);
    expect(one.body).toEqual(list.body.data[0]);
  });

  it('resolves the rig input\'s current calibration and flags an expired one', async () => {
    const now = clock.now().getTime();
    const iso = (offsetHours: number) => new Date(now + offsetHours * 3600_000).toISOString();
    const old = await createCalibration({ source: 'entered_dbfs', rigId: 'kb-line4-rig1', inputChannel: 0, dbfsAtOnePascal: -40, validFrom: iso(-48), validUntil: iso(-24) });
    const current = await createCalibration({ source: 'entered_dbfs', rigId: 'kb-line4-rig1', inputChannel: 0, dbfsAtOnePascal: -41, validFrom: iso(-1), validUntil: iso(24) });
    await createCalibration({ source: 'entered_dbfs', rigId: 'kb-line4-rig1', inputChannel: 0, dbfsAtOnePascal: -42, validFrom: iso(48) });
    expect(old.body.status).toBe('expired');

    const applied = await resolveCalibrationForAnalysis(context.deps, kb.organisationId, { rigId: 'kb-line4-rig1', inputChannel: 0 });
    expect(applied).toMatchObject({ id: current.body.id, dbfsAtOnePascal: -41, expired: false, source: 'entered_dbfs' });
    expect(await resolveCalibrationForAnalysis(context.deps, kb.organisationId, undefined)).toBeNull();

    // Two days later the current one has expired and the future one has started.
    const later = await resolveCalibrationForAnalysis(context.deps, kb.organisationId, { rigId: 'kb-line4-rig1', inputChannel: 0 }, new Date(now + 49 * 3600_000));
    expect(later?.dbfsAtOnePascal).toBe(-42);
    const expired = await resolveCalibrationForAnalysis(context.deps, kb.organisationId, { calibrationId: old.body.id });
    expect(expired).toMatchObject({ id: old.body.id, expired: true });

    const settings = await kb.analyst.agent.put('/v1/calibration-settings').send({ expiredCalibration: 'refuse' });
    expect(settings.status).toBe(200);
    expect((await kb.viewer.agent.get('/v1/calibration-settings')).body).toEqual({ expiredCalibration: 'refuse' });
    await expect(resolveCalibrationForAnalysis(context.deps, kb.organisationId, { calibrationId: old.body.id })).rejects.toMatchObject({
      code: 'calibration_expired',
      status: 422,
    });
    await kb.analyst.agent.put('/v1/calibration-settings').send({ expiredCalibration: 'warn' });
    // A rig input whose only calibration expired resolves to it, flagged.
    const onlyExpired = await createCalibration({ source: 'entered_dbfs', rigId: 'kb-line5-rig1', inputChannel: 0, dbfsAtOnePascal: -39, validFrom: iso(-10), validUntil: iso(-5) });
    expect(await resolveCalibrationForAnalysis(context.deps, kb.organisationId, { rigId: 'kb-line5-rig1', inputChannel: 0 })).toMatchObject({ id: onlyExpired.body.id, expired: true });
    await expect(resolveCalibrationForAnalysis(context.deps, kb.organisationId, { rigId: 'kb-line9-rig9', inputChannel: 0 })).rejects.toMatchObject({ code: 'calibration_not_found' });
  });

  it('keeps calibrations inside the organisation and away from viewers\' writes', async () => {
    const mine = await createCalibration({ source: 'entered_dbfs', rigId: 'kb-line2-rig1', inputChannel: 0, dbfsAtOnePascal: -35 });
    const theirs = await other.agent.get(`/v1/calibrations/${mine.body.id}`);
    expect(theirs.status).toBe(404);
    expect(theirs.body.code).toBe('not_found');
    expect((await other.agent.get('/v1/calibrations')).body.data).toEqual([]);
    await expect(resolveCalibrationForAnalysis(context.deps, other.organisationId, { calibrationId: mine.body.id })).rejects.toMatchObject({ code: 'calibration_not_found' });

    const body = { source: 'entered_dbfs', rigId: 'kb-line2-rig1', inputChannel: 0, dbfsAtOnePascal: -35 };
    const viewer = await kb.viewer.agent.post('/v1/calibrations').set('Idempotency-Key', 'viewer-try-1').send(body);
    expect(viewer.status).toBe(403);
    expect(viewer.body.code).toBe('insufficient_permission');
    expect((await kb.viewer.agent.put('/v1/calibration-settings').send({ expiredCalibration: 'refuse' })).status).toBe(403);
    const analyst = await kb.analyst.agent.post('/v1/calibrations').set('Idempotency-Key', 'analyst-try-1').send(body);
    expect(analyst.status).toBe(201);
    expect(analyst.body.createdBy).toBe('KB analyst');
  });
});
