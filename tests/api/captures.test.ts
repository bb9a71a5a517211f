import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApiKey, organisationWithRoles, signUp, type OrganisationWithRoles } from '../support/actors';
import { setOrganisationPlan } from '@server/modules/usage/organisation-plan.service';
import { auth, idempotencyKey, measureContext, wav, type MeasureContext } from './analyses-fixtures';

let m: MeasureContext;
let org: OrganisationWithRoles;
beforeAll(async () => {
  m = await measureContext({ runJobs: false });
  org = await organisationWithRoles(m.context);
});
afterAll(async () => {
  await m?.close();
});

const tone = Float64Array.from({ length: 4800 }, (_, n) => 0.5 * Math.sin((2 * Math.PI * 1000 * n) / 48_000));

describe('captures: roles, deletion, isolation; analyses: quota under concurrency, cancel', () => {
  it('viewer cannot upload; analyst uploads but cannot delete; admin deletes unless analyses use it', async () => {
    const refused = await org.viewer.agent.post('/v1/captures').set(idempotencyKey()).attach('file', wav([tone]), 'a.wav');
    expect(refused.status).toBe(403);
    const uploaded = await org.analyst.agent.post('/v1/captures').set(idempotencyKey()).attach('file', wav([tone]), 'a.wav');
    expect(uploaded.status, JSON.stringify(uploaded.body)).toBe(201);
    expect((await org.analyst.agent.delete(`/v1/captures/${uploaded.body.id}`)).status).toBe(403);
    const calibrator = await org.analyst.agent.post('/v1/analyses').set(idempotencyKey()).send({ kind: 'calibrator', captureId: uploaded.body.id, calibrator: { statedLevelDbSpl: 94 } });
    expect(calibrator.status, JSON.stringify(calibrator.body)).toBe(202);
    const inUse = await org.admin.agent.delete(`/v1/captures/${uploaded.body.id}`);
    expect(inUse.status).toBe(409);
    expect(inUse.body).toMatchObject({ code: 'capture_in_use', analysisIds: [calibrator.body.id] });
    const free = await org.admin.agent.post('/v1/captures').set(idempotencyKey()).attach('file', wav([tone]), 'b.wav');
    expect((await org.admin.agent.delete(`/v1/captures/${free.body.id}`)).status).toBe(204);
    expect((await org.admin.agent.get(`/v1/captures/${free.body.id}`)).status).toBe(404);

    const stranger = await signUp(m.context, { organisationName: 'Another Lab' });
    const strangerKey = await createApiKey(stranger.agent, ['captures:read', 'analyses:read'], { name: 'stranger' });
    expect((await m.api().get(`/v1/captures/${uploaded.body.id}`).set(auth(strangerKey.secret))).status).toBe(404);
    expect((await m.api().get(`/v1/analyses/${calibrator.body.id}`).set(auth(strangerKey.secret))).status).toBe(404);

    const canceled = await org.analyst.agent.post(`/v1/analyses/${calibrator.body.id}/cancel`);
    expect(canceled.status).toBe(200);
    expect(canceled.body.status).toBe('canceled');
    expect((await org.analyst.agent.post(`/v1/analyses/${calibrator.body.id}/cancel`)).status).toBe(409);
  });

  it('50 parallel analyses against a quota of 20 → exactly 20 accepted, the rest 429', async () => {
    await setOrganisationPlan(m.context.deps, m.owner.organisationId, { planId: 'line', limitOverrides: { analysesPerMonth: 20, requestsPerMinute: 10_000 } });
    const spectrum = { frequenciesHz: [100, 1000, 10000], magnitudeDb: [80, 85, 82], magnitudeReference: 'db_spl' };
    const responses = await Promise.all(
      Array.from({ length: 50 }, () => m.api().post('/v1/analyses').set(auth(m.key)).set(idempotencyKey()).send({ kind: 'spectrum', spectrum })),
    );
    const statuses = responses.map((response) => response.status);
    expect(statuses.filter((status) => status === 202)).toHaveLength(20);
    expect(statuses.filter((status) => status === 429)).toHaveLength(30);
    const list = await m.api().get('/v1/analyses?kind=spectrum&limit=100').set(auth(m.key));
    expect(list.body.data).toHaveLength(20);
  });
});
