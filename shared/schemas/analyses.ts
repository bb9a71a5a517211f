import { z } from 'zod';
import { captureIdSchema, engineWarningSchema } from './captures';
import { prefixedIdSchema, timestampSchema } from './common';
import { pageQueryShape, pageSchema } from './pagination';
import { problemSchema } from './problem';
import { stimulusIdSchema, stimulusTypeSchema } from './stimuli';

export const analysisIdSchema = prefixedIdSchema('ana', 'ana_5Tr8Wq1Zm4Kd7Nx2Lb9C');

export const ANALYSIS_KINDS = [
  'frequency_response',
  'distortion',
  'response_and_distortion',
  'stepped_sine',
  'calibrator',
  'sensitivity',
  'spectrum',
  'tone_distortion',
] as const;
export const analysisKindSchema = z.enum(ANALYSIS_KINDS).meta({
  id: 'AnalysisKind',
  description:
    'frequency_response, distortion and response_and_distortion take a sweep capture; stepped_sine a stepped-sine capture; ' +
    'calibrator a calibrator-tone capture; sensitivity a sweep capture (loudspeaker, headphone) or a calibrator capture ' +
    '(microphone); spectrum a JSON spectrum (no WAV); tone_distortion a single-tone capture (optionally of a ' +
    'calibrator_check stimulus, whose frequency is then the default toneFrequencyHz).',
});
export type AnalysisKind = z.infer<typeof analysisKindSchema>;

export const ANALYSIS_STATUSES = ['queued', 'running', 'succeeded', 'failed', 'canceled'] as const;
export const analysisStatusSchema = z.enum(ANALYSIS_STATUSES).meta({ id: 'AnalysisStatus' });
export type AnalysisStatus = z.infer<typeof analysisStatusSchema>;
export const TERMINAL_STATUSES: readonly AnalysisStatus[] = ['succeeded', 'failed', 'canceled'];

export const verdictSchema = z.enum(['pass', 'fail', 'incomplete']).meta({ id: 'Verdict', description: 'Mask verdict; incomplete when the curve does not cover the mask.' });

const label = (example: string) => z.string().trim().min(1).max(100).meta({ example });

export const dutSchema = z
  .strictObject({
    model: label('KB-65 woofer').optional(),
    serial: label('KB65-24-000123').optional(),
    lot: label('LOT-2024-11A').optional(),
  })
  .meta({ id: 'Dut', description: 'The device under test.' });
export type Dut = z.infer<typeof dutSchema>;

export const gateSchema = z
  .strictObject({
    lengthSeconds: z.number().meta({ description: 'From the impulse-response peak to the end of the gate (before the first reflection), s.', example: 0.005 }),
    preRollSeconds: z.number().optional().meta({ description: 'Default 0.001 s.' }),
    shape: z.enum(['half_hann', 'tukey']).optional(),
    taperFraction: z.number().optional(),
  })
  .meta({ id: 'Gate' });

export const conditionsSchema = z
  .strictObject({
    distanceM: z.number().positive().optional().meta({ description: 'Microphone distance from the reference point, m.', example: 1 }),
    driveVoltageVrms: z.number().positive().optional().meta({ description: 'Drive voltage at the DUT terminals while the stimulus played, V RMS.', example: 2.83 }),
    nominalImpedanceOhm: z.number().positive().optional().meta({ description: 'Nominal impedance for "1 W" and mW figures, Ω.', example: 8 }),
    environment: z.enum(['anechoic', 'half_space', 'gated', 'near_field']).optional().meta({ description: 'Acoustic environment; `gated` needs `gate`.' }),
    gate: gateSchema.optional(),
    fixture: z.string().max(200).optional().meta({ description: 'Test fixture, baffle or ear simulator / coupler used.', example: 'IEC 60318-4 ear simulator' }),
    temperatureC: z.number().min(-40).max(60).optional().meta({ description: 'Air temperature, °C (sets the speed of sound). Default 20.', example: 21.5 }),
  })
  .meta({ id: 'MeasurementConditions' });
export type MeasurementConditions = z.infer<typeof conditionsSchema>;

export const channelRolesSchema = z
  .strictObject({
    measurement: z.number().int().min(0).default(0).meta({ description: 'Channel index of the measurement microphone / ear simulator.', example: 0 }),
    reference: z.number().int().min(0).nullable().optional().meta({ description: 'Loopback reference channel index (the response is divided by it).', example: 1 }),
  })
  .meta({ id: 'ChannelRoles' });

export const calibrationReferenceSchema = z
  .union([
    z.strictObject({ calibrationId: prefixedIdSchema('cal', 'cal_2Kp7Xw4Nq9Lz1Vb6Tr3M') }),
    z.strictObject({ rigId: z.string().min(1).max(100).meta({ example: 'kb-line2-rig1' }), inputChannel: z.number().int().min(0).meta({ example: 0 }) }),
  ])
  .meta({ id: 'CalibrationReference', description: 'A calibration by id, or the current one of a rig input.' });

export const maskReferenceSchema = z
  .strictObject({ maskId: prefixedIdSchema('msk', 'msk_6Wd1Lq8Zt3Kv5Nx9Rb2P'), version: z.number().int().min(1).optional() })
  .meta({ id: 'MaskReference', description: 'Latest version unless `version` is given.' });

export const spectrumInputSchema = z
  .strictObject({
    frequenciesHz: z.array(z.number()).min(3).max(1_048_577).meta({ description: 'Strictly ascending, 0 < f ≤ 1 MHz.' }),
    magnitudeDb: z.array(z.number()).meta({ description: 'Levels in magnitudeReference, ±400 dB.' }),
    magnitudeReference: z.enum(['db_spl', 'dbv', 'dbu', 'dbfs', 'db_relative']),
    phaseDeg: z.array(z.number()).optional(),
  })
  .meta({ id: 'SpectrumInput', description: 'A spectrum measured elsewhere.' });

export const sensitivityRequestSchema = z
  .strictObject({
    deviceType: z.enum(['loudspeaker', 'microphone', 'headphone']),
    responseAnalysisId: analysisIdSchema.optional().meta({
      description:
        'Loudspeaker, headphone: derive the sensitivity from this succeeded, calibrated frequency_response or stepped_sine ' +
        'analysis of the organisation (its stored dB SPL curve) instead of a capture. Its calibration, distance and drive ' +
        'voltage apply; give no captureId, stimulus or calibration. Refused with 422 source_analysis_unusable (extension ' +
        '`reason`) when it is missing, not a response, not succeeded, uncalibrated, normalised or referred to another ' +
        'distance or drive.',
    }),
    bandHz: z.tuple([z.number().positive(), z.number().positive()]).optional().meta({ description: 'Band of the power mean of the calibrated response (loudspeaker, headphone). Default [300, 3000].', example: [300, 3000] }),
    statedLevelDbSpl: z.number().optional().meta({ description: 'Microphone: the calibrator\'s stated level, dB SPL.', example: 94 }),
    statedFrequencyHz: z.number().optional().meta({ description: 'Microphone: the calibrator\'s stated frequency. Default 1000 Hz.' }),
    adcFullScaleVoltsRms: z.number().positive().optional().meta({ description: 'Microphone: RMS voltage of a sine that just reaches full scale, V.', example: 1 }),
  })
  .meta({ id: 'SensitivityRequest' });

export const calibratorRequestSchema = z
  .strictObject({
    statedLevelDbSpl: z.number().meta({ example: 94 }),
    statedFrequencyHz: z.number().optional().meta({ example: 1000 }),
  })
  .meta({ id: 'CalibratorRequest', description: 'The calibrator\'s stated level and frequency.' });

export const inlineStimulusSchema = z
  .strictObject({ type: stimulusTypeSchema, parameters: z.record(z.string(), z.unknown()) })
  .meta({ id: 'InlineStimulus', description: 'Stimulus parameters given inline instead of a stimulusId (same rules as POST /v1/stimuli).' });

export const analysisOptionsSchema = z.record(z.string(), z.unknown()).meta({
  id: 'AnalysisOptions',
  description:
    'Engine options for the kind, checked by the engine (422 with a pointer into #/options on a bad value). Sweep ' +
    'response: smoothing {octaveFraction: "none"|1…48, averaging power|complex}, grid {pointsPerOctave, startHz, stopHz}, ' +
    'normalisation {kind: none|at_1khz|at_frequency|band_mean}, bandLimits, thirdOctaveTable, analysisWindowSeconds, ' +
    'captureOffsetSeconds. Distortion: maxOrder, upperLimitHz (THD bandwidth), thdHeadline thd_f|thd_r, screening, summary. ' +
    'response_and_distortion: {response: {...}, distortion: {...}}. tone_distortion: toneFrequencyHz, method ' +
    'windowed|coherent, window, analysisSegment/silentSegment {startSeconds, durationSeconds}, maxOrder, upperLimitHz, ' +
    'thdHeadline, thdPlusNoise, minSnrDb, residualPointsPerOctave, screening. Spectrum: smoothing, grid, normalisation, bandLimits, ' +
    'sensitivityBand, maskGuardBandDb. Channels, gate, conditions and calibration come from their own members.',
  example: { smoothing: { octaveFraction: 6 }, grid: { pointsPerOctave: 24 } },
});

export const createAnalysisRequestSchema = z
  .strictObject({
    kind: analysisKindSchema,
    captureId: captureIdSchema.optional().meta({ description: 'A stored capture; or upload the file in the same multipart request (part `file`).' }),
    stimulusId: stimulusIdSchema.optional(),
    stimulus: inlineStimulusSchema.optional(),
    channels: channelRolesSchema.optional(),
    conditions: conditionsSchema.optional(),
    options: analysisOptionsSchema.optional(),
    calibration: calibrationReferenceSchema.optional(),
    mask: maskReferenceSchema.optional(),
    spectrum: spectrumInputSchema.optional().meta({ description: 'Required for kind spectrum (no WAV).' }),
    calibrator: calibratorRequestSchema.optional().meta({ description: 'Required for kind calibrator.' }),
    sensitivity: sensitivityRequestSchema.optional().meta({ description: 'Required for kind sensitivity.' }),
    dut: dutSchema.optional(),
    tags: z.array(z.string().trim().min(1).max(50)).max(20).optional().meta({ example: ['line-2', 'incoming-inspection'] }),
  })
  .meta({
    id: 'CreateAnalysisRequest',
    example: {
      kind: 'response_and_distortion',
      captureId: 'cap_3Jd9Qw2Lx7Vb5Np1Rt8K',
      stimulusId: 'stm_8Hq2Zt5Kc1Wm9Lp3Xv7R',
      channels: { measurement: 0, reference: 1 },
      conditions: { distanceM: 1, driveVoltageVrms: 2.83, nominalImpedanceOhm: 8, environment: 'gated', gate: { lengthSeconds: 0.005 }, temperatureC: 21.5 },
      options: { smoothing: { octaveFraction: 6 } },
      calibration: { rigId: 'kb-line2-rig1', inputChannel: 0 },
      dut: { model: 'KB-65 woofer', serial: 'KB65-24-000123', lot: 'LOT-2024-11A' },
      tags: ['line-2'],
    },
  });
export type CreateAnalysisRequest = z.infer<typeof createAnalysisRequestSchema>;

export const rerunAnalysisRequestSchema = z
  .strictObject({
    options: analysisOptionsSchema.optional(),
    conditions: conditionsSchema.optional(),
    channels: channelRolesSchema.optional(),
    calibration: calibrationReferenceSchema.nullable().optional(),
    mask: maskReferenceSchema.nullable().optional(),
    tags: z.array(z.string().trim().min(1).max(50)).max(20).optional(),
  })
  .meta({ id: 'RerunAnalysisRequest', description: 'Members given replace the origin\'s; the rest is copied.' });

export const appliedCalibrationSchema = z
  .object({
    id: z.string(),
    dbfsAtOnePascal: z.number(),
    validFrom: z.string().nullable(),
    validUntil: z.string().nullable(),
    expired: z.boolean(),
    source: z.string(),
  })
  .meta({ id: 'AppliedCalibration' });

export const analysisSchema = z
  .object({
    id: analysisIdSchema,
    kind: analysisKindSchema,
    status: analysisStatusSchema,
    progress: z.number().min(0).max(1).meta({ description: '0 while queued, 1 when finished.' }),
    createdAt: timestampSchema,
    updatedAt: timestampSchema,
    startedAt: timestampSchema.nullable(),
    finishedAt: timestampSchema.nullable(),
    captureId: captureIdSchema.nullable(),
    stimulusId: stimulusIdSchema.nullable(),
    request: createAnalysisRequestSchema.omit({ spectrum: true }).partial().meta({ description: 'What was asked (without a spectrum\'s arrays).' }),
    dut: z.object({ model: z.string().nullable(), serial: z.string().nullable(), lot: z.string().nullable() }),
    tags: z.array(z.string()),
    rerunOf: analysisIdSchema.nullable(),
    attempts: z.number().int(),
    engineVersion: z.string().nullable(),
    calibration: appliedCalibrationSchema.nullable().meta({ description: 'The calibration applied; null = relative dBFS (see the uncalibrated warning).' }),
    verdict: verdictSchema.nullable(),
    worstMarginDb: z.number().nullable().meta({ description: 'Smallest margin to the mask limits, dB (negative = outside); null without a mask verdict.', example: 1.8 }),
    warnings: z.array(engineWarningSchema),
    conventions: z.record(z.string(), z.union([z.string(), z.number()])).nullable(),
    result: z.record(z.string(), z.unknown()).nullable().meta({ description: 'The engine result (kind, engineVersion, conventions, figures, curves, warnings), returned exactly as stored; non-integer numbers keep 7 significant digits (conventions.numberPrecision).' }),
    error: problemSchema.nullable().meta({ description: 'Why it failed (problem object).' }),
  })
  .meta({ id: 'Analysis', description: 'An analysis job and, when finished, its result.' });
export type Analysis = z.infer<typeof analysisSchema>;

export const analysisParamsSchema = z.strictObject({ analysisId: analysisIdSchema });

export const ANALYSIS_SORTS = ['-createdAt', 'createdAt', 'model', '-model', 'serial', '-serial', 'verdict', '-verdict', 'worstMarginDb', '-worstMarginDb'] as const;
export const analysisSortSchema = z.enum(ANALYSIS_SORTS).meta({
  id: 'AnalysisSort',
  description:
    'Order of the list: a field, ascending, or `-field`, descending; ties are broken by id in the same direction. ' +
    '`model`, `serial`, `verdict` (fail < incomplete < pass) and `worstMarginDb` put analyses without that value last ' +
    'in either direction. Default `-createdAt` (newest first).',
});
export type AnalysisSort = z.infer<typeof analysisSortSchema>;

export const analysisListQuerySchema = z.strictObject({
  ...pageQueryShape,
  sort: analysisSortSchema.default('-createdAt'),
  kind: analysisKindSchema.optional(),
  status: analysisStatusSchema.optional(),
  verdict: verdictSchema.optional(),
  model: z.string().max(100).optional(),
  serial: z.string().max(100).optional(),
  lot: z.string().max(100).optional(),
  tag: z.string().max(50).optional(),
  createdFrom: timestampSchema.optional().meta({ description: 'Created at or after (inclusive).' }),
  createdTo: timestampSchema.optional().meta({ description: 'Created before (exclusive).' }),
});
export type AnalysisListQuery = z.infer<typeof analysisListQuerySchema>;
export const analysisPageSchema = pageSchema(analysisSchema.omit({ result: true }), 'AnalysisPage');

export const analysisExportQuerySchema = z.strictObject({
  format: z.enum(['csv', 'json']).default('json').meta({ description: 'json: the stored result verbatim; csv: curves as columns after `#` comment lines stating the conventions.' }),
});

export const preferHeadersSchema = z.object({
  prefer: z
    .string()
    .max(200)
    .optional()
    .meta({ description: 'RFC 7240 `wait=N` (N ≤ 60 s): answer 200 with the finished analysis if it finishes within N seconds, else 202.', example: 'wait=10' }),
  'idempotency-key': z.string().min(1).max(255).optional().meta({ description: 'Client-chosen key (UUID v4 recommended) identifying retries of this request.' }),
});
