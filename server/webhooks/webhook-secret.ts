import { randomBytes } from 'node:crypto';
import { WebhookError } from './webhook-error';

/** Serialised form of a symmetric signing secret: `whsec_` + base64 of the raw key (Standard Webhooks v1.0.0). */
export const WEBHOOK_SECRET_PREFIX = 'whsec_';
/** Standard Webhooks v1.0.0, "Signing secret": at least 24 bytes, at most 512 bits. */
export const WEBHOOK_SECRET_MIN_BYTES = 24;
export const WEBHOOK_SECRET_MAX_BYTES = 64;
const DEFAULT_SECRET_BYTES = 32;

const BASE64_PATTERN = /^[A-Za-z0-9+/]+={0,2}$/;

/**
 * A fresh per-endpoint secret from the CSPRNG. It is shown to the organisation once; the server keeps it
 * encrypted (see secret-box.ts), not hashed, because signing needs the key itself.
 */
export function generateWebhookSecret(byteLength: number = DEFAULT_SECRET_BYTES): string {
  if (!Number.isInteger(byteLength) || byteLength < WEBHOOK_SECRET_MIN_BYTES || byteLength > WEBHOOK_SECRET_MAX_BYTES) {
    throw new WebhookError(
      'invalid_secret',
      `A webhook secret must be ${WEBHOOK_SECRET_MIN_BYTES}–${WEBHOOK_SECRET_MAX_BYTES} random bytes.`,
    );
  }
  return WEBHOOK_SECRET_PREFIX + randomBytes(byteLength).toString('base64');
}

/**
 * Raw HMAC key bytes of a `whsec_…` secret. The prefix is optional on input (receivers often paste the bare
 * base64), but the base64 must be canonical and the key 24–64 bytes long.
 */
export function decodeWebhookSecret(secret: string): Buffer {
  const encoded = secret.startsWith(WEBHOOK_SECRET_PREFIX) ? secret.slice(WEBHOOK_SECRET_PREFIX.length) : secret;
  if (!BASE64_PATTERN.test(encoded)) {
    throw new WebhookError('invalid_secret', 'The webhook secret is not base64 after the whsec_ prefix.');
  }
  const key = Buffer.from(encoded, 'base64');
  if (key.toString('base64').replace(/=+$/, '') !== encoded.replace(/=+$/, '')) {
    throw new WebhookError('invalid_secret', 'The webhook secret is not canonical base64.');
  }
  if (key.length < WEBHOOK_SECRET_MIN_BYTES || key.length > WEBHOOK_SECRET_MAX_BYTES) {
    throw new WebhookError(
      'invalid_secret',
      `The webhook secret decodes to ${key.length} bytes; ${WEBHOOK_SECRET_MIN_BYTES}–${WEBHOOK_SECRET_MAX_BYTES} are required.`,
      { keyBytes: key.length },
    );
  }
  return key;
}
