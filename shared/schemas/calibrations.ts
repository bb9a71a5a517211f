import { z } from 'zod';
import { prefixedIdSchema, timestampSchema } from './common';
import { pageQueryShape, pageSchema } from './pagination';

export const calibrationIdSchema = prefixedIdSchema('cal', 'cal_2Kp7Xw4Nq9Lz1Vb6Tr3M');

const rigIdSchema = z
  .string()
  .trim()
  .min(1)
  .max(100)
  .regex(/^[A-Za-z0-9][A-Za-z0-9._-]*$/, 'Use letters, digits, ".", "_" or "-", starting with a letter or digit.')
  .meta({ description: 'The rig, as your organisation names it.', example: 'kb-line2-rig1' });
const inputChannelSchema = z.number().int().min(0).max(1023).meta({ description: 'The rig\'s input channel (0-based) the calibration is for.', example: 0 });

const validityShape = {
  validFrom: timestampSchema.optional().meta({ description: 'Default: now.' }),
  validUntil: timestampSchema.optional().meta({ description: 'Absent = no end. After it, analyses using the calibration get a warning or are refused (organisation setting).' }),
  notes: z.string().trim().max(500).optional().meta({ example: 'Class 1 calibrator, serial KBC-0042; preamp gain 20 dB' }),
};

export const CALIBRATION_SOURCES = ['calibrator_capture', 'entered_dbfs', 'entered_microphone'] as const;
export const calibrationSourceSchema = z.enum(CALIBRATION_SOURCES).meta({
  id: 'CalibrationSource',
  description:
    'calibrator_capture: measured from an uploaded capture of an acoustic calibrator; entered_dbfs: the chain sensitivity ' +
    'typed in; entered_microphone: microphone sensitivity (mV/Pa) and the converter\'s full-scale voltage.',
});

export const createCalibrationRequestSchema = z
  .discriminatedUnion('source', [
    z.strictObject({
      source: z.literal('calibrator_capture'),
      rigId: rigIdSchema,
      inputChannel: inputChannelSchema,
      captureId: prefixedIdSchema('cap', 'cap_3Jd9Qw2Lx7Vb5Np1Rt8K'),
      channel: z.number().int().min(0).default(0).meta({ description: 'Channel of the capture holding the calibrator tone. Default 0.' }),
      statedLevelDbSpl: z.number().min(40).max(174).meta({ description: 'The calibrator\'s stated level, dB SPL re 20 µPa.', example: 94 }),
      statedFrequencyHz: z.number().positive().default(1000).meta({ description: 'The calibrator\'s stated frequency. Default 1000 Hz.', example: 1000 }),
      ...validityShape,
    }),
    z.strictObject({
      source: z.literal('entered_dbfs'),
      rigId: rigIdSchema,
      inputChannel: inputChannelSchema,
      dbfsAtOnePascal: z.number().min(-200).max(50).meta({ description: 'Level a 1 Pa RMS tone reads in this chain, dBFS (AES17: full-scale sine = 0 dBFS).', example: -38.0 }),
      ...validityShape,
    }),
    z.strictObject({
      source: z.literal('entered_microphone'),
      rigId: rigIdSchema,
      inputChannel: inputChannelSchema,
      microphoneMillivoltsPerPascal: z.number().positive().max(100_000).meta({ description: 'Sensitivity up to the converter input (capsule, preamp and interface gain), mV/Pa.', example: 12.5 }),
      adcFullScaleVoltsRms: z.number().positive().max(1000).optional().meta({ description: 'RMS voltage of a sine that just reaches full scale (0 dBFS), V. Give this or adcFullScaleVoltsPeak.', example: 1.0 }),
      adcFullScaleVoltsPeak: z.number().positive().max(1000).optional().meta({ description: 'Peak input voltage that reaches digital full scale, V.' }),
      ...validityShape,
    }),
  ])
  .meta({
    id: 'CreateCalibrationRequest',
    description: 'A calibration from a calibrator capture, from the chain sensitivity in dBFS at 1 Pa, or from a microphone sensitivity and the ADC full scale.',
    example: {
      source: 'calibrator_capture',
      rigId: 'kb-line2-rig1',
      inputChannel: 0,
      captureId: 'cap_3Jd9Qw2Lx7Vb5Np1Rt8K',
      channel: 0,
      statedLevelDbSpl: 94,
      statedFrequencyHz: 1000,
      validUntil: '2025-06-30T00:00:00.000Z',
    },
  });
export type CreateCalibrationRequest = z.infer<typeof createCalibrationRequestSchema>;

export const calibrationStatusSchema = z.enum(['valid', 'expired', 'not_yet_valid']);

export const calibrationSchema = z
  .object({
    id: calibrationIdSchema,
    rigId: z.string().meta({ example: 'kb-line2-rig1' }),
    inputChannel: z.number().int(),
    source: calibrationSourceSchema,
    dbfsAtOnePascal: z.number().meta({ description: 'Chain sensitivity: what a 1 Pa RMS tone reads, dBFS (AES17).', example: -38.02 }),
    details: z.record(z.string(), z.unknown()).meta({
      description:
        'How the figure was obtained: for a calibrator capture the capture id and channel, the stated level and frequency, the ' +
        'measured tone frequency and level, level stability and SNR; for entered values what was entered.',
    }),
    warnings: z.array(z.object({ code: z.string(), message: z.string() }).loose()).meta({ description: 'Warnings of the calibrator analysis (e.g. an unsteady tone).' }),
    notes: z.string().nullable(),
    validFrom: timestampSchema,
    validUntil: timestampSchema.nullable(),
    status: calibrationStatusSchema.meta({ description: 'At the time of the response.' }),
    createdBy: z.string().meta({ description: 'Member or API key that created it.' }),
    createdAt: timestampSchema,
  })
  .meta({
    id: 'Calibration',
    description:
      'A rig input\'s chain sensitivity. Absolute levels (dB SPL) are only as good as the calibration and only valid for the ' +
      'gain settings and microphone it was made with; follow your lab\'s calibration procedures and the applicable standards.',
  });
export type Calibration = z.infer<typeof calibrationSchema>;

export const calibrationParamsSchema = z.strictObject({ calibrationId: calibrationIdSchema });
export const calibrationListQuerySchema = z.strictObject({
  ...pageQueryShape,
  rigId: z.string().max(100).optional(),
  inputChannel: z.coerce.number().int().min(0).optional(),
});
export type CalibrationListQuery = z.infer<typeof calibrationListQuerySchema>;
export const calibrationPageSchema = pageSchema(calibrationSchema, 'CalibrationPage');

export const calibrationSettingsSchema = z
  .strictObject({
    expiredCalibration: z.enum(['warn', 'refuse']).meta({
      description:
        'What an analysis that names an expired calibration gets: `warn` (the default) runs it with a calibration_expired ' +
        'warning; `refuse` answers 422 calibration_expired.',
      example: 'warn',
    }),
  })
  .meta({ id: 'CalibrationSettings' });
export type CalibrationSettings = z.infer<typeof calibrationSettingsSchema>;
