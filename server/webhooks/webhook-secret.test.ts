import { describe, expect, it } from 'vitest';
import { decodeWebhookSecret, generateWebhookSecret } from './webhook-secret';

describe('webhook secrets', () => {
  it('are whsec_ + base64 of 24–64 random bytes (Standard Webhooks v1.0.0, "Signing secret")', () => {
    const secret = generateWebhookSecret();
    expect(secret).toMatch(/^whsec_[A-Za-z0-9+/]+={0,2}$/);
    expect(decodeWebhookSecret(secret)).toHaveLength(32);
    expect(decodeWebhookSecret(generateWebhookSecret(24))).toHaveLength(24);
    expect(decodeWebhookSecret(generateWebhookSecret(64))).toHaveLength(64);
    expect(() => generateWebhookSecret(16)).toThrow(/24–64/);
    expect(() => generateWebhookSecret(65)).toThrow(/24–64/);
  });

  it('differ every time (CSPRNG, not a counter or a clock)', () => {
    const secrets = new Set(Array.from({ length: 200 }, () => generateWebhookSecret()));
    expect(secrets.size).toBe(200);
  });

  it('decode the published Standard Webhooks secret to its 24 bytes, with or without the prefix', () => {
    // libraries/javascript/src/webhook.test.ts: "MfKQ9r8GKYqrTwjUPD8ILPZIo2LaLaSw", 32 base64 characters = 24 bytes.
    const bare = 'MfKQ9r8GKYqrTwjUPD8ILPZIo2LaLaSw';
    expect(decodeWebhookSecret(`whsec_${bare}`)).toEqual(Buffer.from(bare, 'base64'));
    expect(decodeWebhookSecret(bare)).toHaveLength(24);
  });

  it('refuse non-base64, non-canonical, too short and too long keys', () => {
    expect(() => decodeWebhookSecret('whsec_not base64!')).toThrow(expect.objectContaining({ code: 'invalid_secret' }));
    expect(() => decodeWebhookSecret('whsec_' + Buffer.alloc(16).toString('base64'))).toThrow(/16 bytes/);
    expect(() => decodeWebhookSecret('whsec_' + Buffer.alloc(65).toString('base64'))).toThrow(/65 bytes/);
    // "QQ==" and "QR==" both decode to "A"; only the canonical one is accepted.
    expect(() => decodeWebhookSecret('whsec_' + 'A'.repeat(32) + 'QR==')).toThrow(/canonical/);
    expect(() => decodeWebhookSecret('')).toThrow(expect.objectContaining({ code: 'invalid_secret' }));
  });
});
