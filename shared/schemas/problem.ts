import { z } from 'zod';
import { PROBLEM_CODES } from '../problems';

export const problemFieldErrorSchema = z
  .object({
    in: z.enum(['body', 'query', 'path', 'header']).meta({ description: 'Which part of the request.' }),
    pointer: z.string().meta({
      description: 'JSON Pointer (RFC 6901) as a URI fragment into that part.',
      example: '#/scopes/0',
    }),
    detail: z.string().meta({ description: 'What is wrong with this field and how to fix it.' }),
  })
  .meta({ id: 'ProblemFieldError' });

/** RFC 9457 problem details plus our extensions (code, requestId, errors, and per-kind members). */
export const problemSchema = z
  .object({
    type: z.url().meta({
      description: 'URI naming the problem kind: https://sweepline.example/problems/<code>.',
      example: 'https://sweepline.example/problems/validation_failed',
    }),
    title: z.string().meta({ description: 'Short summary, the same for every occurrence of this kind.' }),
    status: z.number().int().meta({ description: 'The HTTP status code of this response.', example: 400 }),
    detail: z.string().meta({ description: 'What went wrong this time, written to help fix it. Not for parsing.' }),
    instance: z.string().meta({
      description: 'Identifies this occurrence; quote it to support.',
      example: '/v1/requests/req_3Fq9x2LmZp8TnV1c',
    }),
    code: z.enum(PROBLEM_CODES).meta({ description: 'Stable machine-readable problem code.' }),
    requestId: z.string().meta({ description: 'Same as the X-Request-Id response header.' }),
    errors: z
      .array(problemFieldErrorSchema)
      .optional()
      .meta({ description: 'For validation_failed: one entry per invalid field.' }),
    requiredPermission: z
      .string()
      .optional()
      .meta({ description: 'For insufficient_permission and insufficient_scope: the permission the route needs.' }),
    retryAfterSeconds: z
      .number()
      .int()
      .optional()
      .meta({ description: 'For sign_in_throttled: seconds until another attempt is accepted (also Retry-After).' }),
  })
  .loose()
  .meta({
    id: 'Problem',
    description: 'An error, as application/problem+json (RFC 9457). Clients must ignore members they do not know.',
  });
export type Problem = z.infer<typeof problemSchema>;
export type ProblemFieldError = z.infer<typeof problemFieldErrorSchema>;
