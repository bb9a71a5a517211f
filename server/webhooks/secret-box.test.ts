import { createDecipheriv, randomBytes } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { openSecret, sealSecret } from './secret-box';

const KEY = randomBytes(32);
const SECRET = 'whsec_MfKQ9r8GKYqrTwjUPD8ILPZIo2LaLaSw';

describe('secret box (AES-256-GCM, NIST SP 800-38D)', () => {
  it('round-trips and never stores the plaintext', () => {
    const sealed = sealSecret(SECRET, KEY, 'whe_1');
    expect(sealed).not.toContain('MfKQ9r8G');
    expect(openSecret(sealed, KEY, 'whe_1')).toBe(SECRET);
    expect(sealSecret(SECRET, KEY, 'whe_1')).not.toBe(sealed); // fresh nonce every time
  });

  it('is plain AES-256-GCM with the endpoint id as associated data (independent decryption with node:crypto)', () => {
    const [, nonce, ciphertext, tag] = sealSecret(SECRET, KEY, 'whe_1').split('.').map((part) => Buffer.from(part, 'base64url'));
    const decipher = createDecipheriv('aes-256-gcm', KEY, nonce);
    decipher.setAAD(Buffer.from('whe_1'));
    decipher.setAuthTag(tag);
    expect(Buffer.concat([decipher.update(ciphertext), decipher.final()]).toString()).toBe(SECRET);
  });

  it('refuses another endpoint id, another key and any flipped bit', () => {
    const sealed = sealSecret(SECRET, KEY, 'whe_1');
    expect(() => openSecret(sealed, KEY, 'whe_2')).toThrow(/does not open/);
    expect(() => openSecret(sealed, randomBytes(32), 'whe_1')).toThrow(/does not open/);
    const parts = sealed.split('.');
    const ciphertext = Buffer.from(parts[2], 'base64url');
    ciphertext[0] ^= 1;
    expect(() => openSecret([parts[0], parts[1], ciphertext.toString('base64url'), parts[3]].join('.'), KEY, 'whe_1')).toThrow(/does not open/);
    expect(() => openSecret('v2.a.b.c', KEY, 'whe_1')).toThrow(/Not a sealed secret/);
    expect(() => sealSecret(SECRET, randomBytes(16), 'whe_1')).toThrow(/32 bytes/);
  });
});
