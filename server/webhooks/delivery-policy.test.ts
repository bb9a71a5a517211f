import { describe, expect, it } from 'vitest';
import {
  classifyDeliveryError,
  classifyDeliveryResponse,
  MAX_DELIVERY_ATTEMPTS,
  nextDeliveryStep,
  parseRetryAfterSeconds,
  RETRY_DELAYS_SECONDS,
  retryDelayMs,
} from './delivery-policy';
import { WebhookError } from './webhook-error';

const NOW = new Date('2026-05-04T12:00:00Z');
const hms = (seconds: number) =>
  [Math.floor(seconds / 3600), Math.floor((seconds % 3600) / 60), seconds % 60].map((n) => String(n).padStart(2, '0')).join(':');

describe('retry schedule', () => {
  it('follows the example schedule of Standard Webhooks v1.0.0 ("Time since start" column)', () => {
    const published = ['00:00:00', '00:00:05', '00:05:05', '00:35:05', '02:35:05', '07:35:05', '17:35:05', '31:35:05', '51:35:05', '75:35:05'];
    let sinceStartSeconds = 0;
    const cumulative = RETRY_DELAYS_SECONDS.map((delay) => hms((sinceStartSeconds += delay)));
    expect(cumulative).toEqual(published);
    expect(MAX_DELIVERY_ATTEMPTS).toBe(10);
  });

  it('spreads each delay by at most ±10 % (jitter), centred on the schedule', () => {
    expect(retryDelayMs(1, () => 0.5)).toBe(5_000);
    expect(retryDelayMs(1, () => 0)).toBe(4_500);
    expect(retryDelayMs(1, () => 0.999_999)).toBe(5_500);
    expect(retryDelayMs(9, () => 0.5)).toBe(86_400_000);
    const samples = Array.from({ length: 500 }, () => retryDelayMs(3)!);
    expect(Math.min(...samples)).toBeGreaterThanOrEqual(1_620_000);
    expect(Math.max(...samples)).toBeLessThanOrEqual(1_980_000);
    expect(new Set(samples).size).toBeGreaterThan(100);
  });

  it('stops after the tenth attempt', () => {
    expect(retryDelayMs(MAX_DELIVERY_ATTEMPTS - 1, () => 0.5)).not.toBeNull();
    expect(retryDelayMs(MAX_DELIVERY_ATTEMPTS, () => 0.5)).toBeNull();
    expect(() => retryDelayMs(0)).toThrow(RangeError);
  });
});

describe('Retry-After (RFC 9110 §10.2.3: delay-seconds or HTTP-date)', () => {
  it('reads both forms from the RFC examples', () => {
    expect(parseRetryAfterSeconds('120', NOW)).toBe(120);
    // RFC 9110 example date "Fri, 31 Dec 1999 23:59:59 GMT" is in the past: retry now.
    expect(parseRetryAfterSeconds('Fri, 31 Dec 1999 23:59:59 GMT', NOW)).toBe(0);
    expect(parseRetryAfterSeconds('Mon, 04 May 2026 12:01:30 GMT', NOW)).toBe(90);
  });

  it('ignores absent or unreadable values', () => {
    for (const value of [undefined, null, '', '-5', '1.5', 'soon', 'Mon, 04 May 2026 12:01:30']) {
      expect(parseRetryAfterSeconds(value, NOW)).toBeNull();
    }
  });
});

describe('classifying a receiver answer (Standard Webhooks v1.0.0, "Delivery success and failure")', () => {
  it('2xx succeeds, 410 disables the endpoint, everything else is retried', () => {
    expect(classifyDeliveryResponse(200, undefined, NOW)).toEqual({ kind: 'succeeded' });
    expect(classifyDeliveryResponse(204, undefined, NOW)).toEqual({ kind: 'succeeded' });
    expect(classifyDeliveryResponse(299, undefined, NOW)).toEqual({ kind: 'succeeded' });
    expect(classifyDeliveryResponse(410, undefined, NOW)).toEqual({ kind: 'disable_endpoint', reason: 'gone' });
    const reasons = [301, 302, 400, 404, 429, 500, 502, 503, 504, 100].map((status) => {
      const outcome = classifyDeliveryResponse(status, undefined, NOW);
      return outcome.kind === 'retry' ? outcome.reason : outcome.kind;
    });
    expect(reasons).toEqual([
      'redirect',
      'redirect',
      'client_error',
      'client_error',
      'rate_limited',
      'server_error',
      'server_error',
      'server_error',
      'server_error',
      'unexpected_status',
    ]);
  });

  it('carries Retry-After on a 429 or 503', () => {
    expect(classifyDeliveryResponse(503, '30', NOW)).toEqual({ kind: 'retry', reason: 'server_error', retryAfterSeconds: 30 });
    expect(classifyDeliveryResponse(429, ['7'], NOW)).toEqual({ kind: 'retry', reason: 'rate_limited', retryAfterSeconds: 7 });
  });

  it('tells timeouts from other network errors and egress refusals', () => {
    expect(classifyDeliveryError(new DOMException('timed out', 'TimeoutError'))).toMatchObject({ reason: 'timeout' });
    expect(classifyDeliveryError(Object.assign(new Error('x'), { code: 'UND_ERR_HEADERS_TIMEOUT' }))).toMatchObject({ reason: 'timeout' });
    expect(classifyDeliveryError(Object.assign(new Error('x'), { code: 'ECONNREFUSED' }))).toMatchObject({ reason: 'network_error' });
    expect(classifyDeliveryError(new WebhookError('address_not_allowed', 'private'))).toMatchObject({ reason: 'egress_refused' });
  });
});

describe('next step after an attempt', () => {
  const half = () => 0.5;
  it('is done on success and disables on 410', () => {
    expect(nextDeliveryStep({ outcome: { kind: 'succeeded' }, attemptsMade: 1, now: NOW })).toEqual({ action: 'done' });
    expect(nextDeliveryStep({ outcome: { kind: 'disable_endpoint', reason: 'gone' }, attemptsMade: 3, now: NOW })).toEqual({
      action: 'disable_endpoint',
    });
  });

  it('retries on schedule, or later when Retry-After asks for more, capped at a day', () => {
    const retry = (retryAfterSeconds: number | null, attemptsMade = 1) =>
      nextDeliveryStep({ outcome: { kind: 'retry', reason: 'server_error', retryAfterSeconds }, attemptsMade, now: NOW, random: half });
    expect(retry(null)).toEqual({ action: 'retry', delayMs: 5_000, notBefore: new Date(NOW.getTime() + 5_000) });
    expect(retry(2)).toMatchObject({ delayMs: 5_000 }); // never sooner than the schedule
    expect(retry(600)).toMatchObject({ delayMs: 600_000 });
    expect(retry(10 * 86_400)).toMatchObject({ delayMs: 86_400_000 });
    expect(retry(null, MAX_DELIVERY_ATTEMPTS)).toEqual({ action: 'give_up' });
  });
});
