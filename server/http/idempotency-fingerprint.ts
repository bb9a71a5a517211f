import { createHash } from 'node:crypto';
import type { Request } from 'express';

/** What identifies "the same request" for an Idempotency-Key: SHA-256 (hex) of what the client sent. */

export function sha256Hex(bytes: Uint8Array | string): string {
  return createHash('sha256').update(bytes).digest('hex');
}

/** What app.ts's JSON parser records while reading the body: the SHA-256 of the raw bytes. */
export function rawBodyFingerprint(req: Request): string {
  return (req as Request & { rawBodySha256?: string }).rawBodySha256 ?? sha256Hex('');
}

/** For express.json({ verify }): keeps the hash of the exact bytes received, before parsing. */
export function recordRawBodyFingerprint(req: unknown, _res: unknown, buffer: Buffer): void {
  (req as { rawBodySha256?: string }).rawBodySha256 = sha256Hex(buffer);
}

/**
 * Fingerprint of a multipart request: SHA-256 over its parts (field names, text values, and each file's own
 * SHA-256), not over the raw bytes, because clients draw a new random boundary on every retry (curl does), which
 * would make every honest retry look like a different request.
 */
export function multipartFingerprint(parts: { fields: Record<string, string>; files: Array<{ field: string; sha256: string }> }): string {
  const canonical = [
    ...Object.entries(parts.fields).map(([name, value]) => ['field', name, value]),
    ...parts.files.map((file) => ['file', file.field, file.sha256]),
  ].sort((a, b) => (a.join('\u0000') < b.join('\u0000') ? -1 : 1));
  return sha256Hex(JSON.stringify(canonical));
}
