import { z } from 'zod';
import { timestampSchema } from './common';

const meterSchema = (id: string, unit: string, example: { used: number; limit: number }) =>
  z
    .object({
      used: z.number().nonnegative(),
      limit: z.number().nonnegative(),
      remaining: z.number().nonnegative(),
      percentUsed: z.number().nonnegative().meta({ description: 'used / limit × 100, rounded to 0.1.' }),
    })
    .meta({ id, description: `${unit}.`, example: { ...example, remaining: example.limit - example.used, percentUsed: Math.round((1000 * example.used) / example.limit) / 10 } });

export const usageSchema = z
  .object({
    planId: z.string().meta({ example: 'line' }),
    period: z
      .object({ start: timestampSchema, end: timestampSchema })
      .meta({ description: 'The current monthly period [start, end); counters start from zero at `end`.' }),
    analyses: meterSchema('AnalysesUsage', 'Analyses accepted this period', { used: 1840, limit: 20000 }),
    audioMinutes: meterSchema('AudioMinutesUsage', 'Minutes of audio analysed this period (capture durations)', { used: 61.3, limit: 6000 }),
    storageBytes: meterSchema('StorageUsage', 'Bytes stored now (captures); not monthly', { used: 2_400_000_000, limit: 100_000_000_000 }),
    requestsPerMinute: z
      .object({ limit: z.number().int() })
      .meta({ description: 'Per API key (or per signed-in user); see the RateLimit and RateLimit-Policy headers of any response.' }),
    uploadLimits: z.object({
      maxUploadBytes: z.number().int(),
      maxUploadDurationSeconds: z.number(),
      maxUploadChannels: z.number().int(),
      maxUploadSampleRateHz: z.number().int(),
    }),
  })
  .meta({ id: 'Usage', description: 'Usage of the current period against the plan\'s limits.' });
export type Usage = z.infer<typeof usageSchema>;

export const dailyUsageSchema = z
  .object({
    period: z.object({ start: timestampSchema, end: timestampSchema }),
    days: z.array(
      z.object({
        date: z.iso.date().meta({ description: 'UTC calendar day (YYYY-MM-DD).', example: '2026-12-01' }),
        analyses: z.number().int().nonnegative(),
        audioMinutes: z.number().nonnegative(),
      }),
    ),
  })
  .meta({
    id: 'DailyUsage',
    description:
      'Analyses and audio minutes charged per UTC day of the current period, from its first day to today (days without use are 0). ' +
      'Refunded analyses are not counted. Storage is a running total and has no daily series.',
  });
export type DailyUsage = z.infer<typeof dailyUsageSchema>;
