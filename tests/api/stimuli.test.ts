import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readWav, STIMULUS_CAUTIONS } from '@shared/dsp';
import { auth, idempotencyKey, measureContext, type MeasureContext } from './analyses-fixtures';

let m: MeasureContext;
beforeAll(async () => {
  m = await measureContext({ runJobs: false });
});
afterAll(async () => {
  await m?.close();
});

// supertest's parser hook for binary bodies.
const binary = (res: import('supertest').Response, done: (error: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  (res as unknown as NodeJS.ReadableStream).on('data', (chunk: Buffer) => chunks.push(chunk));
  (res as unknown as NodeJS.ReadableStream).on('end', () => done(null, Buffer.concat(chunks)));
};

describe('stimuli', () => {
  it('creates a sweep with the design, the cautions and a deterministic, cacheable WAV', async () => {
    const parameters = { startHz: 20, stopHz: 20_000, approximateDurationSeconds: 1, sampleRateHz: 48_000 };
    const created = await m.api().post('/v1/stimuli').set(auth(m.key)).set(idempotencyKey()).send({ name: 'KB-T25 tweeter sweep', type: 'sweep', parameters });
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    expect(created.body.cautions).toEqual([...STIMULUS_CAUTIONS]);
    expect(created.body.parameters.levelDbfs).toBe(-20);
    // Novak et al., JAES 63(10) 2015: L = round(f1·T/ln(f2/f1))/f1, so f1·L is an integer.
    const L = created.body.design.rateConstantSeconds as number;
    expect(Number.isInteger(Math.round(20 * L * 1e9) / 1e9)).toBe(true);

    const first = await m.api().get(`/v1/stimuli/${created.body.id}/audio?encoding=pcm24`).set(auth(m.key)).buffer(true).parse(binary);
    const second = await m.api().get(`/v1/stimuli/${created.body.id}/audio?encoding=pcm24`).set(auth(m.key)).buffer(true).parse(binary);
    expect(first.status).toBe(200);
    expect(first.headers['content-disposition']).toMatch(/attachment; filename=".*pcm24\.wav"/);
    expect(Buffer.compare(first.body as Buffer, second.body as Buffer)).toBe(0);
    const decoded = readWav(new Uint8Array(first.body as Buffer));
    expect(decoded).toMatchObject({ sampleRateHz: 48_000, channelCount: 1, bitsPerSample: 24, frameCount: created.body.totalSampleCount });
    const cached = await m.api().get(`/v1/stimuli/${created.body.id}/audio?encoding=pcm24`).set(auth(m.key)).set('If-None-Match', first.headers.etag);
    expect(cached.status).toBe(304);
    const float = await m.api().get(`/v1/stimuli/${created.body.id}/audio`).set(auth(m.key));
    expect(float.headers.etag).not.toBe(first.headers.etag);
  });

  it('refuses impossible parameters with the engine code and a pointer', async () => {
    const response = await m.api().post('/v1/stimuli').set(auth(m.key)).set(idempotencyKey())
      .send({ type: 'sweep', parameters: { startHz: 20, stopHz: 30_000, approximateDurationSeconds: 1, sampleRateHz: 48_000 } });
    expect(response.status).toBe(422);
    expect(response.body).toMatchObject({ code: 'invalid_parameters', engineCode: 'sweep_stop_above_nyquist' });
    expect(response.body.errors[0].pointer).toBe('#/parameters/stopHz');
    const unknown = await m.api().post('/v1/stimuli').set(auth(m.key)).set(idempotencyKey()).send({ type: 'sweep', parameters: { startHz: 20, stopHz: 2000, approximateDurationSeconds: 1, sampleRateHz: 48_000, gain: 3 } });
    expect(unknown.status).toBe(400);
  });

  it('stepped-sine plans and calibrator checks; lists with a cursor', async () => {
    for (const body of [
      { type: 'stepped_sine', parameters: { startHz: 100, stopHz: 10_000, bandsPerOctave: 3, sampleRateHz: 48_000 } },
      { type: 'calibrator_check', parameters: { frequencyHz: 1000, durationSeconds: 2, sampleRateHz: 48_000 } },
    ]) {
      const response = await m.api().post('/v1/stimuli').set(auth(m.key)).set(idempotencyKey()).send(body);
      expect(response.status, JSON.stringify(response.body)).toBe(201);
    }
    const page = await m.api().get('/v1/stimuli?limit=2').set(auth(m.key));
    expect(page.body.data).toHaveLength(2);
    expect(page.body.hasMore).toBe(true);
    const next = await m.api().get(`/v1/stimuli?limit=2&cursor=${encodeURIComponent(page.body.nextCursor)}`).set(auth(m.key));
    expect(next.body.data.length).toBeGreaterThan(0);
    expect(next.body.data[0].id).not.toBe(page.body.data[1].id);
  });
});
