import { createHmac } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { computeWebhookSignature, signWebhook, verifyWebhook, webhookSignedContent } from './signature';
import { generateWebhookSecret } from './webhook-secret';
import type { WebhookErrorCode } from './webhook-error';

// Published test vector: Standard Webhooks reference libraries, libraries/javascript/src/webhook.test.ts
// ("sign function works") and libraries/go/webhook_test.go (TestWebhookSign), same values in both.
const PUBLISHED = {
  secret: 'whsec_MfKQ9r8GKYqrTwjUPD8ILPZIo2LaLaSw',
  messageId: 'msg_p5jXN8AQM9LWM0D4loKWxJek',
  timestampSeconds: 1614265330,
  body: '{"test": 2432232314}',
  signature: 'v1,g0hM9SsE+OTPJTGt/tmIKtSyZlE3uFJELVlNIOLJ1OE=',
};
// Entries from the same suites' "multi sig payload is valid" case: a wrong v1 and an unknown v2 signature.
const PUBLISHED_DECOY_V1 = 'v1,Ceo5qEr07ixe2NLpvHk3FH9bwy/WavXrAFQ/9tdO6mc=';
const PUBLISHED_DECOY_V2 = 'v2,Ceo5qEr07ixe2NLpvHk3FH9bwy/WavXrAFQ/9tdO6mc=';

/** Independent computation straight from the spec text: base64(HMAC-SHA256(base64decode(secret), "id.ts.body")). */
function referenceSignature(secret: string, id: string, timestamp: number, body: string): string {
  const key = Buffer.from(secret.replace(/^whsec_/, ''), 'base64');
  return 'v1,' + createHmac('sha256', key).update(`${id}.${timestamp}.${body}`, 'utf8').digest('base64');
}

function verifyCode(run: () => unknown): WebhookErrorCode | 'accepted' {
  try {
    run();
    return 'accepted';
  } catch (error) {
    return (error as { code: WebhookErrorCode }).code;
  }
}

const NOW = 1_767_225_600; // 2026-01-01T00:00:00Z
const BODY = JSON.stringify({ type: 'analysis.succeeded', timestamp: '2026-01-01T00:00:00.000Z', data: { id: 'ana_7Qm2', levelNote: 'dB SPL re 20 µPa' } });

describe('signing', () => {
  it('reproduces the published Standard Webhooks test vector', () => {
    const { secret, messageId, timestampSeconds, body, signature } = PUBLISHED;
    expect(computeWebhookSignature(secret, messageId, timestampSeconds, body)).toBe(signature);
    expect(signWebhook({ messageId, timestampSeconds, body, secrets: [secret] })['webhook-signature']).toBe(signature);
  });

  it('matches an independent HMAC-SHA256 over "{id}.{timestamp}.{body}" for a fresh secret and a non-ASCII body', () => {
    const secret = generateWebhookSecret();
    const headers = signWebhook({ messageId: 'evt_01J9Z', timestampSeconds: NOW, body: BODY, secrets: [secret] });
    expect(headers).toEqual({
      'webhook-id': 'evt_01J9Z',
      'webhook-timestamp': String(NOW),
      'webhook-signature': referenceSignature(secret, 'evt_01J9Z', NOW, BODY),
    });
  });

  it('signs the exact bytes: a Uint8Array body gives the same signature as its UTF-8 string', () => {
    const secret = generateWebhookSecret();
    const fromBytes = computeWebhookSignature(secret, 'evt_a', NOW, new TextEncoder().encode(BODY));
    expect(fromBytes).toBe(computeWebhookSignature(secret, 'evt_a', NOW, BODY));
    expect(webhookSignedContent('evt_a', NOW, 'x').toString('utf8')).toBe(`evt_a.${NOW}.x`);
  });

  it('lists one signature per secret, space-separated, for rotation', () => {
    const [current, previous] = [generateWebhookSecret(), generateWebhookSecret()];
    const signatures = signWebhook({ messageId: 'evt_a', timestampSeconds: NOW, body: BODY, secrets: [current, previous] })[
      'webhook-signature'
    ].split(' ');
    expect(signatures).toEqual([referenceSignature(current, 'evt_a', NOW, BODY), referenceSignature(previous, 'evt_a', NOW, BODY)]);
  });

  it('refuses ids containing "." (it delimits the signed content), bad timestamps and no secrets', () => {
    const secrets = [PUBLISHED.secret];
    expect(verifyCode(() => signWebhook({ messageId: 'evt.1', timestampSeconds: NOW, body: '', secrets }))).toBe('invalid_message_id');
    expect(verifyCode(() => signWebhook({ messageId: '', timestampSeconds: NOW, body: '', secrets }))).toBe('invalid_message_id');
    expect(verifyCode(() => signWebhook({ messageId: 'evt_1', timestampSeconds: 1.5, body: '', secrets }))).toBe('invalid_timestamp');
    expect(verifyCode(() => signWebhook({ messageId: 'evt_1', timestampSeconds: NOW, body: '', secrets: [] }))).toBe('invalid_secret');
  });
});

describe('verification', () => {
  const secret = generateWebhookSecret();
  const signed = (overrides: Partial<{ timestampSeconds: number; body: string; secrets: string[] }> = {}) => {
    const body = overrides.body ?? BODY;
    return {
      body,
      headers: signWebhook({
        messageId: 'evt_1',
        timestampSeconds: overrides.timestampSeconds ?? NOW,
        body,
        secrets: overrides.secrets ?? [secret],
      }) as unknown as Record<string, string>,
    };
  };

  it('accepts the published vector at its own time, with and without the whsec_ prefix', () => {
    const headers = {
      'webhook-id': PUBLISHED.messageId,
      'webhook-timestamp': String(PUBLISHED.timestampSeconds),
      'webhook-signature': PUBLISHED.signature,
    };
    for (const key of [PUBLISHED.secret, PUBLISHED.secret.replace('whsec_', '')]) {
      expect(verifyWebhook({ headers, body: PUBLISHED.body, secrets: [key], nowSeconds: PUBLISHED.timestampSeconds })).toEqual({
        messageId: PUBLISHED.messageId,
        timestampSeconds: PUBLISHED.timestampSeconds,
        matchedSecretIndex: 0,
      });
    }
  });

  it('finds the valid signature among decoys and unknown versions (published multi-signature case)', () => {
    const { body, headers } = signed();
    headers['webhook-signature'] = [PUBLISHED_DECOY_V1, PUBLISHED_DECOY_V2, headers['webhook-signature'], 'v1a,AAAA', 'garbage'].join(' ');
    expect(verifyCode(() => verifyWebhook({ headers, body, secrets: [secret], nowSeconds: NOW }))).toBe('accepted');
  });

  it('rotation: a message signed with old and new secrets verifies for a receiver holding either one', () => {
    const [oldSecret, newSecret] = [generateWebhookSecret(), generateWebhookSecret()];
    const { body, headers } = signed({ secrets: [newSecret, oldSecret] });
    expect(verifyWebhook({ headers, body, secrets: [oldSecret], nowSeconds: NOW }).matchedSecretIndex).toBe(0);
    expect(verifyWebhook({ headers, body, secrets: [newSecret], nowSeconds: NOW }).matchedSecretIndex).toBe(0);
    // A receiver in mid-rotation holds both and learns which one matched.
    expect(verifyWebhook({ headers, body, secrets: [generateWebhookSecret(), newSecret], nowSeconds: NOW }).matchedSecretIndex).toBe(1);
    expect(verifyCode(() => verifyWebhook({ headers, body, secrets: [generateWebhookSecret()], nowSeconds: NOW }))).toBe(
      'no_matching_signature',
    );
  });

  it('refuses a tampered body, id or timestamp', () => {
    const { body, headers } = signed();
    const verify = (h: Record<string, string>, b: string) => verifyCode(() => verifyWebhook({ headers: h, body: b, secrets: [secret], nowSeconds: NOW }));
    expect(verify(headers, body)).toBe('accepted');
    expect(verify(headers, body.replace('ana_7Qm2', 'ana_7Qm3'))).toBe('no_matching_signature');
    expect(verify(headers, body + ' ')).toBe('no_matching_signature');
    expect(verify({ ...headers, 'webhook-id': 'evt_2' }, body)).toBe('no_matching_signature');
    expect(verify({ ...headers, 'webhook-timestamp': String(NOW + 1) }, body)).toBe('no_matching_signature');
    // The same digits with a leading zero are different signed content.
    expect(verify({ ...headers, 'webhook-timestamp': `0${NOW}` }, body)).toBe('no_matching_signature');
  });

  it('tolerates 5 minutes either way and no more (Standard Webhooks reference verifier uses 300 s)', () => {
    const at = (offsetSeconds: number) => {
      const { body, headers } = signed({ timestampSeconds: NOW + offsetSeconds });
      return verifyCode(() => verifyWebhook({ headers, body, secrets: [secret], nowSeconds: NOW }));
    };
    expect(at(-300)).toBe('accepted');
    expect(at(300)).toBe('accepted');
    expect(at(-301)).toBe('timestamp_too_old');
    expect(at(301)).toBe('timestamp_too_new');
    expect(at(-86_400)).toBe('timestamp_too_old');
  });

  it('refuses missing headers, a non-numeric timestamp and truncated signatures', () => {
    const { body, headers } = signed();
    const verify = (h: Record<string, string>) => verifyCode(() => verifyWebhook({ headers: h, body, secrets: [secret], nowSeconds: NOW }));
    for (const name of ['webhook-id', 'webhook-timestamp', 'webhook-signature']) {
      const { [name]: _dropped, ...rest } = headers;
      expect(verify(rest)).toBe('missing_header');
    }
    expect(verify({ ...headers, 'webhook-timestamp': 'hello' })).toBe('invalid_timestamp');
    expect(verify({ ...headers, 'webhook-timestamp': `${NOW}abc` })).toBe('invalid_timestamp');
    expect(verify({ ...headers, 'webhook-signature': headers['webhook-signature'].slice(0, 8) })).toBe('no_matching_signature');
    expect(verify({ ...headers, 'webhook-signature': 'v1,' })).toBe('no_matching_signature');
  });

  it('reads headers case-insensitively from a plain record, a Headers object and repeated header lines', () => {
    const { body, headers } = signed();
    const upper = Object.fromEntries(Object.entries(headers).map(([k, v]) => [k.toUpperCase(), v]));
    expect(verifyCode(() => verifyWebhook({ headers: upper, body, secrets: [secret], nowSeconds: NOW }))).toBe('accepted');
    expect(verifyCode(() => verifyWebhook({ headers: new Headers(headers), body, secrets: [secret], nowSeconds: NOW }))).toBe('accepted');
    const repeated = { ...headers, 'webhook-signature': [PUBLISHED_DECOY_V1, headers['webhook-signature']] };
    expect(verifyCode(() => verifyWebhook({ headers: repeated, body, secrets: [secret], nowSeconds: NOW }))).toBe('accepted');
  });
});
