import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { designSteppedSine, designSynchronizedSweep, renderSteppedSine, renderSweep } from '@shared/dsp';
import { analyses, idempotencyRecords } from '@server/db/tables';
import { eq } from 'drizzle-orm';
import { auth, biquadFilter, biquadMagnitudeDb, idempotencyKey, measureContext, rbjPeakingCoefficients, wav, type MeasureContext } from './analyses-fixtures';

let m: MeasureContext;
beforeAll(async () => {
  m = await measureContext();
});
afterAll(async () => {
  await m?.close();
});

const fs = 48_000;
const sweepParameters = { startHz: 20, stopHz: 20_000, approximateDurationSeconds: 2, sampleRateHz: fs, levelDbfs: -12, trailingSilenceSeconds: 0.5 };

async function createSweepStimulus() {
  const response = await m.api().post('/v1/stimuli').set(auth(m.key)).set(idempotencyKey()).send({ name: 'KB-65 woofer sweep', type: 'sweep', parameters: sweepParameters });
  expect(response.status, JSON.stringify(response.body)).toBe(201);
  return response.body as { id: string };
}

async function upload(bytes: Buffer, filename = 'kb65-24-000123.wav') {
  const response = await m.api().post('/v1/captures').set(auth(m.key)).set(idempotencyKey()).attach('file', bytes, filename);
  expect(response.status, JSON.stringify(response.body)).toBe(201);
  return response.body as { id: string };
}

describe('idempotent replay of a finished analysis', () => {
  it('replays the first answer byte for byte while storing only the analysis id, not a second copy of the result', async () => {
    const stimulus = await createSweepStimulus();
    const capture = await upload(wav([renderSweep(designSynchronizedSweep(sweepParameters))]));
    const key = idempotencyKey();
    const post = () =>
      m.api()
        .post('/v1/analyses')
        .set(auth(m.key))
        .set(key)
        .set('Prefer', 'wait=30')
        .send({ kind: 'frequency_response', captureId: capture.id, stimulusId: stimulus.id, dut: { model: 'KB-65 woofer', serial: 'KB65-24-000777' } });
    const first = await post();
    expect(first.status, JSON.stringify(first.body)).toBe(200);
    expect(first.body.status).toBe('succeeded');

    const [record] = await m.context.deps.db.select().from(idempotencyRecords).where(eq(idempotencyRecords.idempotencyKey, key['Idempotency-Key']));
    expect(record.responseBody).toBe(JSON.stringify({ $replayFrom: first.body.id }));

    const replay = await post();
    expect(replay.status).toBe(200);
    expect(replay.headers['idempotent-replayed']).toBe('true');
    expect(replay.headers.location).toBe(first.headers.location);
    expect(replay.text).toBe(first.text);
    const listed = await m.api().get('/v1/analyses').query({ serial: 'KB65-24-000777' }).set(auth(m.key));
    expect(listed.body.data).toHaveLength(1);
  });
});

describe('frequency response end to end', () => {
  it('recovers a known RBJ peaking filter within ±0.1 dB from 100 Hz to 10 kHz', async () => {
    const stimulus = await createSweepStimulus();
    const sweep = renderSweep(designSynchronizedSweep(sweepParameters));
    // RBJ Audio EQ Cookbook peaking EQ: +6 dB at 1 kHz, Q = 1.
    const { b, a } = rbjPeakingCoefficients(1000, 6, 1, fs);
    const capture = await upload(wav([biquadFilter(sweep, b, a)]));
    const response = await m.api()
      .post('/v1/analyses')
      .set(auth(m.key))
      .set(idempotencyKey())
      .set('Prefer', 'wait=30')
      .send({ kind: 'frequency_response', captureId: capture.id, stimulusId: stimulus.id, dut: { model: 'KB-65 woofer', serial: 'KB65-24-000123', lot: 'LOT-A' }, tags: ['line-2'] });
    expect(response.status, JSON.stringify(response.body)).toBe(200);
    expect(response.headers['preference-applied']).toBe('wait=30');
    expect(response.headers.location).toBe(`/v1/analyses/${response.body.id}`);
    const analysis = response.body;
    expect(analysis.status).toBe('succeeded');
    expect(analysis.warnings.map((w: { code: string }) => w.code)).toContain('uncalibrated');
    const { frequencyHz, magnitudeDb } = analysis.result.curves as { frequencyHz: number[]; magnitudeDb: number[] };
    let checked = 0;
    frequencyHz.forEach((f, i) => {
      if (f < 100 || f > 10_000) return;
      expect(Math.abs(magnitudeDb[i] - biquadMagnitudeDb(b, a, f, fs)), `${f} Hz`).toBeLessThan(0.1);
      checked++;
    });
    expect(checked).toBeGreaterThan(100);

    // Stored text is returned bit for bit (GET and JSON export).
    const [row] = await m.context.deps.db.select().from(analyses).where(eq(analyses.id, analysis.id));
    const got = await m.api().get(`/v1/analyses/${analysis.id}`).set(auth(m.key));
    expect(JSON.stringify(got.body.result)).toBe(row.resultJson);
    const exported = await m.api().get(`/v1/analyses/${analysis.id}/export?format=json`).set(auth(m.key)).buffer(true).parse((res, done) => {
      let text = '';
      res.on('data', (chunk: Buffer) => (text += chunk.toString('utf8')));
      res.on('end', () => done(null, text));
    });
    expect(exported.body).toBe(row.resultJson);
    const csv = await m.api().get(`/v1/analyses/${analysis.id}/export?format=csv`).set(auth(m.key));
    expect(csv.headers['content-type']).toContain('text/csv');
    expect(csv.text).toMatch(/^# analysis: ana_/);
    expect(csv.text).toContain('# convention.magnitudeReference:');
    const header = csv.text.split('\n').find((line) => line.startsWith('frequencyHz'))!;
    expect(header.split(',')).toContain('magnitudeDb');

    // Filters and rerun.
    const list = await m.api().get('/v1/analyses?serial=KB65-24-000123&tag=line-2&status=succeeded').set(auth(m.key));
    expect(list.body.data.map((item: { id: string }) => item.id)).toEqual([analysis.id]);
    const none = await m.api().get('/v1/analyses?tag=other').set(auth(m.key));
    expect(none.body.data).toEqual([]);
    const rerun = await m.api().post(`/v1/analyses/${analysis.id}/rerun`).set(auth(m.key)).set(idempotencyKey()).set('Prefer', 'wait=30').send({ options: { smoothing: { octaveFraction: 6 } } });
    expect(rerun.status, JSON.stringify(rerun.body)).toBe(200);
    expect(rerun.body.rerunOf).toBe(analysis.id);
    expect(rerun.body.result.conventions.smoothing).toContain('1/6');
  });

  it('validates synchronously with JSON pointers', async () => {
    const stimulus = await createSweepStimulus();
    const capture = await upload(wav([new Float64Array(fs * 3)], 44_100));
    const wrongRate = await m.api().post('/v1/analyses').set(auth(m.key)).set(idempotencyKey()).send({ kind: 'frequency_response', captureId: capture.id, stimulusId: stimulus.id });
    expect(wrongRate.status).toBe(422);
    expect(wrongRate.body.errors[0].pointer).toBe('#/stimulusId');
    const badChannel = await m.api().post('/v1/analyses').set(auth(m.key)).set(idempotencyKey()).send({ kind: 'frequency_response', captureId: capture.id, stimulusId: stimulus.id, channels: { measurement: 3 } });
    expect(badChannel.status).toBe(422);
    expect(badChannel.body.errors[0].pointer).toBe('#/channels/measurement');
    const unknownCapture = await m.api().post('/v1/analyses').set(auth(m.key)).set(idempotencyKey()).send({ kind: 'frequency_response', captureId: 'cap_doesnotexist0000000', stimulusId: stimulus.id });
    expect(unknownCapture.status).toBe(404);
    const badOption = await m.api().post('/v1/analyses').set(auth(m.key)).set(idempotencyKey()).send({ kind: 'spectrum', spectrum: { frequenciesHz: [100, 1000, 10000], magnitudeDb: [80, 85, 82], magnitudeReference: 'db_spl' }, options: { smoothing: { octaveFraction: 99 } } });
    expect(badOption.status).toBe(422);
    expect(badOption.body.errors[0].pointer).toBe('#/options/smoothing/octaveFraction');
  });
});

describe('other kinds', () => {
  it('distortion of a known polynomial: HD2 = (a2·A/2)/(1 + 3·a3·A²/4)', async () => {
    const stimulus = await createSweepStimulus();
    const sweep = renderSweep(designSynchronizedSweep(sweepParameters));
    const a2 = 0.05;
    const a3 = 0.02;
    const y = sweep.map((x) => x + a2 * x * x + a3 * x * x * x);
    const capture = await upload(wav([y]));
    const response = await m.api().post('/v1/analyses').set(auth(m.key)).set(idempotencyKey()).set('Prefer', 'wait=30')
      .send({ kind: 'distortion', captureId: capture.id, stimulusId: stimulus.id, options: { maxOrder: 5 } });
    expect(response.status, JSON.stringify(response.body)).toBe(200);
    expect(response.body.status, JSON.stringify(response.body.error)).toBe('succeeded');
    const curves = response.body.result.curves.harmonicDistortion as { frequencyHz: number[]; orders: { order: number; percent: (number | null)[] }[] };
    const amplitude = 10 ** (-12 / 20);
    // Trigonometric power identities: x² = (1 − cos 2θ)/2, x³ = (3 sin θ − sin 3θ)/4 → fundamental A(1 + 3a3A²/4), 2nd harmonic a2A²/2.
    const expectedHd2Percent = (100 * (a2 * amplitude / 2)) / (1 + (3 * a3 * amplitude * amplitude) / 4);
    const hd2 = curves.orders.find((order) => order.order === 2)!;
    const i = curves.frequencyHz.findIndex((f) => f >= 1000);
    expect(Math.abs((hd2.percent[i] as number) - expectedHd2Percent) / expectedHd2Percent).toBeLessThan(0.02);
  });

  it('stepped sine through a gain of 0.5 reads 20·log10(0.5) dB at every step', async () => {
    const parameters = { startHz: 100, stopHz: 10_000, bandsPerOctave: 3, sampleRateHz: fs, levelDbfs: -12 };
    const stimulus = await m.api().post('/v1/stimuli').set(auth(m.key)).set(idempotencyKey()).send({ type: 'stepped_sine', parameters });
    const played = renderSteppedSine(designSteppedSine(parameters));
    const capture = await upload(wav([played.map((x) => 0.5 * x)]));
    const response = await m.api().post('/v1/analyses').set(auth(m.key)).set(idempotencyKey()).set('Prefer', 'wait=30')
      .send({ kind: 'stepped_sine', captureId: capture.id, stimulusId: stimulus.body.id });
    expect(response.status, JSON.stringify(response.body)).toBe(200);
    expect(response.body.status, JSON.stringify(response.body.error)).toBe('succeeded');
    const magnitudeDb = response.body.result.curves.magnitudeDb as number[];
    expect(magnitudeDb.length).toBeGreaterThan(15);
    // Closed form: a pure gain g reads 20·log10(g) at every coherent step.
    for (const level of magnitudeDb) expect(Math.abs(level - 20 * Math.log10(0.5))).toBeLessThan(0.01);
  });

  it('calibrator: 1 kHz at peak A with a 94 dB SPL calibrator → 1 Pa reads 20·log10(A) − (94 − 93.98) dBFS', async () => {
    const amplitude = 0.1;
    const tone = Float64Array.from({ length: fs * 3 }, (_, n) => amplitude * Math.sin((2 * Math.PI * 1000 * n) / fs));
    const capture = await upload(wav([tone]));
    const response = await m.api().post('/v1/analyses').set(auth(m.key)).set(idempotencyKey()).set('Prefer', 'wait=30')
      .send({ kind: 'calibrator', captureId: capture.id, calibrator: { statedLevelDbSpl: 94, statedFrequencyHz: 1000 } });
    expect(response.status, JSON.stringify(response.body)).toBe(200);
    expect(response.body.status, JSON.stringify(response.body.error)).toBe('succeeded');
    // AES17: a sine of peak A reads 20·log10(A) dBFS; 1 Pa = 20·log10(1/20e-6) = 93.98 dB SPL (ISO 1683 reference).
    const expected = 20 * Math.log10(amplitude) - (94 - 20 * Math.log10(1 / 20e-6));
    expect(response.body.result.figures.chainSensitivityDbfsAtOnePascal).toBeCloseTo(expected, 2);
  });

  it('spectrum input (JSON, no WAV) gives band limits on the supplied grid', async () => {
    const frequenciesHz = [50, 100, 200, 500, 1000, 2000, 5000, 10000, 20000];
    const response = await m.api().post('/v1/analyses').set(auth(m.key)).set(idempotencyKey()).set('Prefer', 'wait=30')
      .send({ kind: 'spectrum', spectrum: { frequenciesHz, magnitudeDb: frequenciesHz.map(() => 87), magnitudeReference: 'db_spl' }, options: { thirdOctaveTable: false } });
    expect(response.status, JSON.stringify(response.body)).toBe(200);
    expect(response.body.result.figures.levelAtOneKilohertzDb).toBe(87);
  });

  it('isolation, roles and scopes', async () => {
    const other = await measureContextlessOrg();
    const created = await m.api().post('/v1/analyses').set(auth(m.key)).set(idempotencyKey())
      .send({ kind: 'spectrum', spectrum: { frequenciesHz: [100, 1000, 10000], magnitudeDb: [80, 85, 82], magnitudeReference: 'db_spl' } });
    expect(created.status).toBe(202);
    expect((await m.api().get(`/v1/analyses/${created.body.id}`).set(auth(other))).status).toBe(404);
    const readOnly = await (await import('../support/actors')).createApiKey(m.owner.agent, ['analyses:read'], { name: 'reader' });
    const refused = await m.api().post('/v1/analyses').set(auth(readOnly.secret)).set(idempotencyKey()).send({ kind: 'spectrum' });
    expect(refused.status).toBe(403);
    expect(refused.body.code).toBe('insufficient_scope');
  });
});

async function measureContextlessOrg(): Promise<string> {
  const { signUp, createApiKey } = await import('../support/actors');
  const user = await signUp(m.context, { organisationName: 'Other Org' });
  return (await createApiKey(user.agent, ['analyses:read', 'captures:read'], { name: 'other' })).secret;
}
