import { describe, expect, it } from 'vitest';
import { buildWebhookEvent, WEBHOOK_EVENT_TYPES, WEBHOOK_PAYLOAD_MAX_BYTES } from './events';

const OCCURRED_AT = new Date('2026-03-02T09:15:00.250Z');

describe('webhook events', () => {
  it('use dotted type names of [a-zA-Z0-9_] segments (Standard Webhooks v1.0.0, "Event types")', () => {
    expect(WEBHOOK_EVENT_TYPES).toEqual(['analysis.succeeded', 'analysis.failed', 'quota.threshold']);
    for (const type of WEBHOOK_EVENT_TYPES) expect(type).toMatch(/^[a-zA-Z0-9_]+(\.[a-zA-Z0-9_]+)+$/);
  });

  it('build the { type, timestamp, data } envelope as minified JSON, timestamp = when the event occurred', () => {
    const data = {
      id: 'ana_8KQ2v',
      kind: 'response_and_distortion',
      status: 'succeeded' as const,
      captureId: 'cap_3Jd9',
      dut: { model: 'KB-65', serial: 'KB65-24-000123', lot: 'KB65-L24-07' },
      verdict: 'pass' as const,
      url: '/v1/analyses/ana_8KQ2v',
    };
    const { event, body } = buildWebhookEvent('analysis.succeeded', data, OCCURRED_AT);
    expect(event).toEqual({ type: 'analysis.succeeded', timestamp: '2026-03-02T09:15:00.250Z', data });
    expect(body).toBe(JSON.stringify(event));
    expect(body).not.toMatch(/\n|": /);
  });

  it('carry the mask verdict as pass, fail or incomplete, and null without a mask', () => {
    const data = (verdict: unknown) => ({ id: 'ana_8KQ2v', kind: 'spectrum', status: 'succeeded' as const, verdict, url: '/v1/analyses/ana_8KQ2v' }) as never;
    for (const verdict of ['pass', 'fail', 'incomplete', null]) {
      expect(buildWebhookEvent('analysis.succeeded', data(verdict), OCCURRED_AT).event.data.verdict).toBe(verdict);
    }
    expect(() => buildWebhookEvent('analysis.succeeded', data('marginal'), OCCURRED_AT)).toThrow(
      expect.objectContaining({ code: 'invalid_event_data', message: expect.stringContaining('verdict') }),
    );
  });

  it('validate data against the event type and name the bad field', () => {
    expect(() =>
      buildWebhookEvent('quota.threshold', { quota: 'analyses', thresholdPercent: 180, used: 9, limit: 10, periodEndsAt: '2026-04-01T00:00:00Z' }, OCCURRED_AT),
    ).toThrow(expect.objectContaining({ code: 'invalid_event_data', message: expect.stringContaining('thresholdPercent') }));
    expect(() => buildWebhookEvent('nope.event' as 'quota.threshold', {} as never, OCCURRED_AT)).toThrow(
      expect.objectContaining({ code: 'unknown_event_type' }),
    );
  });

  it('refuse payloads over 20 kB (Standard Webhooks v1.0.0, "Payload size")', () => {
    const failed = (titleLength: number) =>
      buildWebhookEvent(
        'analysis.failed',
        {
          id: 'ana_1',
          kind: 'stepped_sine',
          status: 'failed',
          error: { code: 'capture_too_short', title: 'x'.repeat(titleLength) },
          url: '/v1/analyses/ana_1',
        },
        OCCURRED_AT,
      );
    const envelopeBytes = Buffer.byteLength(failed(0).body);
    expect(Buffer.byteLength(failed(WEBHOOK_PAYLOAD_MAX_BYTES - envelopeBytes).body)).toBe(WEBHOOK_PAYLOAD_MAX_BYTES);
    expect(() => failed(WEBHOOK_PAYLOAD_MAX_BYTES - envelopeBytes + 1)).toThrow(expect.objectContaining({ code: 'payload_too_large' }));
  });
});
