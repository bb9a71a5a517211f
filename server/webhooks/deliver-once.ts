import { request as undiciRequest } from 'undici';
import { classifyDeliveryError, classifyDeliveryResponse, DELIVERY_TIMEOUT_MS, type DeliveryOutcome } from './delivery-policy';
import { createPinnedDispatcher, resolveWebhookTarget, type EgressPolicy, type HostResolver } from './egress-guard';

/** How much of a receiver's reply is read and kept for the delivery log; the rest is never downloaded. */
export const RESPONSE_EXCERPT_MAX_BYTES = 1024;
const USER_AGENT = 'Sweepline-Webhooks/1';

export interface DeliverOnceInput {
  url: string;
  /** The signed webhook-* headers (and any extra); content-type defaults to application/json. */
  headers: Record<string, string>;
  /** The exact signed bytes. */
  body: string | Uint8Array;
  policy: EgressPolicy;
  resolveHost?: HostResolver;
  /** Replaceable for tests of error paths; defaults to undici's request. */
  requestImpl?: typeof undiciRequest;
  timeoutMs?: number;
  responseExcerptMaxBytes?: number;
  now?: () => Date;
}

/** One row of the delivery log. */
export interface DeliveryAttempt {
  outcome: DeliveryOutcome;
  statusCode: number | null;
  /** First bytes of the reply, decoded as UTF-8 (invalid sequences replaced). */
  responseExcerpt: string;
  /** True when the reply was longer than the excerpt and the rest was discarded unread. */
  responseTruncated: boolean;
  durationMs: number;
  /** Why no HTTP answer was obtained (timeout, refused, egress guard...), null when there was one. */
  error: { code: string; message: string } | null;
  /** The address the guard allowed first (for the log; the connection may use any of the checked ones). */
  targetAddress: string | null;
  attemptedAt: Date;
}

async function readExcerpt(body: AsyncIterable<Uint8Array> & { destroy(error?: Error): unknown }, maxBytes: number) {
  const chunks: Buffer[] = [];
  let kept = 0;
  let truncated = false;
  for await (const chunk of body) {
    const room = maxBytes - kept;
    if (chunk.byteLength > room) {
      chunks.push(Buffer.from(chunk.subarray(0, room)));
      truncated = true;
      break;
    }
    chunks.push(Buffer.from(chunk));
    kept += chunk.byteLength;
  }
  if (truncated) body.destroy();
  return { excerpt: Buffer.concat(chunks).toString('utf8'), truncated };
}

function errorSummary(error: unknown): { code: string; message: string } {
  const { name, code, message } = (error ?? {}) as { name?: string; code?: string; message?: string };
  return { code: code ?? name ?? 'unknown', message: message ?? String(error) };
}

/**
 * One delivery attempt: guard the target, POST the signed body over a connection pinned to the checked
 * addresses, follow no redirect, read at most a small excerpt of the reply, and classify the result. Never
 * throws for anything the receiver or the network does; the outcome says what happened.
 */
export async function deliverOnce(input: DeliverOnceInput): Promise<DeliveryAttempt> {
  const now = input.now ?? (() => new Date());
  const timeoutMs = input.timeoutMs ?? DELIVERY_TIMEOUT_MS;
  const maxBytes = input.responseExcerptMaxBytes ?? RESPONSE_EXCERPT_MAX_BYTES;
  const requestImpl = input.requestImpl ?? undiciRequest;
  const attemptedAt = now();
  const startedMs = performance.now();
  const elapsedMs = () => Math.round(performance.now() - startedMs);
  let targetAddress: string | null = null;
  let dispatcher: ReturnType<typeof createPinnedDispatcher> | undefined;

  try {
    const target = await resolveWebhookTarget(input.url, input.policy, input.resolveHost);
    targetAddress = target.addresses[0].address;
    dispatcher = createPinnedDispatcher(target, { connectTimeoutMs: timeoutMs });
    const response = await requestImpl(target.url, {
      method: 'POST',
      headers: { 'content-type': 'application/json', 'user-agent': USER_AGENT, ...input.headers },
      body: input.body,
      dispatcher,
      signal: AbortSignal.timeout(timeoutMs),
      headersTimeout: timeoutMs,
      bodyTimeout: timeoutMs,
    });
    const { excerpt, truncated } = await readExcerpt(response.body, maxBytes);
    return {
      outcome: classifyDeliveryResponse(response.statusCode, response.headers['retry-after'], now()),
      statusCode: response.statusCode,
      responseExcerpt: excerpt,
      responseTruncated: truncated,
      durationMs: elapsedMs(),
      error: null,
      targetAddress,
      attemptedAt,
    };
  } catch (error) {
    return {
      outcome: classifyDeliveryError(error),
      statusCode: null,
      responseExcerpt: '',
      responseTruncated: false,
      durationMs: elapsedMs(),
      error: errorSummary(error),
      targetAddress,
      attemptedAt,
    };
  } finally {
    await dispatcher?.destroy();
  }
}
