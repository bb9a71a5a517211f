import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { randomUUID } from 'node:crypto';
import { signUp, type SignedUp } from '../support/actors';
import { createTestContext, type TestContext } from '../support/test-app';

// Changes to what judges and reports measurements (calibrations, masks, webhook endpoints) are logged with who
// made them, in the same transaction as the change (OWASP API Security Top 10 2019, API10 "Insufficient logging &
// monitoring", from memory; the exact set of logged actions is our choice).
let context: TestContext;
let owner: SignedUp;
const key = () => ({ 'Idempotency-Key': randomUUID() });

beforeAll(async () => {
  context = await createTestContext();
  owner = await signUp(context, { organisationName: 'Kestrel Bay Acoustics' });
});
afterAll(async () => {
  await context?.close();
});

interface AuditEvent {
  action: string;
  objectType: string;
  objectId: string;
  actor: { type: string; id: string; label: string };
  details: Record<string, unknown>;
}

async function eventsAbout(objectId: string): Promise<AuditEvent[]> {
  const response = await owner.agent.get('/v1/audit-events').query({ objectId, limit: 100 });
  expect(response.status, JSON.stringify(response.body)).toBe(200);
  return (response.body.data as AuditEvent[]).reverse(); // oldest first
}

describe('audit events for calibrations, masks and webhook endpoints', () => {
  it('logs a calibration and a change of the expired-calibration policy', async () => {
    const created = await owner.agent.post('/v1/calibrations').set(key()).send({ source: 'entered_dbfs', rigId: 'kb-line2-rig1', inputChannel: 0, dbfsAtOnePascal: -38 });
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    const [event] = await eventsAbout(created.body.id);
    expect(event).toMatchObject({
      action: 'calibration.created',
      objectType: 'calibration',
      actor: { type: 'user', id: owner.userId },
      details: { rigId: 'kb-line2-rig1', inputChannel: 0, source: 'entered_dbfs', dbfsAtOnePascal: -38 },
    });
    expect((await owner.agent.put('/v1/calibration-settings').send({ expiredCalibration: 'refuse' })).status).toBe(200);
    // Saving the same value again changes nothing and logs nothing.
    expect((await owner.agent.put('/v1/calibration-settings').send({ expiredCalibration: 'refuse' })).status).toBe(200);
    const settings = await eventsAbout(owner.organisationId);
    expect(settings.filter((e) => e.action === 'calibration_settings.updated').map((e) => e.details)).toEqual([{ expiredCalibration: { from: 'warn', to: 'refuse' } }]);
  });

  it('logs a mask and each new version', async () => {
    const limits = (upperDb: number) => ({ levelReference: 'absolute', upper: [{ frequencyHz: 100, levelDb: upperDb }, { frequencyHz: 10_000, levelDb: upperDb }] });
    const mask = await owner.agent.post('/v1/masks').set(key()).send({ name: 'KB-65 woofer limits', ...limits(95) });
    expect(mask.status, JSON.stringify(mask.body)).toBe(201);
    const version = await owner.agent.post(`/v1/masks/${mask.body.id}/versions`).set(key()).send({ ...limits(96), note: 'Looser top after the cone change' });
    expect(version.status, JSON.stringify(version.body)).toBe(201);
    const events = await eventsAbout(mask.body.id);
    expect(events.map((e) => [e.action, e.details.version])).toEqual([['mask.created', 1], ['mask.version_created', 2]]);
    expect(events[0].details.name).toBe('KB-65 woofer limits');
    expect(events[1].details.note).toBe('Looser top after the cone change');
  });

  it('logs a webhook endpoint through create, update, disable, enable, rotate and delete, never its secret or URL token', async () => {
    const created = await owner.agent.post('/v1/webhook-endpoints').send({ url: 'http://127.0.0.1:9/hooks/kb?token=s3cret', eventTypes: ['analysis.succeeded'] });
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    const id = created.body.endpoint.id as string;
    expect((await owner.agent.patch(`/v1/webhook-endpoints/${id}`).send({ description: 'Line 2 MES bridge' })).status).toBe(200);
    expect((await owner.agent.patch(`/v1/webhook-endpoints/${id}`).send({ enabled: false })).status).toBe(200);
    expect((await owner.agent.patch(`/v1/webhook-endpoints/${id}`).send({ enabled: true })).status).toBe(200);
    const rotated = await owner.agent.post(`/v1/webhook-endpoints/${id}/rotate-secret`).send({ graceHours: 24 });
    expect(rotated.status).toBe(200);
    expect((await owner.agent.delete(`/v1/webhook-endpoints/${id}`)).status).toBe(204);
    const events = await eventsAbout(id);
    expect(events.map((e) => e.action)).toEqual([
      'webhook_endpoint.created',
      'webhook_endpoint.updated',
      'webhook_endpoint.disabled',
      'webhook_endpoint.enabled',
      'webhook_endpoint.secret_rotated',
      'webhook_endpoint.deleted',
    ]);
    expect(events.every((e) => e.actor.id === owner.userId)).toBe(true);
    expect(events[0].details).toEqual({ url: 'http://127.0.0.1:9/hooks/kb', eventTypes: ['analysis.succeeded'] });
    expect(events[1].details).toEqual({ changed: { description: 'Line 2 MES bridge' } });
    expect(events[4].details.graceHours).toBe(24);
    const text = JSON.stringify(events);
    expect(text).not.toContain('s3cret');
    expect(text).not.toContain(created.body.secret);
    expect(text).not.toContain(rotated.body.secret);
    // The filter by action finds the same events.
    const rotations = await owner.agent.get('/v1/audit-events').query({ action: 'webhook_endpoint.secret_rotated' });
    expect(rotations.body.data.map((e: AuditEvent) => e.objectId)).toEqual([id]);
  });
});
