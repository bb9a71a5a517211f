import { z } from 'zod';

/** RFC 3339 timestamp in UTC with milliseconds, as every response carries it. */
export const timestampSchema = z.iso.datetime({ offset: false }).meta({
  description: 'RFC 3339 date-time in UTC.',
  example: '2025-03-14T09:26:53.589Z',
});

/** An opaque id with a type prefix (usr_, org_, mem_, key_, aud_). */
export function prefixedIdSchema(prefix: string, example: string) {
  return z
    .string()
    .min(1)
    .max(64)
    .meta({ description: `Opaque identifier, starts with \`${prefix}_\`.`, example });
}

export const emailSchema = z.email().max(254).meta({
  description: 'E-mail address; compared without regard to letter case.',
  example: 'analyst@kestrelbay.example',
});

export const displayNameSchema = z.string().trim().min(1).max(100).meta({
  description: 'Name shown to other members, 1 to 100 characters.',
  example: 'Mara Lindqvist',
});

export const organisationNameSchema = z.string().trim().min(1).max(100).meta({
  description: 'Organisation name, 1 to 100 characters.',
  example: 'Kestrel Bay Acoustics',
});

/** Accepted on creating POSTs; retries with the same key will be deduplicated once idempotency is stored. */
export const idempotencyHeadersSchema = z.object({
  'idempotency-key': z
    .string()
    .min(1)
    .max(255)
    .optional()
    .meta({ description: 'Client-chosen key (a UUID v4 is recommended) that identifies retries of this request.', example: '6f1d2c3a-8b4e-4f5a-9c7d-1e2f3a4b5c6d' }),
});
