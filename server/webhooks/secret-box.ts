import { createCipheriv, createDecipheriv, randomBytes } from 'node:crypto';

/**
 * Webhook signing secrets cannot be hashed like API keys (the server needs the key to sign), so they are kept
 * encrypted with AES-256-GCM under a server key from the configuration. The endpoint id is bound in as
 * associated data, so a ciphertext copied onto another endpoint's row does not decrypt.
 */
const FORMAT_VERSION = 'v1';
const KEY_BYTES = 32;
const NONCE_BYTES = 12;
const TAG_BYTES = 16;

export class SecretBoxError extends Error {
  readonly code = 'secret_box_invalid';
  constructor(message: string) {
    super(message);
    this.name = 'SecretBoxError';
  }
}

function requireKey(key: Uint8Array): void {
  if (key.length !== KEY_BYTES) throw new SecretBoxError(`The secret-box key must be ${KEY_BYTES} bytes.`);
}

/** `v1.<nonce>.<ciphertext>.<tag>`, each part base64url. */
export function sealSecret(plaintext: string, key: Uint8Array, associatedData: string): string {
  requireKey(key);
  const nonce = randomBytes(NONCE_BYTES);
  const cipher = createCipheriv('aes-256-gcm', key, nonce);
  cipher.setAAD(Buffer.from(associatedData, 'utf8'));
  const ciphertext = Buffer.concat([cipher.update(plaintext, 'utf8'), cipher.final()]);
  return [FORMAT_VERSION, nonce, ciphertext, cipher.getAuthTag()]
    .map((part) => (typeof part === 'string' ? part : part.toString('base64url')))
    .join('.');
}

export function openSecret(sealed: string, key: Uint8Array, associatedData: string): string {
  requireKey(key);
  const parts = sealed.split('.');
  if (parts.length !== 4 || parts[0] !== FORMAT_VERSION) throw new SecretBoxError('Not a sealed secret.');
  const [nonce, ciphertext, tag] = parts.slice(1).map((part) => Buffer.from(part, 'base64url'));
  if (nonce.length !== NONCE_BYTES || tag.length !== TAG_BYTES) throw new SecretBoxError('Not a sealed secret.');
  const decipher = createDecipheriv('aes-256-gcm', key, nonce);
  decipher.setAAD(Buffer.from(associatedData, 'utf8'));
  decipher.setAuthTag(tag);
  try {
    return Buffer.concat([decipher.update(ciphertext), decipher.final()]).toString('utf8');
  } catch {
    throw new SecretBoxError('The sealed secret does not open with this key and endpoint.');
  }
}
