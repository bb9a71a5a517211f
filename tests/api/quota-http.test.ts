import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { setOrganisationPlan } from '@server/modules/usage/organisation-plan.service';
import { bearer, createApiKey, signUp, type SignedUp } from '../support/actors';
import { createTestContext, type TestContext } from '../support/test-app';

let context: TestContext;
let lab: SignedUp;
let rigKey: string;

beforeAll(async () => {
  context = await createTestContext();
  lab = await signUp(context);
  await setOrganisationPlan(context.deps, lab.organisationId, { planId: 'bench', limitOverrides: { analysesPerMonth: 20, requestsPerMinute: 100_000 } });
  rigKey = (await createApiKey(lab.agent, ['analyses:write', 'analyses:read', 'usage:read'])).secret;
});
afterAll(async () => {
  await context?.close();
});

const spectrumAnalysis = (serial: string) => ({
  kind: 'spectrum',
  spectrum: { frequenciesHz: [100, 1000, 10_000], magnitudeDb: [88, 90, 87], magnitudeReference: 'db_spl' },
  dut: { model: 'KB-65 woofer', serial, lot: 'LOT-2024-11A' },
});
const post = (body: unknown, key: string) =>
  request(context.app).post('/v1/analyses').set(bearer(rigKey)).set('Idempotency-Key', key).send(body as object);
const used = async () => (await request(context.app).get('/v1/usage').set(bearer(rigKey))).body.analyses.used as number;

describe('quota over HTTP', () => {
  it('refused requests are not charged', async () => {
    const invalid = await post({ kind: 'spectrum' }, 'kb-invalid-1');
    expect(invalid.status).toBeGreaterThanOrEqual(400);
    expect(invalid.status).toBeLessThan(500);
    const noKey = await request(context.app).post('/v1/analyses').set(bearer(rigKey)).send(spectrumAnalysis('KB65-24-000001'));
    expect(noKey.status).toBe(400);
    const anonymous = await request(context.app).post('/v1/analyses').set('Idempotency-Key', 'kb-anon-1').send(spectrumAnalysis('KB65-24-000001'));
    expect(anonymous.status).toBe(401);
    expect(await used()).toBe(0);
  });

  it('accepts exactly 20 of 50 parallel analyses against a quota of 20', async () => {
    const responses = await Promise.all(
      Array.from({ length: 50 }, (_, i) => post(spectrumAnalysis(`KB65-24-${String(100 + i).padStart(6, '0')}`), `kb-line2-${i}`)),
    );
    const statuses = responses.map((response) => response.status);
    expect(statuses.filter((status) => status === 202 || status === 200)).toHaveLength(20);
    expect(statuses.filter((status) => status === 429)).toHaveLength(30);
    const refused = responses.find((response) => response.status === 429)!;
    expect(refused.body).toMatchObject({ code: 'quota_exceeded', 'violated-policies': ['monthly-analyses'], limit: 20 });
    expect(typeof refused.body.resetsAt).toBe('string');
    expect(await used()).toBe(20);
    // A retry of an accepted request replays it and is not charged again.
    const acceptedIndex = statuses.findIndex((status) => status === 202 || status === 200);
    const replay = await post(spectrumAnalysis(`KB65-24-${String(100 + acceptedIndex).padStart(6, '0')}`), `kb-line2-${acceptedIndex}`);
    expect(replay.headers['idempotent-replayed']).toBe('true');
    expect(replay.body.id).toBe(responses[acceptedIndex].body.id);
    expect(await used()).toBe(20);
  });
});
