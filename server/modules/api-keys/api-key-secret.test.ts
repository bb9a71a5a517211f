import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { describeSecret, generateApiKeySecret, hasSecretFormat, SECRET_RANDOM_LENGTH } from './api-key-secret';

describe('API key secrets', () => {
  it('carry at least 256 bits of randomness after a recognisable prefix', () => {
    const { secret } = generateApiKeySecret();
    expect(secret).toMatch(/^swl_live_[0-9A-Za-z]{43}$/);
    // Entropy of n symbols drawn uniformly from 62: n·log2(62) (Shannon; common practice, no source).
    expect(SECRET_RANDOM_LENGTH * Math.log2(62)).toBeGreaterThanOrEqual(256);
    expect(hasSecretFormat(secret)).toBe(true);
  });

  it('stores only a SHA-256 hash, a display prefix and the last four characters', () => {
    const { secret, prefix, lastFour, secretHash } = generateApiKeySecret();
    // FIPS 180-4 SHA-256 via Node's OpenSSL binding as the reference.
    expect(secretHash).toBe(createHash('sha256').update(secret).digest('hex'));
    expect(secret.startsWith(prefix)).toBe(true);
    expect(prefix).toHaveLength('swl_live_'.length + 8);
    expect(secret.endsWith(lastFour)).toBe(true);
    expect(describeSecret(secret)).toEqual({ prefix, lastFour, secretHash });
  });

  it('are different every time', () => {
    const secrets = new Set(Array.from({ length: 200 }, () => generateApiKeySecret().secret));
    expect(secrets.size).toBe(200);
  });

  it('rejects garbled candidates', () => {
    const { secret } = generateApiKeySecret();
    expect(hasSecretFormat(secret.slice(0, -1))).toBe(false);
    expect(hasSecretFormat(`${secret}x`)).toBe(false);
    expect(hasSecretFormat(secret.replace('swl_live_', 'swl_test_'))).toBe(false);
    expect(hasSecretFormat(`${secret.slice(0, -1)}!`)).toBe(false);
  });
});
