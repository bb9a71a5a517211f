import { createServer, type IncomingMessage, type ServerResponse } from 'node:http';
import type { AddressInfo } from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { deliverOnce } from './deliver-once';
import { egressPolicyFor, STRICT_EGRESS_POLICY } from './egress-guard';
import { buildWebhookEvent } from './events';
import { signWebhook, verifyWebhook } from './signature';
import { generateWebhookSecret } from './webhook-secret';

const dev = egressPolicyFor('test');
const secret = generateWebhookSecret();

interface Received {
  path: string;
  headers: IncomingMessage['headers'];
  body: Buffer;
}

// A local receiver on 127.0.0.1 (ephemeral port) that records every request and answers per path.
const received: Received[] = [];
const routes: Record<string, (res: ServerResponse) => void> = {
  '/ok': (res) => res.writeHead(204).end(),
  '/gone': (res) => res.writeHead(410).end('endpoint retired'),
  '/busy': (res) => res.writeHead(503, { 'retry-after': '120' }).end('maintenance'),
  '/throttle': (res) => res.writeHead(429, { 'retry-after': '7' }).end(),
  '/redirect': (res) => res.writeHead(302, { location: '/ok' }).end(),
  '/large': (res) => {
    res.writeHead(500, { 'content-type': 'text/plain' });
    res.end('E'.repeat(5_000_000));
  },
  '/silent': () => {
    // never answers: the attempt must time out
  },
};
const receiver = createServer((req, res) => {
  const chunks: Buffer[] = [];
  req.on('data', (chunk: Buffer) => chunks.push(chunk));
  req.on('end', () => {
    received.push({ path: req.url ?? '', headers: req.headers, body: Buffer.concat(chunks) });
    (routes[req.url ?? ''] ?? ((r: ServerResponse) => r.writeHead(404).end()))(res);
  });
});
let base = '';

beforeAll(async () => {
  await new Promise<void>((resolve) => receiver.listen(0, '127.0.0.1', resolve));
  base = `http://127.0.0.1:${(receiver.address() as AddressInfo).port}`;
});
afterAll(async () => {
  receiver.closeAllConnections();
  await new Promise<void>((resolve) => receiver.close(() => resolve()));
});

function signedDelivery(path: string) {
  const { body } = buildWebhookEvent(
    'analysis.succeeded',
    { id: 'ana_4Tq9', kind: 'frequency_response', status: 'succeeded', verdict: null, url: '/v1/analyses/ana_4Tq9' },
    new Date('2026-06-01T08:00:00Z'),
  );
  const headers = signWebhook({ messageId: 'evt_9Xc2', timestampSeconds: Math.floor(Date.now() / 1000), body, secrets: [secret] });
  return { url: base + path, body, headers: { ...headers } as Record<string, string> };
}

describe('one delivery attempt against a local receiver', () => {
  it('delivers the signed bytes unchanged, and the receiver can verify them', async () => {
    received.length = 0;
    const delivery = signedDelivery('/ok');
    const attempt = await deliverOnce({ ...delivery, policy: dev });
    expect(attempt).toMatchObject({ outcome: { kind: 'succeeded' }, statusCode: 204, error: null, targetAddress: '127.0.0.1' });
    const [request] = received;
    expect(request.headers['content-type']).toBe('application/json');
    expect(request.body.toString('utf8')).toBe(delivery.body);
    expect(verifyWebhook({ headers: request.headers, body: request.body, secrets: [secret] })).toMatchObject({ messageId: 'evt_9Xc2' });
  });

  it('410 asks to disable the endpoint; 503 and 429 are retried with their Retry-After', async () => {
    expect((await deliverOnce({ ...signedDelivery('/gone'), policy: dev })).outcome).toEqual({ kind: 'disable_endpoint', reason: 'gone' });
    const busy = await deliverOnce({ ...signedDelivery('/busy'), policy: dev });
    expect(busy).toMatchObject({ statusCode: 503, responseExcerpt: 'maintenance', responseTruncated: false });
    expect(busy.outcome).toEqual({ kind: 'retry', reason: 'server_error', retryAfterSeconds: 120 });
    expect((await deliverOnce({ ...signedDelivery('/throttle'), policy: dev })).outcome).toEqual({
      kind: 'retry',
      reason: 'rate_limited',
      retryAfterSeconds: 7,
    });
  });

  it('does not follow redirects (Standard Webhooks v1.0.0: 3xx is a failure)', async () => {
    received.length = 0;
    const attempt = await deliverOnce({ ...signedDelivery('/redirect'), policy: dev });
    expect(attempt).toMatchObject({ statusCode: 302, outcome: { kind: 'retry', reason: 'redirect' } });
    expect(received.map((r) => r.path)).toEqual(['/redirect']);
  });

  it('keeps only the first bytes of a large reply for the log', async () => {
    const attempt = await deliverOnce({ ...signedDelivery('/large'), policy: dev, responseExcerptMaxBytes: 64 });
    expect(attempt).toMatchObject({ statusCode: 500, responseTruncated: true, responseExcerpt: 'E'.repeat(64) });
  });

  it('times out a receiver that never answers', async () => {
    const attempt = await deliverOnce({ ...signedDelivery('/silent'), policy: dev, timeoutMs: 300 });
    expect(attempt.outcome).toEqual({ kind: 'retry', reason: 'timeout', retryAfterSeconds: null });
    expect(attempt.statusCode).toBeNull();
    expect(attempt.durationMs).toBeGreaterThanOrEqual(250);
  });

  it('reports a refused connection as a network error', async () => {
    const closed = createServer();
    await new Promise<void>((resolve) => closed.listen(0, '127.0.0.1', resolve));
    const port = (closed.address() as AddressInfo).port;
    await new Promise<void>((resolve) => closed.close(() => resolve()));
    const attempt = await deliverOnce({ ...signedDelivery('/ok'), url: `http://127.0.0.1:${port}/ok`, policy: dev });
    expect(attempt.outcome).toMatchObject({ kind: 'retry', reason: 'network_error' });
    expect(attempt.error?.code).toBe('ECONNREFUSED');
  });

  it('under the production policy refuses the loopback receiver before any connection is made', async () => {
    received.length = 0;
    const attempt = await deliverOnce({ ...signedDelivery('/ok'), policy: { ...STRICT_EGRESS_POLICY, allowHttp: true, allowedPorts: 'any' } });
    expect(attempt.outcome).toMatchObject({ kind: 'retry', reason: 'egress_refused' });
    expect(attempt.error?.code).toBe('address_not_allowed');
    expect(received).toHaveLength(0);
  });
});
