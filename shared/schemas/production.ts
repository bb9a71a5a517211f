import { z } from 'zod';
import { timestampSchema } from './common';

export const productionSummaryQuerySchema = z.strictObject({
  model: z.string().trim().min(1).max(100).meta({ description: 'DUT model, as given in the analyses\' `dut.model`.', example: 'KB-65 woofer' }),
  lot: z.string().trim().min(1).max(100).optional().meta({ example: 'LOT-2024-11A' }),
  from: timestampSchema.optional().meta({ description: 'Analyses created at or after (inclusive).' }),
  to: timestampSchema.optional().meta({ description: 'Analyses created before (exclusive).' }),
});
export type ProductionSummaryQuery = z.infer<typeof productionSummaryQuerySchema>;

export const distributionSchema = z
  .object({
    count: z.number().int(),
    mean: z.number(),
    standardDeviation: z.number().nullable().meta({ description: 'Sample standard deviation (n − 1); null for a single value.' }),
    min: z.number(),
    p5: z.number(),
    p50: z.number(),
    p95: z.number(),
    max: z.number(),
  })
  .meta({
    id: 'Distribution',
    description: 'Percentiles by linear interpolation between order statistics (Hyndman & Fan definition 7), in the unit its name states.',
  });
export type Distribution = z.infer<typeof distributionSchema>;

export const productionSummarySchema = z
  .object({
    filter: productionSummaryQuerySchema.partial({ model: true }),
    counts: z.object({
      analyses: z.number().int().meta({ description: 'Analyses of the model (and lot, time range), any status.' }),
      succeeded: z.number().int(),
      failed: z.number().int().meta({ description: 'Analyses that failed (no result), not units that failed a mask.' }),
      pending: z.number().int().meta({ description: 'Queued or running.' }),
      canceled: z.number().int(),
      serials: z.number().int().meta({ description: 'Distinct serial numbers among the succeeded analyses.' }),
      pass: z.number().int(),
      fail: z.number().int(),
      incomplete: z.number().int().meta({ description: 'Mask verdict incomplete: the curve did not cover the mask.' }),
      withoutVerdict: z.number().int().meta({ description: 'Succeeded analyses judged against no mask.' }),
    }),
    yieldPercent: z.number().nullable().meta({ description: 'pass / (pass + fail) × 100; null when no analysis has a pass or fail verdict.' }),
    sensitivity: z.object({
      dbSplAt2p83VoltsOneMetre: distributionSchema.nullable().meta({ description: 'Loudspeakers: dB SPL at 1 m for 2.83 V RMS.' }),
      dbSplPerVolt: distributionSchema.nullable().meta({ description: 'Headphones: dB SPL for 1 V RMS.' }),
      millivoltsPerPascal: distributionSchema.nullable().meta({ description: 'Microphones: mV/Pa.' }),
    }),
    thdFAtOneKilohertzPercent: distributionSchema.nullable().meta({ description: 'THD_F (relative to the fundamental) at 1 kHz, %.' }),
    bandLimits: z
      .array(z.object({ dropDb: z.number(), lowerHz: distributionSchema.nullable(), upperHz: distributionSchema.nullable() }))
      .meta({ description: 'Per drop (e.g. the −3 dB and −10 dB points): the lower and upper band-limit frequencies, Hz, of the units where the limit was found.' }),
  })
  .meta({ id: 'ProductionSummary', description: 'Counts, yield and unit-to-unit distributions of the headline figures for a model and lot.' });
export type ProductionSummary = z.infer<typeof productionSummarySchema>;

export const productionLotsQuerySchema = z.strictObject({
  model: z.string().trim().min(1).max(100).optional().meta({ description: 'Only the lots of this model.', example: 'KB-65 woofer' }),
});
export type ProductionLotsQuery = z.infer<typeof productionLotsQuerySchema>;

export const productionLotSchema = z
  .object({
    model: z.string().meta({ example: 'KB-65 woofer' }),
    lot: z.string().nullable().meta({ description: 'null groups the model\'s analyses that name no lot.', example: 'LOT-2024-11A' }),
    analyses: z.number().int().meta({ description: 'Analyses of the model and lot, any status.' }),
    firstCreatedAt: timestampSchema,
    lastCreatedAt: timestampSchema,
  })
  .meta({ id: 'ProductionLot' });
export type ProductionLot = z.infer<typeof productionLotSchema>;

/** Most model/lot pairs one listing returns (most recently measured first). */
export const PRODUCTION_LOTS_LIMIT = 500;

export const productionLotListSchema = z
  .object({ data: z.array(productionLotSchema), truncated: z.boolean().meta({ description: `True when more than ${PRODUCTION_LOTS_LIMIT} pairs exist; the oldest are left out.` }) })
  .meta({ id: 'ProductionLotList', description: 'The models and lots the organisation\'s analyses name, most recently measured first.' });
export type ProductionLotList = z.infer<typeof productionLotListSchema>;

/** Most units one listing returns (newest first). */
export const PRODUCTION_UNITS_LIMIT = 5000;

export const productionUnitSchema = z
  .object({
    analysisId: z.string().meta({ example: 'ana_5Tr8Wq1Zm4Kd7Nx2Lb9C' }),
    serial: z.string().nullable().meta({ example: 'KB65-24-000123' }),
    createdAt: timestampSchema,
    verdict: z.enum(['pass', 'fail', 'incomplete']).nullable(),
    sensitivity: z.object({
      dbSplAt2p83VoltsOneMetre: z.number().nullable().meta({ description: 'Loudspeakers: dB SPL at 1 m for 2.83 V RMS.' }),
      dbSplPerVolt: z.number().nullable().meta({ description: 'Headphones: dB SPL for 1 V RMS.' }),
      millivoltsPerPascal: z.number().nullable().meta({ description: 'Microphones: mV/Pa.' }),
    }),
    thdFAtOneKilohertzPercent: z.number().nullable().meta({ description: 'THD_F (relative to the fundamental) at 1 kHz, %.' }),
  })
  .meta({ id: 'ProductionUnit', description: 'One succeeded analysis of a unit with the headline figures the production summary aggregates.' });
export type ProductionUnit = z.infer<typeof productionUnitSchema>;

export const productionUnitListSchema = z
  .object({
    data: z.array(productionUnitSchema),
    truncated: z.boolean().meta({ description: `True when more than ${PRODUCTION_UNITS_LIMIT} analyses matched; narrow the time range.` }),
  })
  .meta({ id: 'ProductionUnitList', description: 'Per-unit figures of a model\'s (and lot\'s) succeeded analyses, newest first, for histograms and trends.' });
export type ProductionUnitList = z.infer<typeof productionUnitListSchema>;
