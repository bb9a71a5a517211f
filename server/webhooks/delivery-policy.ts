import { isWebhookError } from './webhook-error';

/**
 * When to retry a webhook and what a receiver's answer means. Pure: the clock and the random source are
 * passed in, so the dispatcher (and its tests) decide what "now" is.
 */

/**
 * Delay before each attempt, in seconds: Standard Webhooks v1.0.0 "Example retry schedule" (immediately, 5 s,
 * 5 min, 30 min, 2 h, 5 h, 10 h, 14 h, 20 h, 24 h; about 3 days 3½ hours in total). The growth is roughly
 * exponential early and flattens at a day so a receiver that is down over a weekend still gets the event.
 */
export const RETRY_DELAYS_SECONDS: readonly number[] = [0, 5, 300, 1800, 7200, 18000, 36000, 50400, 72000, 86400];
export const MAX_DELIVERY_ATTEMPTS = RETRY_DELAYS_SECONDS.length;
/** Standard Webhooks v1.0.0 "Request timeouts": 15–30 s recommended; we take the low end. */
export const DELIVERY_TIMEOUT_MS = 15_000;
/** ±10 % spread, so endpoints that failed together are not retried together (common practice, no source). */
export const RETRY_JITTER_FRACTION = 0.1;
/** A receiver's Retry-After is honoured up to a day; beyond that it could park an event indefinitely. */
export const RETRY_AFTER_MAX_SECONDS = 86_400;

export type RetryReason =
  | 'rate_limited'
  | 'server_error'
  | 'redirect'
  | 'client_error'
  | 'unexpected_status'
  | 'timeout'
  | 'network_error'
  | 'egress_refused';

export type DeliveryOutcome =
  | { kind: 'succeeded' }
  | { kind: 'disable_endpoint'; reason: 'gone' }
  | { kind: 'retry'; reason: RetryReason; retryAfterSeconds: number | null };

export type NextStep =
  | { action: 'done' }
  | { action: 'disable_endpoint' }
  | { action: 'retry'; notBefore: Date; delayMs: number }
  | { action: 'give_up' };

/**
 * Retry-After as seconds from `now`: delay-seconds or an HTTP-date (RFC 9110 §10.2.3). Null when absent or
 * unreadable; a date in the past gives 0.
 */
export function parseRetryAfterSeconds(value: string | string[] | undefined | null, now: Date): number | null {
  const text = (Array.isArray(value) ? value[0] : value)?.trim();
  if (!text) return null;
  if (/^\d+$/.test(text)) return Number(text);
  if (!/GMT$/.test(text)) return null;
  const atMs = Date.parse(text);
  if (Number.isNaN(atMs)) return null;
  return Math.max(0, Math.ceil((atMs - now.getTime()) / 1000));
}

/**
 * Standard Webhooks v1.0.0 "Delivery success and failure": 2xx succeeds; redirects are failures and are not
 * followed; 410 Gone means the receiver wants no more events; every other answer is a failure to retry
 * (429, 502 and 504 ask for throttling, which the back-off and Retry-After provide).
 */
export function classifyDeliveryResponse(statusCode: number, retryAfterHeader: string | string[] | undefined, now: Date): DeliveryOutcome {
  if (statusCode >= 200 && statusCode <= 299) return { kind: 'succeeded' };
  if (statusCode === 410) return { kind: 'disable_endpoint', reason: 'gone' };
  const retryAfterSeconds = parseRetryAfterSeconds(retryAfterHeader, now);
  const reason: RetryReason =
    statusCode === 429
      ? 'rate_limited'
      : statusCode >= 500 && statusCode <= 599
        ? 'server_error'
        : statusCode >= 300 && statusCode <= 399
          ? 'redirect'
          : statusCode >= 400 && statusCode <= 499
            ? 'client_error'
            : 'unexpected_status';
  return { kind: 'retry', reason, retryAfterSeconds };
}

const TIMEOUT_ERROR_CODES = new Set(['UND_ERR_HEADERS_TIMEOUT', 'UND_ERR_BODY_TIMEOUT', 'UND_ERR_CONNECT_TIMEOUT', 'ETIMEDOUT']);

/** A delivery that got no HTTP answer: timeouts, resets, refused connections, TLS failures, egress refusals. */
export function classifyDeliveryError(error: unknown): DeliveryOutcome {
  if (isWebhookError(error)) return { kind: 'retry', reason: 'egress_refused', retryAfterSeconds: null };
  const { name, code } = (error ?? {}) as { name?: string; code?: string };
  const timedOut = name === 'TimeoutError' || name === 'AbortError' || (code !== undefined && TIMEOUT_ERROR_CODES.has(code));
  return { kind: 'retry', reason: timedOut ? 'timeout' : 'network_error', retryAfterSeconds: null };
}

export interface NextStepInput {
  outcome: DeliveryOutcome;
  /** Attempts made so far, including the one that produced `outcome` (1 after the first attempt). */
  attemptsMade: number;
  now: Date;
  /** Uniform in [0, 1); injected so tests are deterministic. */
  random?: () => number;
}

/** Delay before attempt number `attemptsMade + 1`, with jitter; null once the schedule is used up. */
export function retryDelayMs(attemptsMade: number, random: () => number = Math.random): number | null {
  if (!Number.isInteger(attemptsMade) || attemptsMade < 1) throw new RangeError('attemptsMade counts from 1.');
  if (attemptsMade >= MAX_DELIVERY_ATTEMPTS) return null;
  const baseMs = RETRY_DELAYS_SECONDS[attemptsMade] * 1000;
  const spread = (random() * 2 - 1) * RETRY_JITTER_FRACTION;
  return Math.round(baseMs * (1 + spread));
}

/** What the dispatcher does after an attempt: stop, disable the endpoint, or retry not before a given time. */
export function nextDeliveryStep(input: NextStepInput): NextStep {
  const { outcome, attemptsMade, now } = input;
  if (outcome.kind === 'succeeded') return { action: 'done' };
  if (outcome.kind === 'disable_endpoint') return { action: 'disable_endpoint' };
  const scheduledMs = retryDelayMs(attemptsMade, input.random);
  if (scheduledMs === null) return { action: 'give_up' };
  const retryAfterMs = outcome.retryAfterSeconds === null ? 0 : Math.min(outcome.retryAfterSeconds, RETRY_AFTER_MAX_SECONDS) * 1000;
  const delayMs = Math.max(scheduledMs, retryAfterMs);
  return { action: 'retry', delayMs, notBefore: new Date(now.getTime() + delayMs) };
}
