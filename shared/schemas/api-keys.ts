import { z } from 'zod';
import { organisationNameSchema, prefixedIdSchema, timestampSchema } from './common';
import { pageQueryShape, pageSchema } from './pagination';
import { permissionSchema } from './permissions';

export const API_KEY_SECRET_PREFIX = 'swl_live_';

export const apiKeyStatusSchema = z.enum(['active', 'expired', 'revoked']).meta({
  description: 'active keys are accepted; expired and revoked keys are refused with 401.',
});

export const apiKeySchema = z
  .object({
    id: prefixedIdSchema('key', 'key_Vd8Nq2Lm5Rx1Tz7Pc4Ws'),
    name: z.string().meta({ example: 'KB-65 line 2 rig' }),
    prefix: z.string().meta({ description: 'First characters of the secret, for recognising a key.', example: 'swl_live_4fTq9ZbK' }),
    lastFour: z.string().meta({ description: 'Last four characters of the secret.', example: 'x7Qe' }),
    scopes: z.array(permissionSchema),
    status: apiKeyStatusSchema,
    createdAt: timestampSchema,
    expiresAt: timestampSchema.nullable(),
    lastUsedAt: timestampSchema.nullable().meta({ description: 'Updated at most once a minute.' }),
    revokedAt: timestampSchema.nullable(),
    createdBy: z
      .object({ id: prefixedIdSchema('usr', 'usr_Q2w8Lk3Zr5Tx9Pb1Nc0d'), displayName: z.string() })
      .nullable(),
  })
  .meta({ id: 'ApiKey', description: 'An API key without its secret.' });
export type ApiKey = z.infer<typeof apiKeySchema>;

export const createApiKeyRequestSchema = z
  .strictObject({
    name: z.string().trim().min(1).max(100).meta({ example: 'KB-65 line 2 rig' }),
    scopes: z
      .array(permissionSchema)
      .min(1)
      .refine((scopes) => new Set(scopes).size === scopes.length, { message: 'Each scope may appear only once.' })
      .meta({ description: 'Permissions the key grants; none beyond those of the creator.', example: ['captures:write', 'analyses:write', 'analyses:read'] }),
    expiresAt: timestampSchema.optional().meta({ description: 'Optional expiry in the future; without it the key lasts until revoked.' }),
  })
  .meta({ id: 'CreateApiKeyRequest' });
export type CreateApiKeyRequest = z.infer<typeof createApiKeyRequestSchema>;

export const createdApiKeySchema = z
  .object({
    apiKey: apiKeySchema,
    secret: z.string().meta({
      description: 'The full key. Shown only in this response; store it now. Send it as `Authorization: Bearer <secret>`.',
      example: 'swl_live_4fTq9ZbKp2Lr8Vn1Xc6Hm0Wd3Ys5Ja7Eg9Uo2Ik4Tb1x7Qe',
    }),
  })
  .meta({ id: 'CreatedApiKey' });
export type CreatedApiKey = z.infer<typeof createdApiKeySchema>;

export const apiKeyParamsSchema = z.strictObject({
  keyId: prefixedIdSchema('key', 'key_Vd8Nq2Lm5Rx1Tz7Pc4Ws'),
});

export const apiKeyListQuerySchema = z.strictObject({ ...pageQueryShape });
export const apiKeyPageSchema = pageSchema(apiKeySchema, 'ApiKeyPage');

export const currentApiKeySchema = z
  .object({
    apiKey: apiKeySchema,
    organisation: z.object({ id: prefixedIdSchema('org', 'org_7kq2Vb9XwR4mT1sLp0aZ'), name: organisationNameSchema }),
  })
  .meta({ id: 'CurrentApiKey', description: 'The key that authenticated this request and its organisation.' });
export type CurrentApiKey = z.infer<typeof currentApiKeySchema>;
