import { createHmac, timingSafeEqual } from 'node:crypto';
import { decodeWebhookSecret } from './webhook-secret';
import { WebhookError } from './webhook-error';

/** Header names of Standard Webhooks v1.0.0 ("Webhook headers"). */
export const WEBHOOK_ID_HEADER = 'webhook-id';
export const WEBHOOK_TIMESTAMP_HEADER = 'webhook-timestamp';
export const WEBHOOK_SIGNATURE_HEADER = 'webhook-signature';
/** Receivers refuse attempts stamped more than this far in the past or future (replay window). */
export const WEBHOOK_TIMESTAMP_TOLERANCE_SECONDS = 300;

const SIGNATURE_VERSION = 'v1';
const HMAC_SHA256_BYTES = 32;
// Ids are chosen by us, never by a customer, and may not contain "." (it delimits the signed content).
const MESSAGE_ID_PATTERN = /^[A-Za-z0-9_-]{1,255}$/;
const TIMESTAMP_PATTERN = /^\d{1,12}$/;
// Bounds the work a hostile header can cause on the verifying side.
const MAX_SIGNATURES_CONSIDERED = 20;

export type WebhookBody = string | Uint8Array;

export interface WebhookSignatureHeaders {
  'webhook-id': string;
  'webhook-timestamp': string;
  'webhook-signature': string;
}

export interface SignWebhookInput {
  /** Event id, stable across retries so receivers can deduplicate. */
  messageId: string;
  /** Unix seconds of this delivery attempt (not of the event). */
  timestampSeconds: number;
  /** The exact bytes that will be sent. */
  body: WebhookBody;
  /** Current secret first; during a rotation also the previous one, so either verifies. */
  secrets: readonly string[];
}

/** Exactly what gets signed: `{id}.{timestamp}.{raw body}`. */
export function webhookSignedContent(messageId: string, timestamp: number | string, body: WebhookBody): Buffer {
  const bodyBytes = typeof body === 'string' ? Buffer.from(body, 'utf8') : Buffer.from(body);
  return Buffer.concat([Buffer.from(`${messageId}.${timestamp}.`, 'utf8'), bodyBytes]);
}

function hmacSha256(key: Buffer, content: Buffer): Buffer {
  return createHmac('sha256', key).update(content).digest();
}

/** One `v1,<base64 HMAC-SHA256>` signature. */
export function computeWebhookSignature(
  secret: string,
  messageId: string,
  timestampSeconds: number,
  body: WebhookBody,
): string {
  const digest = hmacSha256(decodeWebhookSecret(secret), webhookSignedContent(messageId, timestampSeconds, body));
  return `${SIGNATURE_VERSION},${digest.toString('base64')}`;
}

/** The three headers a delivery attempt carries; one signature per secret, space-separated. */
export function signWebhook(input: SignWebhookInput): WebhookSignatureHeaders {
  const { messageId, timestampSeconds, body, secrets } = input;
  if (!MESSAGE_ID_PATTERN.test(messageId)) {
    throw new WebhookError('invalid_message_id', 'A webhook id is 1–255 characters of A–Z, a–z, 0–9, "_" or "-".');
  }
  if (!Number.isSafeInteger(timestampSeconds) || timestampSeconds < 0) {
    throw new WebhookError('invalid_timestamp', 'The webhook timestamp is whole Unix seconds.');
  }
  if (secrets.length === 0) {
    throw new WebhookError('invalid_secret', 'At least one signing secret is required.');
  }
  const signatures = secrets.map((secret) => computeWebhookSignature(secret, messageId, timestampSeconds, body));
  return {
    [WEBHOOK_ID_HEADER]: messageId,
    [WEBHOOK_TIMESTAMP_HEADER]: String(timestampSeconds),
    [WEBHOOK_SIGNATURE_HEADER]: signatures.join(' '),
  } as WebhookSignatureHeaders;
}

export type IncomingWebhookHeaders =
  | { get(name: string): string | null }
  | Record<string, string | string[] | undefined>;

export interface VerifyWebhookInput {
  headers: IncomingWebhookHeaders;
  /** The raw request body, before any JSON parsing. */
  body: WebhookBody;
  /** Every secret currently accepted (e.g. new and old during a rotation). */
  secrets: readonly string[];
  nowSeconds?: number;
  toleranceSeconds?: number;
}

export interface VerifiedWebhook {
  messageId: string;
  timestampSeconds: number;
  /** Which of the given secrets matched; lets a receiver notice when the old one is no longer used. */
  matchedSecretIndex: number;
}

function readHeader(headers: IncomingWebhookHeaders, name: string): string | undefined {
  if (typeof (headers as { get?: unknown }).get === 'function') {
    return (headers as { get(name: string): string | null }).get(name) ?? undefined;
  }
  const record = headers as Record<string, string | string[] | undefined>;
  const key = Object.keys(record).find((candidate) => candidate.toLowerCase() === name);
  const value = key === undefined ? undefined : record[key];
  return Array.isArray(value) ? value.join(' ') : value;
}

function requireHeader(headers: IncomingWebhookHeaders, name: string): string {
  const value = readHeader(headers, name)?.trim();
  if (!value) throw new WebhookError('missing_header', `The ${name} header is missing.`, { header: name });
  return value;
}

/** Decoded v1 signatures from the header; other versions (e.g. v1a) and malformed entries are skipped. */
function candidateSignatures(signatureHeader: string): Buffer[] {
  const candidates: Buffer[] = [];
  for (const entry of signatureHeader.split(' ').filter(Boolean).slice(0, MAX_SIGNATURES_CONSIDERED)) {
    const comma = entry.indexOf(',');
    if (comma < 0 || entry.slice(0, comma) !== SIGNATURE_VERSION) continue;
    const decoded = Buffer.from(entry.slice(comma + 1), 'base64');
    if (decoded.length === HMAC_SHA256_BYTES) candidates.push(decoded);
  }
  return candidates;
}

/**
 * Checks a received webhook: headers present, timestamp within tolerance either way, and at least one v1
 * signature equal (constant-time) to the HMAC under one of `secrets`. Throws WebhookError otherwise.
 */
export function verifyWebhook(input: VerifyWebhookInput): VerifiedWebhook {
  const toleranceSeconds = input.toleranceSeconds ?? WEBHOOK_TIMESTAMP_TOLERANCE_SECONDS;
  const nowSeconds = input.nowSeconds ?? Math.floor(Date.now() / 1000);
  const messageId = requireHeader(input.headers, WEBHOOK_ID_HEADER);
  const timestampText = requireHeader(input.headers, WEBHOOK_TIMESTAMP_HEADER);
  const signatureHeader = requireHeader(input.headers, WEBHOOK_SIGNATURE_HEADER);

  if (!TIMESTAMP_PATTERN.test(timestampText)) {
    throw new WebhookError('invalid_timestamp', 'The webhook-timestamp header is not whole Unix seconds.');
  }
  const timestampSeconds = Number(timestampText);
  if (nowSeconds - timestampSeconds > toleranceSeconds) {
    throw new WebhookError('timestamp_too_old', 'The webhook timestamp is older than the tolerance.', { toleranceSeconds });
  }
  if (timestampSeconds - nowSeconds > toleranceSeconds) {
    throw new WebhookError('timestamp_too_new', 'The webhook timestamp is ahead of the tolerance.', { toleranceSeconds });
  }

  // Sign over the header text as received, so a sender's formatting can never make a valid message fail.
  const content = webhookSignedContent(messageId, timestampText, input.body);
  const candidates = candidateSignatures(signatureHeader);
  const keys = input.secrets.map(decodeWebhookSecret);
  for (const [secretIndex, key] of keys.entries()) {
    const expected = hmacSha256(key, content);
    if (candidates.some((candidate) => timingSafeEqual(candidate, expected))) {
      return { messageId, timestampSeconds, matchedSecretIndex: secretIndex };
    }
  }
  throw new WebhookError('no_matching_signature', 'No webhook signature matches the accepted secrets.');
}
