import { z } from 'zod';
import type { RouteDefinition } from '@server/http/define-route';

/** A response header as the OpenAPI document states it; an optional schema means "not always sent". */
export interface DocumentedHeader {
  description: string;
  schema: z.ZodType;
}
export type DocumentedHeaders = Record<string, DocumentedHeader>;

// Header names are case-insensitive (RFC 9110 §5.1); the document spells them the way the server sends them.
const CANONICAL_NAMES: Record<string, string> = {
  location: 'Location',
  'retry-after': 'Retry-After',
  ratelimit: 'RateLimit',
  'ratelimit-policy': 'RateLimit-Policy',
  'idempotent-replayed': 'Idempotent-Replayed',
  'preference-applied': 'Preference-Applied',
  vary: 'Vary',
  'content-disposition': 'Content-Disposition',
  etag: 'ETag',
};

export function canonicalHeaderName(name: string): string {
  return CANONICAL_NAMES[name.toLowerCase()] ?? name;
}

const RATE_LIMIT_HEADERS: DocumentedHeaders = {
  'RateLimit-Policy': {
    description:
      'The caller\'s request-rate policy (IETF draft-ietf-httpapi-ratelimit-headers, a structured-field list): ' +
      '`"per-minute";q=<requests>;w=60`. Sent once the caller is authenticated and allowed.',
    schema: z.string().meta({ example: '"per-minute";q=60;w=60' }),
  },
  RateLimit: {
    description:
      'What is left of the policy (same draft): `"per-minute";r=<remaining>;t=<seconds until the window resets>`. ' +
      'When Retry-After is also present, clients must obey Retry-After.',
    schema: z.string().meta({ example: '"per-minute";r=41;t=23' }),
  },
};

const RETRY_AFTER_429: DocumentedHeader = {
  description:
    'Seconds to wait before retrying (RFC 9110 §10.2.3): until the rate-limit window resets, until a monthly quota ' +
    'period ends, or until failed sign-ins are forgotten. Absent only when the storage quota is full, which waiting ' +
    'does not free.',
  schema: z.string().optional().meta({ example: '23' }),
};

const RETRY_AFTER_IN_PROGRESS: DocumentedHeader = {
  description: 'Seconds to wait before retrying while the first request with this Idempotency-Key is still running.',
  schema: z.string().meta({ example: '1' }),
};

const IDEMPOTENT_REPLAYED: DocumentedHeader = {
  description:
    '`true` when this response is the stored answer to an earlier request with the same Idempotency-Key and body ' +
    '(nothing was created again); absent on the first answer.',
  schema: z.literal('true').optional(),
};

/** Statuses whose responses are stored and replayed under an Idempotency-Key: successes and server errors. */
const isReplayable = (status: number) => (status >= 200 && status < 300) || status >= 500;
/** 401 and 403 are answered before the request is counted, so they carry no rate-limit fields. */
const carriesRateLimit = (status: number) => status !== 401 && status !== 403;

/**
 * Every response header of one response: the ones the route declares, plus those the router adds itself
 * (rate-limit fields, Retry-After on throttling, Idempotent-Replayed on replays).
 */
export function responseHeadersOf(route: RouteDefinition, status: number, declared: DocumentedHeaders | undefined): DocumentedHeaders {
  const headers: DocumentedHeaders = {};
  for (const [name, header] of Object.entries(declared ?? {})) headers[canonicalHeaderName(name)] = header;
  if (route.rateLimit && carriesRateLimit(status)) Object.assign(headers, RATE_LIMIT_HEADERS);
  if (status === 429) headers['Retry-After'] ??= RETRY_AFTER_429;
  if (status === 409 && route.idempotency) headers['Retry-After'] ??= RETRY_AFTER_IN_PROGRESS;
  if (route.idempotency && isReplayable(status)) headers['Idempotent-Replayed'] = IDEMPOTENT_REPLAYED;
  return headers;
}

/** The OpenAPI `headers` of a response, as a zod object that zod-to-openapi renders header by header. */
export function openApiHeaders(headers: DocumentedHeaders): z.ZodObject | undefined {
  const entries = Object.entries(headers).sort(([a], [b]) => a.localeCompare(b));
  if (entries.length === 0) return undefined;
  return z.object(Object.fromEntries(entries.map(([name, header]) => [name, header.schema.meta({ description: header.description })])));
}
