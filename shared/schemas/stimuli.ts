import { z } from 'zod';
import { prefixedIdSchema, timestampSchema } from './common';
import { pageQueryShape, pageSchema } from './pagination';

export const stimulusIdSchema = prefixedIdSchema('stm', 'stm_8Hq2Zt5Kc1Wm9Lp3Xv7R');

export const STIMULUS_SAFETY_NOTE =
  '**Safety.** Test signals at measurement levels can damage hearing and drivers. Never play them into headphones ' +
  'worn by a person (use an ear simulator or coupler); start at a low level and raise it step by step; cap the drive ' +
  'voltage for each device under test (tweeters are easily burnt by full-scale sweeps); keep the fades. The response ' +
  "carries these cautions in `cautions`. They do not replace the lab's own procedures, the device maker's ratings or " +
  'local regulations on noise exposure: follow those first.';

const seconds = (description: string) => z.number().meta({ description });

export const sweepParametersSchema = z
  .strictObject({
    startHz: z.number().meta({ description: 'Start frequency f1, Hz (> 0, below stopHz).', example: 20 }),
    stopHz: z.number().meta({ description: 'Stop frequency f2, Hz (≤ sampleRateHz/2).', example: 20_000 }),
    approximateDurationSeconds: z.number().meta({ description: 'Requested duration, 0.1–600 s; the synchronized duration differs slightly.', example: 2 }),
    sampleRateHz: z.number().int().meta({ example: 48_000 }),
    levelDbfs: z.number().optional().meta({ description: 'Peak level re full scale, ≤ 0 dBFS. Default −20: start low.', example: -20 }),
    fadeInSeconds: seconds('Half-Hann fade-in. Default min(2/f1, T/10).').optional(),
    fadeOutSeconds: seconds('Half-Hann fade-out. Default min(5 ms, T/10).').optional(),
    leadingSilenceSeconds: seconds('Silence before the sweep. Default 0.1 s.').optional(),
    trailingSilenceSeconds: seconds('Silence after the sweep (leave the decay time). Default 1 s.').optional(),
  })
  .meta({ id: 'SweepParameters', description: 'Synchronized exponential sweep (Novak et al., JAES 63(10), 2015).' });

export const steppedSineParametersSchema = z
  .strictObject({
    startHz: z.number().meta({ example: 100 }),
    stopHz: z.number().meta({ example: 10_000 }),
    bandsPerOctave: z.number().int().meta({ description: 'b in 1/b octave: 1, 2, 3, 6, 12 or 24 (IEC 61260-1 base-10 mid-band frequencies).', example: 3 }),
    sampleRateHz: z.number().int().meta({ example: 48_000 }),
    levelDbfs: z.number().optional().meta({ description: 'Peak level, ≤ 0 dBFS. Default −20.', example: -20 }),
    settleSeconds: seconds('Minimum settle time per step. Default 0.05 s.').optional(),
    settleCycles: z.number().optional().meta({ description: 'Minimum settle time in periods. Default 10.' }),
    analysisSeconds: seconds('Minimum analysis window. Default 0.1 s.').optional(),
    analysisCycles: z.number().int().optional().meta({ description: 'Minimum whole cycles analysed. Default 20.' }),
    rampSeconds: seconds('Half-Hann ramp at each step start and end. Default 5 ms.').optional(),
    gapSeconds: seconds('Silence between steps. Default 0.').optional(),
    leadingSilenceSeconds: seconds('Default 0.1 s.').optional(),
    trailingSilenceSeconds: seconds('Default 0.2 s.').optional(),
  })
  .meta({ id: 'SteppedSineParameters', description: 'Stepped-sine plan on a fractional-octave grid with coherent analysis windows.' });

export const calibratorCheckParametersSchema = z
  .strictObject({
    frequencyHz: z.number().meta({ example: 1000 }),
    durationSeconds: z.number().meta({ description: '0.1–600 s.', example: 5 }),
    sampleRateHz: z.number().int().meta({ example: 48_000 }),
    levelDbfs: z.number().optional().meta({ description: 'Peak level, ≤ 0 dBFS. Default −20.', example: -20 }),
    fadeSeconds: seconds('Half-Hann fades. Default 10 ms.').optional(),
    leadingSilenceSeconds: seconds('Default 0.1 s.').optional(),
    trailingSilenceSeconds: seconds('Default 0.1 s.').optional(),
  })
  .meta({ id: 'CalibratorCheckParameters', description: 'Steady sine for checking a chain or setting a drive level.' });

export const stimulusTypeSchema = z.enum(['sweep', 'stepped_sine', 'calibrator_check']).meta({ id: 'StimulusType' });
export type StimulusType = z.infer<typeof stimulusTypeSchema>;

const stimulusNameSchema = z.string().trim().min(1).max(100).optional().meta({ example: 'KB-65 woofer sweep 20 Hz – 20 kHz' });

export const createStimulusRequestSchema = z
  .discriminatedUnion('type', [
    z.strictObject({ type: z.literal('sweep'), name: stimulusNameSchema, parameters: sweepParametersSchema }),
    z.strictObject({ type: z.literal('stepped_sine'), name: stimulusNameSchema, parameters: steppedSineParametersSchema }),
    z.strictObject({ type: z.literal('calibrator_check'), name: stimulusNameSchema, parameters: calibratorCheckParametersSchema }),
  ])
  .meta({
    id: 'CreateStimulusRequest',
    description: 'A stimulus type and its parameters; the engine checks ranges and consistency (422 with field pointers).',
    example: { name: 'KB-65 woofer sweep', type: 'sweep', parameters: { startHz: 20, stopHz: 20_000, approximateDurationSeconds: 2, sampleRateHz: 48_000, levelDbfs: -20 } },
  });
/** A stimulus type and its parameters, without a name (inline stimuli of an analysis). */
export type StimulusDefinition = { type: StimulusType; parameters: Record<string, unknown> };
export type CreateStimulusRequest = z.infer<typeof createStimulusRequestSchema>;

export const stimulusSchema = z
  .object({
    id: stimulusIdSchema,
    name: z.string().nullable(),
    type: stimulusTypeSchema,
    parameters: z.record(z.string(), z.unknown()).meta({ description: 'Every parameter with its default applied: enough to regenerate the file bit for bit.' }),
    sampleRateHz: z.number().int().meta({ example: 48_000 }),
    totalSampleCount: z.number().int(),
    totalDurationSeconds: z.number().meta({ example: 3.1 }),
    design: z.record(z.string(), z.unknown()).meta({ description: 'Derived design figures (e.g. rateConstantSeconds, sweepDurationSeconds, steps).' }),
    formula: z.string(),
    cautions: z.array(z.string()).meta({ description: 'Safety cautions to show beside the file (hearing, tweeter and level safety); defer to the lab\'s procedures and local regulations.' }),
    engineVersion: z.string().meta({ example: 'sweepline-engine/0.1.0' }),
    audioUrl: z.string().meta({ example: '/v1/stimuli/stm_8Hq2Zt5Kc1Wm9Lp3Xv7R/audio?encoding=float32' }),
    createdAt: timestampSchema,
  })
  .meta({ id: 'Stimulus', description: 'A stimulus defined by its parameters; the WAV is regenerated deterministically.' });
export type Stimulus = z.infer<typeof stimulusSchema>;

export const stimulusParamsSchema = z.strictObject({ stimulusId: stimulusIdSchema });
export const stimulusListQuerySchema = z.strictObject({ ...pageQueryShape });
export const stimulusPageSchema = pageSchema(stimulusSchema, 'StimulusPage');
export const stimulusAudioQuerySchema = z.strictObject({
  encoding: z.enum(['float32', 'pcm24']).default('float32').meta({ description: 'IEEE float 32-bit (default) or 24-bit PCM (AES17 scaling).' }),
});
