import { z } from 'zod';
import { prefixedIdSchema, timestampSchema } from './common';
import { pageQueryShape, pageSchema } from './pagination';

export const maskIdSchema = prefixedIdSchema('msk', 'msk_6Wd1Lq8Zt3Kv5Nx9Rb2P');

export const maskPointSchema = z
  .strictObject({
    frequencyHz: z.number().positive().max(1e6).meta({ example: 1000 }),
    levelDb: z.number().min(-400).max(400).meta({ example: 3 }),
  })
  .meta({ id: 'MaskPoint' });

const limitSchema = z
  .array(maskPointSchema)
  .min(2)
  .max(10_000)
  .meta({ description: 'Limit line: frequencies strictly ascending; read linearly in dB against log frequency between points.' });

export const maskReferenceLevelSchema = z
  .discriminatedUnion('kind', [
    z.strictObject({ kind: z.literal('at_frequency'), frequencyHz: z.number().positive().max(1e6).meta({ example: 1000 }) }),
    z.strictObject({
      kind: z.literal('band_mean'),
      fromHz: z.number().positive().max(1e6).meta({ example: 300 }),
      toHz: z.number().positive().max(1e6).meta({ example: 3000 }),
      average: z.enum(['db', 'power']).default('power'),
    }),
  ])
  .meta({
    id: 'MaskReferenceLevel',
    description: 'For relative masks: the curve level that counts as 0 dB (the curve read at a frequency, or its mean over a band in log frequency).',
  });

const maskContentShape = {
  levelReference: z.enum(['absolute', 'relative']).meta({
    description: 'absolute: limits in the curve\'s own dB (e.g. dB SPL); relative: limits in dB relative to `referenceLevel` of the curve.',
    example: 'relative',
  }),
  referenceLevel: maskReferenceLevelSchema.optional().meta({ description: 'Required for relative masks.' }),
  upper: limitSchema.optional(),
  lower: limitSchema.optional(),
  note: z.string().trim().max(500).optional().meta({ example: 'Tightened 8–12 kHz after the cone supplier change' }),
};

export const maskVersionContentSchema = z.strictObject(maskContentShape).meta({ id: 'MaskVersionContent' });
export type MaskVersionContent = z.infer<typeof maskVersionContentSchema>;

export const createMaskRequestSchema = z
  .strictObject({ name: z.string().trim().min(1).max(100).meta({ example: 'KB-65 woofer production limits' }), ...maskContentShape })
  .meta({
    id: 'CreateMaskRequest',
    example: {
      name: 'KB-65 woofer production limits',
      levelReference: 'relative',
      referenceLevel: { kind: 'at_frequency', frequencyHz: 1000 },
      upper: [
        { frequencyHz: 100, levelDb: 3 },
        { frequencyHz: 5000, levelDb: 3 },
      ],
      lower: [
        { frequencyHz: 100, levelDb: -3 },
        { frequencyHz: 5000, levelDb: -3 },
      ],
    },
  });
export type CreateMaskRequest = z.infer<typeof createMaskRequestSchema>;

export const deriveMaskRequestSchema = z
  .strictObject({
    name: z.string().trim().min(1).max(100).meta({ example: 'KB-65 golden units 2024-11' }),
    analysisIds: z
      .array(prefixedIdSchema('ana', 'ana_5Tr8Wq1Zm4Kd7Nx2Lb9C'))
      .min(2)
      .max(500)
      .refine((ids) => new Set(ids).size === ids.length, { message: 'Each analysis may appear only once.' })
      .meta({ description: 'Succeeded frequency-response analyses of golden units (at least 2; 3 or more recommended).' }),
    k: z.number().positive().max(10).meta({ description: 'Coverage factor: limits at mean ± k·σ.', example: 3 }),
    minHalfWidthDb: z.number().min(0).max(100).default(1).meta({ description: 'Limits lie at least this far from the mean, dB. Default 1.', example: 1 }),
    referenceLevel: maskReferenceLevelSchema.optional().meta({ description: 'Normalise each golden curve to this reference first; the mask is then relative. Absent: absolute.' }),
    maskId: maskIdSchema.optional().meta({ description: 'Add the derived limits as a new version of this mask instead of creating one.' }),
  })
  .meta({ id: 'DeriveMaskRequest' });
export type DeriveMaskRequest = z.infer<typeof deriveMaskRequestSchema>;

export const maskDerivationSchema = z
  .object({
    analysisIds: z.array(z.string()),
    k: z.number(),
    minHalfWidthDb: z.number(),
    curveCount: z.number().int(),
    description: z.string(),
    frequencyHz: z.array(z.number()),
    meanDb: z.array(z.number()),
    standardDeviationDb: z.array(z.number()).meta({ description: 'Sample standard deviation (n − 1) per frequency, dB.' }),
    halfWidthDb: z.array(z.number()),
    warnings: z.array(z.object({ code: z.string(), message: z.string() }).loose()),
  })
  .meta({ id: 'MaskDerivation', description: 'How a derived version was computed, with the statistics per frequency.' });

export const maskVersionSchema = z
  .object({
    version: z.number().int().min(1),
    levelReference: z.enum(['absolute', 'relative']),
    referenceLevel: maskReferenceLevelSchema.nullable(),
    upper: z.array(maskPointSchema).nullable(),
    lower: z.array(maskPointSchema).nullable(),
    note: z.string().nullable(),
    derivation: maskDerivationSchema.nullable(),
    createdAt: timestampSchema,
  })
  .meta({ id: 'MaskVersion', description: 'One version of a mask. Versions are never changed: verdicts name the version they used.' });
export type MaskVersion = z.infer<typeof maskVersionSchema>;

export const maskSchema = z
  .object({
    id: maskIdSchema,
    name: z.string(),
    latestVersion: z.number().int().min(1),
    current: maskVersionSchema.meta({ description: 'The latest version.' }),
    createdAt: timestampSchema,
    updatedAt: timestampSchema,
  })
  .meta({ id: 'Mask', description: 'A tolerance mask with its latest version.' });
export type Mask = z.infer<typeof maskSchema>;

export const maskSummarySchema = maskSchema.omit({ current: true }).meta({ id: 'MaskSummary' });
export const maskParamsSchema = z.strictObject({ maskId: maskIdSchema });
export const maskVersionParamsSchema = z.strictObject({ maskId: maskIdSchema, version: z.coerce.number().int().min(1) });
export const maskListQuerySchema = z.strictObject({ ...pageQueryShape });
export const maskPageSchema = pageSchema(maskSummarySchema, 'MaskPage');
export const maskVersionListSchema = z.object({ data: z.array(maskVersionSchema) }).meta({ id: 'MaskVersionList', description: 'Every version, newest first.' });
