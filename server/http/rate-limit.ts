import { sql } from 'drizzle-orm';
import type { Response } from 'express';
import type { AppDeps } from '@server/deps';
import { rateLimitWindows } from '@server/db/tables';
import { cachedPlanLimits } from '@server/modules/usage/organisation-plan.service';
import { ApiProblem } from './api-problem';
import type { Principal } from './principal';

/**
 * Request rate per API key (or per signed-in user, at 10× a key's rate) and organisation, from the plan's requestsPerMinute, in fixed
 * one-minute windows counted in MariaDB. The count lives in the database, not in the process, so the limit holds
 * however many server processes share the load (an in-process counter would multiply it by the process count).
 * Each request costs one upsert.
 *
 * Headers follow the IETF RateLimit fields draft (draft-ietf-httpapi-ratelimit-headers-11): RateLimit-Policy
 * `"per-minute";q=60;w=60` and RateLimit `"per-minute";r=41;t=23` (structured-field lists, RFC 9651). We write
 * them ourselves: express-rate-limit 8 with standardHeaders 'draft-8' emits the same two fields but names the
 * policy after its numbers and adds a `pk` partition key by default, and it counts in process memory unless given
 * a store. On 429: `Retry-After` in seconds (clients must obey it over RateLimit) and problem quota_exceeded.
 */
export const RATE_LIMIT_POLICY_NAME = 'per-minute';
export const RATE_LIMIT_WINDOW_SECONDS = 60;
/** A console page fetches several resources per view, so a signed-in user gets this many times a key's rate. */
export const SESSION_RATE_MULTIPLIER = 10;

async function requestsPerMinute(deps: AppDeps, principal: Principal): Promise<number> {
  const perKey = (await cachedPlanLimits(deps, principal.organisationId)).requestsPerMinute;
  return principal.actor.type === 'api_key' ? perKey : perKey * SESSION_RATE_MULTIPLIER;
}

function partitionKeyOf(principal: Principal): string {
  return `${principal.organisationId}:${principal.actor.type === 'api_key' ? 'key' : 'usr'}:${principal.actor.id}`;
}

export function rateLimitPolicyHeader(quota: number): string {
  return `"${RATE_LIMIT_POLICY_NAME}";q=${quota};w=${RATE_LIMIT_WINDOW_SECONDS}`;
}

export function rateLimitHeader(remaining: number, resetSeconds: number): string {
  return `"${RATE_LIMIT_POLICY_NAME}";r=${remaining};t=${resetSeconds}`;
}

export interface RateLimitCharge {
  /** Gives the request back (it was refused as invalid or forbidden, which is not charged). */
  refund(): Promise<void>;
}

/**
 * Counts the request in the caller's current window, sets RateLimit-Policy and RateLimit, and throws 429
 * quota_exceeded with Retry-After when the window's quota is used up.
 */
export async function chargeRequest(deps: AppDeps, principal: Principal, res: Response): Promise<RateLimitCharge> {
  const quota = await requestsPerMinute(deps, principal);
  const nowMs = deps.clock.now().getTime();
  const windowMs = RATE_LIMIT_WINDOW_SECONDS * 1000;
  const windowStart = new Date(Math.floor(nowMs / windowMs) * windowMs);
  const resetSeconds = Math.max(1, Math.ceil((windowStart.getTime() + windowMs - nowMs) / 1000));
  const partitionKey = partitionKeyOf(principal);

  // LAST_INSERT_ID(expr) hands the new count back in the same statement, so no second query is needed.
  const [result] = (await deps.db.execute(
    sql`INSERT INTO ${rateLimitWindows} (partition_key, window_start, request_count) VALUES (${partitionKey}, ${windowStart}, LAST_INSERT_ID(1))
        ON DUPLICATE KEY UPDATE request_count = LAST_INSERT_ID(request_count + 1)`,
  )) as unknown as [{ insertId: number }];
  const count = Number(result.insertId);
  const remaining = Math.max(0, quota - count);
  res.setHeader('RateLimit-Policy', rateLimitPolicyHeader(quota));
  res.setHeader('RateLimit', rateLimitHeader(remaining, resetSeconds));
  if (count > quota) {
    throw new ApiProblem('quota_exceeded', `This key (or user) may make ${quota} requests per minute; wait ${resetSeconds} s.`, {
      headers: { 'Retry-After': String(resetSeconds) },
      extensions: {
        'violated-policies': [RATE_LIMIT_POLICY_NAME],
        quota: 'requests_per_minute',
        limit: quota,
        windowSeconds: RATE_LIMIT_WINDOW_SECONDS,
        retryAfterSeconds: resetSeconds,
      },
    });
  }
  let refunded = false;
  return {
    async refund() {
      if (refunded) return;
      refunded = true;
      await deps.db.execute(
        sql`UPDATE ${rateLimitWindows} SET request_count = request_count - 1 WHERE partition_key = ${partitionKey} AND window_start = ${windowStart} AND request_count > 0`,
      );
      if (!res.headersSent) res.setHeader('RateLimit', rateLimitHeader(Math.min(quota, remaining + 1), resetSeconds));
    },
  };
}

/** Statuses that mean "refused before doing anything": not charged to the rate limit (nor to any quota). */
export function isUnchargedStatus(status: number): boolean {
  return status === 400 || status === 401 || status === 403 || status === 413 || status === 415 || status === 422;
}

export async function pruneRateLimitWindows(deps: Pick<AppDeps, 'db' | 'clock'>): Promise<void> {
  const before = new Date(deps.clock.now().getTime() - 2 * RATE_LIMIT_WINDOW_SECONDS * 1000);
  await deps.db.execute(sql`DELETE FROM ${rateLimitWindows} WHERE window_start < ${before} LIMIT 10000`);
}

/** Drops finished windows every `intervalSeconds`; returns a stop function. */
export function startRateLimitPruner(deps: AppDeps, intervalSeconds = 120): () => void {
  const timer = setInterval(() => {
    pruneRateLimitWindows(deps).catch((error: unknown) => deps.logger.error({ err: error }, 'rate-limit pruning failed'));
  }, intervalSeconds * 1000);
  timer.unref();
  return () => clearInterval(timer);
}
