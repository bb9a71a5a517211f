import type { Request, Response } from 'express';
import type { AppDeps } from '@server/deps';
import { ApiProblem } from './api-problem';
import {
  completeRecord,
  deleteExpiredRecords,
  deleteInProgress,
  deleteRecordIfUnchanged,
  findRecord,
  insertInProgress,
  type IdempotencyRecordRow,
  type IdempotencyScope,
} from './idempotency-records.repo';

export { multipartFingerprint, rawBodyFingerprint, recordRawBodyFingerprint, sha256Hex } from './idempotency-fingerprint';

/**
 * Idempotency-Key for creating POSTs (IETF draft-ietf-httpapi-idempotency-key-header; Stripe's semantics):
 * - scope (organisation, method, route template, key); fingerprint = SHA-256 of the request as sent;
 * - the first request inserts an in_progress row, and the unique index decides between concurrent duplicates;
 * - same key + same fingerprint after completion → the stored status, Location and body, with
 *   `Idempotent-Replayed: true`; a different fingerprint → 422 idempotency_key_reused; still running → 409
 *   idempotency_request_in_progress; missing where required → 400 idempotency_key_missing;
 * - a request refused with a 4xx stores nothing (it can be corrected and retried with the same key); a 5xx
 *   is stored and replayed like a success;
 * - records live 24 h, then are pruned (periodically, and lazily when a lookup finds an expired one).
 */

export type IdempotencyMode = 'required' | 'optional';
/**
 * 'body': the router hashes the raw JSON body and claims before the handler runs.
 * 'handler': the handler reads the body itself (multipart uploads) and calls `claim(fingerprint)` once it has
 * hashed what it received and before it creates anything.
 */
export type IdempotencyFingerprintSource = 'body' | 'handler';
export interface IdempotencySetting {
  mode: IdempotencyMode;
  fingerprint: IdempotencyFingerprintSource;
}
export type IdempotencyOption = IdempotencyMode | IdempotencySetting;

export const IDEMPOTENCY_RECORD_LIFETIME_SECONDS = 24 * 3600;
/** An in_progress row older than this belongs to a request that died with its process; it is taken over. */
export const IDEMPOTENCY_ABANDONED_AFTER_SECONDS = 5 * 60;
export const IDEMPOTENCY_KEY_MAX_LENGTH = 255;
export const IDEMPOTENCY_DOCS = 'https://sweepline.example/docs#idempotency';
/** Response headers kept with the record and replayed (besides the status and body). */
const STORED_HEADERS = ['location', 'content-type'];
// Visible ASCII only: no spaces or control characters, so keys compare byte for byte (ascii_bin column).
const KEY_PATTERN = /^[\x21-\x7e]{1,255}$/;

export function idempotencySettingOf(option: IdempotencyOption | undefined): IdempotencySetting | null {
  if (option === undefined) return null;
  return typeof option === 'string' ? { mode: option, fingerprint: 'body' } : option;
}

/** Thrown by claim() when a completed response exists: the router answers with it instead of the handler. */
export class IdempotentReplay extends Error {
  constructor(readonly record: IdempotencyRecordRow) {
    super('idempotent replay');
    this.name = 'IdempotentReplay';
  }
}

/** What a handler sees as `idempotency`. */
export interface IdempotencyHandle {
  /** The client's key, or null when none was sent. */
  key: string | null;
  /**
   * Claims the key for this request (routes with fingerprint 'handler'; the router does it for 'body').
   * Without a key it does nothing. Throws 409/422 problems, or IdempotentReplay for the router to answer.
   */
  claim(fingerprint?: string): Promise<void>;
}

export const NO_IDEMPOTENCY: IdempotencyHandle = { key: null, claim: async () => {} };

function readKey(req: Request, setting: IdempotencySetting): string | null {
  const raw = req.headers['idempotency-key'];
  const value = Array.isArray(raw) ? raw.join(',') : raw;
  if (value === undefined || value === '') {
    if (setting.mode === 'required') {
      throw new ApiProblem(
        'idempotency_key_missing',
        `Send an Idempotency-Key header (a UUID v4 is recommended) so a retry of this request cannot create a second object. See ${IDEMPOTENCY_DOCS}.`,
        { extensions: { docs: IDEMPOTENCY_DOCS }, errors: [{ in: 'header', pointer: '#/idempotency-key', detail: 'Required.' }] },
      );
    }
    return null;
  }
  if (!KEY_PATTERN.test(value)) {
    throw new ApiProblem(
      'idempotency_key_invalid',
      `An Idempotency-Key is 1 to ${IDEMPOTENCY_KEY_MAX_LENGTH} visible ASCII characters without spaces (a UUID v4 is recommended).`,
      { extensions: { docs: IDEMPOTENCY_DOCS }, errors: [{ in: 'header', pointer: '#/idempotency-key', detail: 'Not a valid key.' }] },
    );
  }
  return value;
}

/** The per-request state the router drives: claim, then complete or abandon. */
export class IdempotencyRequest implements IdempotencyHandle {
  private claimedFingerprint: string | null = null;

  private constructor(
    private readonly deps: AppDeps,
    private readonly scope: IdempotencyScope | null,
  ) {}

  /** Validates the header (format first, before any lookup) and prepares the scope. */
  static begin(deps: AppDeps, req: Request, setting: IdempotencySetting, organisationId: string, method: string, routeTemplate: string) {
    const key = readKey(req, setting);
    const scope = key === null ? null : { organisationId, method: method.toUpperCase(), routeTemplate, idempotencyKey: key };
    return new IdempotencyRequest(deps, scope);
  }

  get key(): string | null {
    return this.scope?.idempotencyKey ?? null;
  }

  get claimed(): boolean {
    return this.claimedFingerprint !== null;
  }

  async claim(fingerprint?: string): Promise<void> {
    if (!this.scope || this.claimedFingerprint !== null) return;
    if (fingerprint === undefined) throw new Error('claim() needs the request fingerprint on this route');
    if (!/^[0-9a-f]{64}$/.test(fingerprint)) throw new Error('an idempotency fingerprint is a SHA-256 hex digest');
    const { db, clock } = this.deps;
    for (let round = 0; round < 3; round++) {
      const now = clock.now();
      const expiresAt = new Date(now.getTime() + IDEMPOTENCY_RECORD_LIFETIME_SECONDS * 1000);
      if (await insertInProgress(db, this.scope, { fingerprint, createdAt: now, expiresAt })) {
        this.claimedFingerprint = fingerprint;
        return;
      }
      const existing = await findRecord(db, this.scope);
      if (!existing) continue;
      const abandoned =
        existing.state === 'in_progress' && existing.createdAt.getTime() + IDEMPOTENCY_ABANDONED_AFTER_SECONDS * 1000 <= now.getTime();
      if (existing.expiresAt.getTime() <= now.getTime() || abandoned) {
        // A reuse after the lifetime is a new request (lazy pruning); so is a claim whose owner died.
        await deleteRecordIfUnchanged(db, this.scope, existing.createdAt);
        continue;
      }
      if (existing.fingerprint !== fingerprint) {
        throw new ApiProblem(
          'idempotency_key_reused',
          'This Idempotency-Key was used for a different request (another body) in the last 24 hours. Use a new key for a new request.',
          { extensions: { docs: IDEMPOTENCY_DOCS } },
        );
      }
      if (existing.state === 'in_progress') {
        throw new ApiProblem('idempotency_request_in_progress', 'The first request with this Idempotency-Key is still being processed. Retry shortly.', {
          headers: { 'Retry-After': '1' },
          extensions: { docs: IDEMPOTENCY_DOCS },
        });
      }
      throw new IdempotentReplay(existing);
    }
    throw new ApiProblem('idempotency_request_in_progress', 'Concurrent requests with this Idempotency-Key are being processed. Retry shortly.', {
      headers: { 'Retry-After': '1' },
    });
  }

  /**
   * Stores the response to replay; `serialisedBody` is the body's JSON text when the caller already has it.
   * With `replayFrom`, only that reference is stored (see `storedReplayReference`): large finished results are not
   * written a second time.
   */
  async complete(status: number, headers: Record<string, string>, body: unknown, serialisedBody?: string, replayFrom?: string): Promise<void> {
    if (!this.scope || this.claimedFingerprint === null) return;
    const kept: Record<string, string> = {};
    for (const [name, value] of Object.entries(headers)) if (STORED_HEADERS.includes(name.toLowerCase())) kept[name.toLowerCase()] = value;
    if (body !== undefined && !kept['content-type']) kept['content-type'] = 'application/json; charset=utf-8';
    await completeRecord(this.deps.db, this.scope, this.claimedFingerprint, {
      status,
      headers: kept,
      body:
        replayFrom !== undefined
          ? JSON.stringify({ [REPLAY_REFERENCE_MEMBER]: replayFrom })
          : body === undefined
            ? null
            : typeof body === 'string'
              ? body
              : (serialisedBody ?? JSON.stringify(body)),
    });
  }

  /** After an error: 4xx (refused, nothing done) leaves no record; 5xx is stored and replayed, as a success is. */
  async fail(status: number, problemBody: unknown): Promise<void> {
    if (!this.scope || this.claimedFingerprint === null) return;
    if (status >= 500) {
      await this.complete(status, { 'content-type': 'application/problem+json' }, problemBody);
    } else {
      await deleteInProgress(this.deps.db, this.scope, this.claimedFingerprint);
    }
  }
}

/** Member of a stored body that holds a reference instead of the response itself. No API body uses a "$" name. */
const REPLAY_REFERENCE_MEMBER = '$replayFrom';
const REPLAY_REFERENCE_PREFIX = `{"${REPLAY_REFERENCE_MEMBER}":`;

/** The reference a record stores instead of its body, or null when the record holds the body itself. */
export function storedReplayReference(record: Pick<IdempotencyRecordRow, 'responseBody'>): string | null {
  if (!record.responseBody?.startsWith(REPLAY_REFERENCE_PREFIX)) return null;
  const reference = (JSON.parse(record.responseBody) as Record<string, unknown>)[REPLAY_REFERENCE_MEMBER];
  return typeof reference === 'string' ? reference : null;
}

/**
 * Answers with a stored response, unchanged but for the marker header. A body stored by reference is rebuilt by
 * the route's `resolveReplay` (the object it names no longer changes, so the bytes are the first answer's).
 */
export async function sendReplay(
  res: Response,
  record: IdempotencyRecordRow,
  resolveReplay: ((reference: string) => Promise<unknown>) | null,
): Promise<void> {
  const reference = storedReplayReference(record);
  let body = record.responseBody;
  if (reference !== null) {
    const rebuilt = resolveReplay ? await resolveReplay(reference) : null;
    if (rebuilt === null || rebuilt === undefined) {
      throw new ApiProblem('not_found', 'The object this request created no longer exists, so its response cannot be replayed.');
    }
    body = JSON.stringify(rebuilt);
  }
  for (const [name, value] of Object.entries(record.responseHeaders ?? {})) res.setHeader(name, value);
  res.setHeader('Idempotent-Replayed', 'true');
  res.status(record.responseStatus ?? 500);
  if (body === null) res.end();
  else res.send(Buffer.from(body, 'utf8'));
}

export async function pruneIdempotencyRecords(deps: Pick<AppDeps, 'db' | 'clock'>, batchSize = 1000): Promise<number> {
  let total = 0;
  for (;;) {
    const removed = await deleteExpiredRecords(deps.db, deps.clock.now(), batchSize);
    total += removed;
    if (removed < batchSize) return total;
  }
}

/** Prunes expired records every `intervalSeconds` (default 10 min); returns a stop function. */
export function startIdempotencyPruner(deps: AppDeps, intervalSeconds = 600): () => void {
  const timer = setInterval(() => {
    pruneIdempotencyRecords(deps).catch((error: unknown) => deps.logger.error({ err: error }, 'idempotency pruning failed'));
  }, intervalSeconds * 1000);
  timer.unref();
  return () => clearInterval(timer);
}
