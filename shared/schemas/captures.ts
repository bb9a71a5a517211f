import { z } from 'zod';
import { prefixedIdSchema, timestampSchema } from './common';
import { pageQueryShape, pageSchema } from './pagination';

export const captureIdSchema = prefixedIdSchema('cap', 'cap_3Jd9Qw2Lx7Vb5Np1Rt8K');

export const engineWarningSchema = z
  .object({
    code: z.string().meta({ description: 'Stable warning code (part of the contract), e.g. `clipping`, `uncalibrated`.', example: 'clipping' }),
    message: z.string(),
    details: z.record(z.string(), z.union([z.number(), z.string(), z.boolean(), z.null()])).optional(),
  })
  .meta({ id: 'EngineWarning', description: 'A machine-readable warning: branch on `code`, show `message` to people.' });

export const captureChannelStatsSchema = z
  .object({
    index: z.number().int().meta({ example: 0 }),
    peakDbfs: z.number().nullable().meta({ description: '20·log10(|peak|), dB re full scale; null for digital silence.', example: -12.04 }),
    rmsDbfs: z.number().nullable().meta({ description: 'AES17 level 20·log10(√2·rms), dBFS (full-scale sine = 0 dBFS); null for silence.', example: -15.1 }),
    dcOffset: z.number().meta({ description: 'Mean value, full-scale units.', example: 0.00002 }),
    clippedSampleCount: z.number().int().meta({ description: 'Samples with |x| ≥ 0.999 full scale.', example: 0 }),
    flatTopRunCount: z.number().int().meta({ description: 'Runs of ≥ 3 equal extreme samples (a sign of clipping before the converter).', example: 0 }),
  })
  .meta({ id: 'CaptureChannelStats' });

export const captureSchema = z
  .object({
    id: captureIdSchema,
    filename: z.string().meta({ example: 'kb65-24-000123-sweep.wav' }),
    sha256: z.string().meta({ description: 'SHA-256 of the file bytes (hex); the blob is stored by this hash.', example: '9f2c…' }),
    sizeBytes: z.number().int().meta({ example: 576_044 }),
    sampleRateHz: z.number().int().meta({ example: 48_000 }),
    channelCount: z.number().int().meta({ example: 2 }),
    frameCount: z.number().int().meta({ example: 144_000 }),
    durationSeconds: z.number().meta({ example: 3 }),
    format: z.object({
      sampleEncoding: z.enum(['pcm_int', 'float']).meta({ description: 'pcm_int: integer PCM; float: IEEE float.' }),
      bitsPerSample: z.number().int().meta({ example: 24 }),
      formatTag: z.number().int().meta({ description: 'wFormatTag: 1 PCM, 3 IEEE float, 65534 WAVE_FORMAT_EXTENSIBLE.', example: 1 }),
      extensible: z.boolean(),
    }),
    channels: z.array(captureChannelStatsSchema),
    warnings: z.array(engineWarningSchema).meta({ description: 'clipping and dc_offset findings on arrival; the upload is still accepted.' }),
    createdAt: timestampSchema,
  })
  .meta({ id: 'Capture', description: 'An uploaded WAV capture, validated on arrival; samples are decoded with full scale = ±1 (AES17).' });
export type Capture = z.infer<typeof captureSchema>;

export const captureParamsSchema = z.strictObject({ captureId: captureIdSchema });
export const captureListQuerySchema = z.strictObject({ ...pageQueryShape });
export const capturePageSchema = pageSchema(captureSchema, 'CapturePage');

export const captureUploadSchema = z
  .object({
    file: z.string().meta({ format: 'binary', description: 'The WAV file (PCM 16/24/32-bit or IEEE float 32/64-bit, WAVE_FORMAT_EXTENSIBLE accepted).' }),
  })
  .meta({ id: 'CaptureUpload', description: 'multipart/form-data with one part named `file`.' });
