import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { analyses } from '@server/db/tables';
import { manualClock } from '@server/lib/clock';
import { newId } from '@server/lib/ids';
import { evaluateResolvedMask, getMaskForAnalysis } from '@server/modules/masks/masks.service';
import { setOrganisationPlan } from '@server/modules/usage/organisation-plan.service';
import { bearer, createApiKey, organisationWithRoles, signUp, type OrganisationWithRoles, type SignedUp } from '../support/actors';
import { createTestContext, type TestContext } from '../support/test-app';

const clock = manualClock(new Date(Math.ceil(Date.now() / 60_000) * 60_000));
let context: TestContext;
let kb: OrganisationWithRoles;
let other: SignedUp;
let key: string;

beforeAll(async () => {
  context = await createTestContext({ clock });
  kb = await organisationWithRoles(context);
  other = await signUp(context, { organisationName: 'Other Lab' });
  await setOrganisationPlan(context.deps, kb.organisationId, { planId: 'line', limitOverrides: { requestsPerMinute: 100_000 } });
  key = (await createApiKey(kb.owner.agent, ['masks:write', 'masks:read', 'analyses:read'])).secret;
});
afterAll(async () => {
  await context?.close();
});

const api = () => ({
  get: (path: string) => request(context.app).get(path).set(bearer(key)),
  post: (path: string, body: unknown) => request(context.app).post(path).set(bearer(key)).send(body as object),
});

const flatLimits = (upperDb: number, lowerDb: number) => ({
  upper: [
    { frequencyHz: 100, levelDb: upperDb },
    { frequencyHz: 10_000, levelDb: upperDb },
  ],
  lower: [
    { frequencyHz: 100, levelDb: lowerDb },
    { frequencyHz: 10_000, levelDb: lowerDb },
  ],
});

/** A succeeded analysis row with a given response curve, as the worker stores it. */
async function storedAnalysis(orgId: string, frequencyHz: number[], magnitudeDb: number[], status = 'succeeded'): Promise<string> {
  const id = newId('analysis');
  const now = clock.now();
  await context.deps.db.insert(analyses).values({
    id,
    organisationId: orgId,
    kind: 'frequency_response',
    status,
    progress: 1,
    request: { kind: 'frequency_response' },
    dutModel: 'KB-65 woofer',
    dutSerial: `KB65-24-${id.slice(-6)}`,
    dutLot: 'LOT-2024-11A',
    tags: ['golden'],
    audioSeconds: 2,
    attempts: 1,
    cancelRequested: 0,
    resultJson:
      status === 'succeeded'
        ? JSON.stringify({ kind: 'frequency_response', engineVersion: 'test', conventions: {}, figures: {}, curves: { frequencyHz, magnitudeDb }, warnings: [] })
        : null,
    createdAt: now,
    updatedAt: now,
  });
  return id;
}

describe('tolerance masks', () => {
  it('creates a mask, and a change is a new version that leaves the old one untouched', async () => {
    const created = await api().post('/v1/masks', { name: 'KB-65 woofer production limits', levelReference: 'absolute', ...flatLimits(95, 85) });
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    expect(created.body).toMatchObject({ name: 'KB-65 woofer production limits', latestVersion: 1, current: { version: 1, levelReference: 'absolute' } });
    const maskId = created.body.id as string;
    const v1 = (await api().get(`/v1/masks/${maskId}/versions/1`)).body;

    const changed = await api().post(`/v1/masks/${maskId}/versions`, { levelReference: 'absolute', ...flatLimits(94, 86), note: 'tightened' });
    expect(changed.status).toBe(201);
    expect(changed.body.version).toBe(2);
    expect(changed.headers.location).toBe(`/v1/masks/${maskId}/versions/2`);
    expect((await api().get(`/v1/masks/${maskId}/versions/1`)).body).toEqual(v1);
    expect((await api().get(`/v1/masks/${maskId}`)).body).toMatchObject({ latestVersion: 2, current: { version: 2, note: 'tightened' } });
    const versions = await api().get(`/v1/masks/${maskId}/versions`);
    expect(versions.body.data.map((version: { version: number }) => version.version)).toEqual([2, 1]);

    const latest = await getMaskForAnalysis(context.deps, kb.organisationId, maskId);
    const first = await getMaskForAnalysis(context.deps, kb.organisationId, maskId, 1);
    expect([latest.version, latest.mask.upper![0].levelDb]).toEqual([2, 94]);
    expect([first.version, first.mask.upper![0].levelDb]).toEqual([1, 95]);
    await expect(getMaskForAnalysis(context.deps, kb.organisationId, maskId, 3)).rejects.toMatchObject({ code: 'mask_not_found', status: 422 });
  });

  it('gives concurrent changes consecutive version numbers', async () => {
    const created = await api().post('/v1/masks', { name: 'KB-T25 tweeter', levelReference: 'absolute', ...flatLimits(95, 85) });
    const maskId = created.body.id as string;
    const results = await Promise.all([1, 2, 3, 4].map((i) => api().post(`/v1/masks/${maskId}/versions`, { levelReference: 'absolute', ...flatLimits(95 + i, 85) })));
    expect(results.map((result) => result.status)).toEqual([201, 201, 201, 201]);
    expect(results.map((result) => result.body.version).sort()).toEqual([2, 3, 4, 5]);
  });

  it('checks the limits and the reference rule', async () => {
    const descending = await api().post('/v1/masks', {
      name: 'bad',
      levelReference: 'absolute',
      upper: [
        { frequencyHz: 1000, levelDb: 3 },
        { frequencyHz: 100, levelDb: 3 },
      ],
    });
    expect(descending.status).toBe(422);
    expect(descending.body.code).toBe('mask_invalid');
    expect(descending.body.errors[0].pointer).toBe('#/upper/1/frequencyHz');
    const crossed = await api().post('/v1/masks', { name: 'bad', levelReference: 'absolute', ...flatLimits(85, 95) });
    expect(crossed.status).toBe(422);
    const relativeWithoutReference = await api().post('/v1/masks', { name: 'bad', levelReference: 'relative', ...flatLimits(3, -3) });
    expect(relativeWithoutReference.status).toBe(422);
    expect(relativeWithoutReference.body.errors[0].pointer).toBe('#/referenceLevel');
    const empty = await api().post('/v1/masks', { name: 'bad', levelReference: 'absolute' });
    expect(empty.status).toBe(422);
  });

  it('judges a curve against a relative mask at its own reference level', async () => {
    const created = await api().post('/v1/masks', {
      name: 'KB-65 relative ±3 dB',
      levelReference: 'relative',
      referenceLevel: { kind: 'at_frequency', frequencyHz: 1000 },
      ...flatLimits(3, -3),
    });
    expect(created.status).toBe(201);
    const resolved = await getMaskForAnalysis(context.deps, kb.organisationId, created.body.id);
    // Curve 90 dB at 100 Hz and 1 kHz, 92.5 dB at 10 kHz (linear in log f between): reference 90 dB, limits 87–93 dB.
    const curve = { frequencyHz: Float64Array.from([100, 1000, 10_000]), magnitudeDb: Float64Array.from([90, 90, 92.5]) };
    const verdict = evaluateResolvedMask(resolved, curve);
    expect(verdict.verdict).toBe('pass');
    expect(verdict.upper!.worstMarginDb).toBeCloseTo(0.5, 12); // 93 − 92.5 at 10 kHz
    expect(verdict.upper!.worstMarginFrequencyHz).toBe(10_000);
    expect(verdict.lower!.worstMarginDb).toBeCloseTo(3, 12);
    const loud = { frequencyHz: curve.frequencyHz, magnitudeDb: Float64Array.from([90, 90, 94]) };
    expect(evaluateResolvedMask(resolved, loud).verdict).toBe('fail');
  });

  it('derives mean ± max(k·σ, minimum) from golden analyses', async () => {
    const frequencyHz = [100, 1000, 10_000];
    const ids = [
      await storedAnalysis(kb.organisationId, frequencyHz, [90, 92, 88]),
      await storedAnalysis(kb.organisationId, frequencyHz, [91, 93, 90]),
      await storedAnalysis(kb.organisationId, frequencyHz, [92, 94, 86]),
    ];
    const derived = await api().post('/v1/masks/derive', { name: 'KB-65 golden units', analysisIds: ids, k: 2, minHalfWidthDb: 2.5 });
    expect(derived.status, JSON.stringify(derived.body)).toBe(201);
    // By hand: means 91, 93, 88 dB; sample σ (n − 1) = 1, 1, 2 dB; half-width max(2σ, 2.5) = 2.5, 2.5, 4 dB.
    const version = derived.body.current;
    expect(version.derivation.meanDb).toEqual([91, 93, 88]);
    expect(version.derivation.standardDeviationDb).toEqual([1, 1, 2]);
    expect(version.derivation.halfWidthDb).toEqual([2.5, 2.5, 4]);
    expect(version.upper.map((point: { levelDb: number }) => point.levelDb)).toEqual([93.5, 95.5, 92]);
    expect(version.lower.map((point: { levelDb: number }) => point.levelDb)).toEqual([88.5, 90.5, 84]);
    expect(version.derivation.analysisIds).toEqual(ids);

    const asVersion = await api().post('/v1/masks/derive', { name: 'ignored', maskId: derived.body.id, analysisIds: ids, k: 3, minHalfWidthDb: 0 });
    expect(asVersion.status).toBe(201);
    expect(asVersion.body).toMatchObject({ id: derived.body.id, latestVersion: 2 });
    expect(asVersion.body.current.upper.map((point: { levelDb: number }) => point.levelDb)).toEqual([94, 96, 94]);

    const pending = await storedAnalysis(kb.organisationId, frequencyHz, [], 'running');
    const refused = await api().post('/v1/masks/derive', { name: 'x', analysisIds: [...ids, pending], k: 2 });
    expect(refused.status).toBe(422);
    expect(refused.body).toMatchObject({ code: 'golden_analyses_unusable', analysisIds: [pending] });
  });

  it('keeps masks inside the organisation and away from viewers\' writes', async () => {
    const created = await api().post('/v1/masks', { name: 'KB-H40 headphone', levelReference: 'absolute', ...flatLimits(100, 80) });
    const maskId = created.body.id as string;
    for (const path of [`/v1/masks/${maskId}`, `/v1/masks/${maskId}/versions`, `/v1/masks/${maskId}/versions/1`]) {
      const response = await other.agent.get(path);
      expect(response.status, path).toBe(404);
    }
    expect((await other.agent.post(`/v1/masks/${maskId}/versions`).send({ levelReference: 'absolute', ...flatLimits(100, 80) })).status).toBe(404);
    expect((await other.agent.get('/v1/masks')).body.data).toEqual([]);
    await expect(getMaskForAnalysis(context.deps, other.organisationId, maskId)).rejects.toMatchObject({ code: 'mask_not_found' });
    const viewer = await kb.viewer.agent.post('/v1/masks').send({ name: 'x', levelReference: 'absolute', ...flatLimits(100, 80) });
    expect(viewer.status).toBe(403);
    expect((await kb.viewer.agent.get(`/v1/masks/${maskId}`)).status).toBe(200);
    expect((await kb.analyst.agent.post('/v1/masks').send({ name: 'analyst mask', levelReference: 'absolute', ...flatLimits(100, 80) })).status).toBe(201);
  });
});
