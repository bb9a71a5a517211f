import { z } from 'zod';

export const healthSchema = z
  .object({
    status: z.enum(['ok', 'degraded']).meta({ description: 'degraded (with HTTP 503) when the database does not answer.' }),
    database: z.object({
      status: z.enum(['ok', 'unavailable']),
      latencyMs: z.number().nullable().meta({ description: 'Round trip of a trivial query, in milliseconds.', example: 1.4 }),
    }),
    version: z.string().meta({ example: '0.1.0' }),
  })
  .meta({ id: 'Health', description: 'Service and database state.' });
export type Health = z.infer<typeof healthSchema>;
