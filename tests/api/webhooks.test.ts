import { execFile } from 'node:child_process';
import { once } from 'node:events';
import { writeFile, mkdtemp, rm } from 'node:fs/promises';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { promisify } from 'node:util';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { webhookEndpoints } from '@server/db/tables';
import { manualClock } from '@server/lib/clock';
import { newId } from '@server/lib/ids';
import { createEndpoint, emitEvent } from '@server/modules/webhook-endpoints/webhooks.service';
import { dispatchDueDeliveries, startWebhookDispatcher } from '@server/webhooks/dispatcher';
import { organisationWithRoles, signUp, type OrganisationWithRoles, type SignedUp } from '../support/actors';
import { createTestContext, type TestContext } from '../support/test-app';

const run = promisify(execFile);
// The receiver-side verifier shipped in examples/ (plain JavaScript, so it is typed here).
type ExampleVerifier = (body: Buffer, headers: { id: string; timestamp: string; signature: string }, secrets: string[], nowSeconds?: number) => number;
const exampleModule = '../../examples/rig-loop.mjs';
const { verifyWebhook: exampleVerifyWebhook } = (await import(exampleModule)) as { verifyWebhook: ExampleVerifier };
// Near the real time: receivers check webhook-timestamp against their own clock (5-minute tolerance).
const clock = manualClock(new Date(Math.ceil(Date.now() / 1000) * 1000));
let context: TestContext;
let kb: OrganisationWithRoles;
let other: SignedUp;

interface Received {
  headers: http.IncomingHttpHeaders;
  body: Buffer;
  path: string;
}
const received: Received[] = [];
const replies: number[] = []; // statuses to answer with, in order; 200 when empty
let receiver: http.Server;
let receiverUrl: string;
let tempDir: string;

beforeAll(async () => {
  context = await createTestContext({ clock });
  kb = await organisationWithRoles(context);
  other = await signUp(context, { organisationName: 'Other Lab' });
  receiver = http.createServer((req, res) => {
    const chunks: Buffer[] = [];
    req.on('data', (chunk: Buffer) => chunks.push(chunk));
    req.on('end', () => {
      received.push({ headers: req.headers, body: Buffer.concat(chunks), path: req.url ?? '' });
      const status = replies.shift() ?? 200;
      res.writeHead(status, { 'content-type': 'text/plain' }).end(status >= 400 ? `receiver says ${status}` : 'ok');
    });
  });
  receiver.listen(0, '127.0.0.1');
  await once(receiver, 'listening');
  receiverUrl = `http://127.0.0.1:${(receiver.address() as AddressInfo).port}`;
  tempDir = await mkdtemp(join(tmpdir(), 'swl-webhooks-'));
});
afterAll(async () => {
  receiver?.close();
  await rm(tempDir, { recursive: true, force: true });
  await context?.close();
});

/** Each test gets its own organisation, so earlier tests' endpoints do not receive its events. */
let lab: SignedUp;
async function createReceiverEndpoint(path: string, eventTypes = ['analysis.succeeded', 'analysis.failed'], owner?: SignedUp) {
  lab = owner ?? (await signUp(context, { organisationName: `Webhook lab ${path}` }));
  const response = await lab.agent.post('/v1/webhook-endpoints').send({ url: `${receiverUrl}${path}`, eventTypes, description: 'Line 2 MES bridge' });
  expect(response.status, JSON.stringify(response.body)).toBe(201);
  return response.body as { endpoint: { id: string }; secret: string };
}

const succeeded = () => ({ id: newId('analysis'), kind: 'response_and_distortion', status: 'succeeded' as const, verdict: 'pass' as const, url: '/v1/analyses/x' });
const forPath = (path: string) => received.filter((item) => item.path === path);
const headersOf = (item: Received) => ({
  id: String(item.headers['webhook-id']),
  timestamp: String(item.headers['webhook-timestamp']),
  signature: String(item.headers['webhook-signature']),
});

/** The Node example's CLI, as a receiver would run it. */
async function exampleCli(item: Received, secret: string): Promise<string> {
  const bodyFile = join(tempDir, `${newId('webhookEvent')}.json`);
  await writeFile(bodyFile, item.body);
  const { id, timestamp, signature } = headersOf(item);
  const { stdout } = await run(process.execPath, ['examples/rig-loop.mjs', 'verify-webhook', '--id', id, '--timestamp', timestamp, '--signature', signature, '--secret', secret, '--body-file', bodyFile]);
  return stdout.trim();
}

describe('webhook endpoints', () => {
  it('shows the secret once and stores it sealed', async () => {
    const created = await createReceiverEndpoint('/once');
    expect(created.secret).toMatch(/^whsec_[A-Za-z0-9+/]+=*$/);
    const fetched = await lab.agent.get(`/v1/webhook-endpoints/${created.endpoint.id}`);
    expect(fetched.status).toBe(200);
    expect(JSON.stringify(fetched.body)).not.toContain(created.secret.slice(6));
    const list = await lab.agent.get('/v1/webhook-endpoints');
    expect(JSON.stringify(list.body)).not.toContain(created.secret.slice(6));
    const rows = await context.deps.db.select().from(webhookEndpoints);
    expect(JSON.stringify(rows)).not.toContain(created.secret.slice(6));
  });

  it('delivers a signed event that the examples\' verifiers accept', async () => {
    const { endpoint, secret } = await createReceiverEndpoint('/signed');
    const data = succeeded();
    const emitted = await emitEvent(context.deps, lab.organisationId, 'analysis.succeeded', data);
    expect(emitted.deliveryIds).toHaveLength(1);
    await dispatchDueDeliveries(context.deps);
    const [item] = forPath('/signed');
    expect(item).toBeDefined();
    expect(item.headers['webhook-id']).toBe(emitted.eventId);
    expect(JSON.parse(item.body.toString('utf8'))).toEqual({ type: 'analysis.succeeded', timestamp: clock.now().toISOString(), data });
    // Standard Webhooks v1.0.0 verification, by the rig example's own code (module and CLI) and by the Python example.
    expect(exampleVerifyWebhook(item.body, headersOf(item), [secret])).toBe(0);
    expect(() => exampleVerifyWebhook(Buffer.concat([item.body, Buffer.from(' ')]), headersOf(item), [secret])).toThrow('no signature matches');
    expect(await exampleCli(item, secret)).toBe('valid (secret #1)');
    const { id, timestamp, signature } = headersOf(item);
    const bodyFile = join(tempDir, 'python-body.json');
    await writeFile(bodyFile, item.body);
    const python = await run('python3', ['examples/rig_loop.py', 'verify-webhook', '--id', id, '--timestamp', timestamp, '--signature', signature, '--secret', secret, '--body-file', bodyFile]);
    expect(python.stdout.trim()).toBe('valid (secret #1)');

    const deliveries = await lab.agent.get(`/v1/webhook-endpoints/${endpoint.id}/deliveries`);
    expect(deliveries.status).toBe(200);
    expect(deliveries.body.data[0]).toMatchObject({ eventId: emitted.eventId, eventType: 'analysis.succeeded', status: 'succeeded', attempts: 1, lastResponseStatus: 200 });
  });

  it('retries after a 500 with the same webhook-id, on the back-off schedule', async () => {
    const { endpoint, secret } = await createReceiverEndpoint('/flaky');
    replies.push(500);
    const emitted = await emitEvent(context.deps, lab.organisationId, 'analysis.failed', {
      id: newId('analysis'),
      kind: 'frequency_response',
      status: 'failed',
      error: { code: 'analysis_input_mismatch', title: 'The capture, stimulus and channels do not fit together' },
      url: '/v1/analyses/x',
    });
    await dispatchDueDeliveries(context.deps);
    let log = (await lab.agent.get(`/v1/webhook-endpoints/${endpoint.id}/deliveries`)).body.data[0];
    expect(log).toMatchObject({ status: 'pending', attempts: 1, lastResponseStatus: 500, lastResponseExcerpt: 'receiver says 500' });
    expect(log.attemptLog).toEqual([expect.objectContaining({ attemptNumber: 1, outcome: 'retry:server_error', responseStatus: 500 })]);
    // Standard Webhooks v1.0.0 example schedule: the second attempt 5 s after the first (±10 % jitter here).
    const delayMs = Date.parse(log.nextAttemptAt) - Date.parse(log.attemptLog[0].attemptedAt);
    expect(delayMs).toBeGreaterThanOrEqual(4500);
    expect(delayMs).toBeLessThanOrEqual(5500);

    await dispatchDueDeliveries(context.deps); // not yet due
    expect(forPath('/flaky')).toHaveLength(1);
    clock.advanceSeconds(6);
    await dispatchDueDeliveries(context.deps);
    const attempts = forPath('/flaky');
    expect(attempts).toHaveLength(2);
    expect(attempts.map((item) => item.headers['webhook-id'])).toEqual([emitted.eventId, emitted.eventId]);
    expect(Number(attempts[1].headers['webhook-timestamp']) - Number(attempts[0].headers['webhook-timestamp'])).toBe(6);
    expect(exampleVerifyWebhook(attempts[1].body, headersOf(attempts[1]), [secret], Math.floor(clock.now().getTime() / 1000))).toBe(0);
    log = (await lab.agent.get(`/v1/webhook-endpoints/${endpoint.id}/deliveries`)).body.data[0];
    expect(log).toMatchObject({ status: 'succeeded', attempts: 2, lastResponseStatus: 200, nextAttemptAt: null });
  });

  it('disables the endpoint when the receiver answers 410 Gone', async () => {
    const { endpoint } = await createReceiverEndpoint('/gone');
    replies.push(410);
    await emitEvent(context.deps, lab.organisationId, 'analysis.succeeded', succeeded());
    await dispatchDueDeliveries(context.deps);
    const after = await lab.agent.get(`/v1/webhook-endpoints/${endpoint.id}`);
    expect(after.body).toMatchObject({ enabled: false, disabledReason: 'gone' });
    const emitted = await emitEvent(context.deps, lab.organisationId, 'analysis.succeeded', succeeded());
    expect(emitted.deliveryIds).toEqual([]); // a disabled endpoint gets no new deliveries
    const deliveries = (await lab.agent.get(`/v1/webhook-endpoints/${endpoint.id}/deliveries`)).body.data;
    expect(deliveries).toHaveLength(1);
    expect(deliveries[0].status).toBe('failed');
  });

  it('signs with old and new secret during a rotation\'s grace period, then with the new one only', async () => {
    const { endpoint, secret: oldSecret } = await createReceiverEndpoint('/rotate', ['quota.threshold']);
    const rotated = await lab.agent.post(`/v1/webhook-endpoints/${endpoint.id}/rotate-secret`).send({ graceHours: 24 });
    expect(rotated.status).toBe(200);
    const newSecret = rotated.body.secret as string;
    expect(newSecret).not.toBe(oldSecret);
    expect(rotated.body.endpoint.previousSecretExpiresAt).toBe(new Date(clock.now().getTime() + 24 * 3600_000).toISOString());
    const data = { quota: 'analyses' as const, thresholdPercent: 80, used: 160, limit: 200, periodEndsAt: '2025-04-01T00:00:00.000Z' };
    await emitEvent(context.deps, lab.organisationId, 'quota.threshold', data);
    await dispatchDueDeliveries(context.deps);
    const [during] = forPath('/rotate');
    expect(String(during.headers['webhook-signature']).split(' ')).toHaveLength(2);
    const nowSeconds = Math.floor(clock.now().getTime() / 1000);
    expect(exampleVerifyWebhook(during.body, headersOf(during), [oldSecret], nowSeconds)).toBe(0);
    expect(exampleVerifyWebhook(during.body, headersOf(during), [newSecret], nowSeconds)).toBe(0);

    await lab.agent.post(`/v1/webhook-endpoints/${endpoint.id}/rotate-secret`).send({ graceHours: 0 });
    const latest = await lab.agent.post(`/v1/webhook-endpoints/${endpoint.id}/rotate-secret`).send({});
    await emitEvent(context.deps, lab.organisationId, 'quota.threshold', data);
    await dispatchDueDeliveries(context.deps);
    const after = forPath('/rotate')[1];
    expect(String(after.headers['webhook-signature']).split(' ')).toHaveLength(2); // latest + its 24 h predecessor
    expect(() => exampleVerifyWebhook(after.body, headersOf(after), [oldSecret, newSecret], nowSeconds)).toThrow('no signature matches');
    expect(exampleVerifyWebhook(after.body, headersOf(after), [latest.body.secret], nowSeconds)).toBe(0);
  });

  it('resends a delivery with the same event id and body', async () => {
    const { endpoint, secret } = await createReceiverEndpoint('/resend');
    const emitted = await emitEvent(context.deps, lab.organisationId, 'analysis.succeeded', succeeded());
    await dispatchDueDeliveries(context.deps);
    const resent = await lab.agent.post(`/v1/webhook-endpoints/${endpoint.id}/deliveries/${emitted.deliveryIds[0]}/resend`);
    expect(resent.status).toBe(202);
    expect(resent.body.status).toBe('pending');
    await dispatchDueDeliveries(context.deps);
    const [first, second] = forPath('/resend');
    expect(second.headers['webhook-id']).toBe(first.headers['webhook-id']);
    expect(second.body.equals(first.body)).toBe(true);
    expect(exampleVerifyWebhook(second.body, headersOf(second), [secret], Math.floor(clock.now().getTime() / 1000))).toBe(0);
    const log = (await lab.agent.get(`/v1/webhook-endpoints/${endpoint.id}/deliveries`)).body.data[0];
    expect(log.attemptLog.map((attempt: { attemptNumber: number }) => attempt.attemptNumber)).toEqual([1, 2]);
  });

  it('sends nothing to a paused endpoint, and new events once it is re-enabled', async () => {
    const { endpoint } = await createReceiverEndpoint('/paused');
    expect((await lab.agent.patch(`/v1/webhook-endpoints/${endpoint.id}`).send({ enabled: false })).body.enabled).toBe(false);
    const whilePaused = await context.deps.db.transaction((tx) => emitEvent(context.deps, lab.organisationId, 'analysis.succeeded', succeeded(), tx));
    expect(whilePaused.deliveryIds).toEqual([]);
    await dispatchDueDeliveries(context.deps);
    expect(forPath('/paused')).toHaveLength(0);
    expect((await lab.agent.patch(`/v1/webhook-endpoints/${endpoint.id}`).send({ enabled: true })).body.enabled).toBe(true);
    await emitEvent(context.deps, lab.organisationId, 'analysis.succeeded', succeeded());
    await dispatchDueDeliveries(context.deps);
    expect(forPath('/paused')).toHaveLength(1);
  });

  it('runs as a loop that starts and stops', async () => {
    await createReceiverEndpoint('/loop');
    const dispatcher = startWebhookDispatcher(context.deps, { pollIntervalMs: 50 });
    try {
      await emitEvent(context.deps, lab.organisationId, 'analysis.succeeded', succeeded());
      const deadline = Date.now() + 5000;
      while (forPath('/loop').length === 0 && Date.now() < deadline) await new Promise((resolve) => setTimeout(resolve, 20));
    } finally {
      await dispatcher.stop();
    }
    expect(forPath('/loop')).toHaveLength(1);
  });

  it('refuses private and loopback targets in production, and bad URLs everywhere', async () => {
    const production = { ...context.deps, config: { ...context.deps.config, nodeEnv: 'production' as const } };
    for (const url of ['https://127.0.0.1/hook', 'https://10.0.0.8/hook', 'https://localhost/hook', 'http://rigs.kestrelbay.example/hook', 'https://169.254.169.254/latest']) {
      await expect(createEndpoint(production, lab.organisationId, { url, eventTypes: ['analysis.succeeded'] }), url).rejects.toMatchObject({ code: 'webhook_url_not_allowed' });
    }
    const bad = await lab.agent.post('/v1/webhook-endpoints').send({ url: 'not a url', eventTypes: ['analysis.succeeded'] });
    expect(bad.status).toBe(422);
    expect(bad.body.errors[0].pointer).toBe('#/url');
    const metadata = await lab.agent.post('/v1/webhook-endpoints').send({ url: 'http://169.254.169.254/', eventTypes: ['analysis.succeeded'] });
    expect(metadata.status).toBe(422);
    const unknownType = await lab.agent.post('/v1/webhook-endpoints').send({ url: `${receiverUrl}/x`, eventTypes: ['capture.deleted'] });
    expect(unknownType.status).toBe(400);
  });

  it('is for owners and admins only, and another organisation\'s endpoint is 404', async () => {
    const { endpoint } = await createReceiverEndpoint('/private', undefined, kb.admin);
    for (const member of [kb.analyst, kb.viewer]) {
      const create = await member.agent.post('/v1/webhook-endpoints').send({ url: `${receiverUrl}/x`, eventTypes: ['analysis.succeeded'] });
      expect(create.status).toBe(403);
      expect((await member.agent.get('/v1/webhook-endpoints')).status).toBe(403);
    }
    expect((await kb.owner.agent.get(`/v1/webhook-endpoints/${endpoint.id}`)).status).toBe(200);
    for (const call of [
      other.agent.get(`/v1/webhook-endpoints/${endpoint.id}`),
      other.agent.get(`/v1/webhook-endpoints/${endpoint.id}/deliveries`),
      other.agent.patch(`/v1/webhook-endpoints/${endpoint.id}`).send({ enabled: false }),
      other.agent.post(`/v1/webhook-endpoints/${endpoint.id}/rotate-secret`).send({}),
      other.agent.delete(`/v1/webhook-endpoints/${endpoint.id}`),
    ]) {
      const response = await call;
      expect(response.status).toBe(404);
      expect(response.body.code).toBe('not_found');
    }
    expect((await other.agent.get('/v1/webhook-endpoints')).body.data).toEqual([]);
    const deleted = await kb.admin.agent.delete(`/v1/webhook-endpoints/${endpoint.id}`);
    expect(deleted.status).toBe(204);
    expect((await kb.admin.agent.get(`/v1/webhook-endpoints/${endpoint.id}`)).status).toBe(404);
  });
});
