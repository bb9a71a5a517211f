import { createCalibrationRequestSchema, type CALIBRATION_SOURCES, type CreateCalibrationRequest } from '@shared/schemas/calibrations';
import { endOfLocalDayIso } from '@console/utils/format-date';
import type { FieldErrors } from '@console/utils/form-errors';
import { friendlyIssueMessage } from '@console/utils/validation-messages';

export type CalibrationSource = (typeof CALIBRATION_SOURCES)[number];

/** The create form's values as typed (strings), named after the request fields they fill. */
export interface CalibrationFormValues {
  source: CalibrationSource;
  rigId: string;
  inputChannel: string;
  validFrom: string;
  validUntil: string;
  notes: string;
  dbfsAtOnePascal: string;
  microphoneMillivoltsPerPascal: string;
  fullScaleVolts: string;
  fullScaleKind: 'rms' | 'peak';
  channel: string;
  statedLevelDbSpl: string;
  statedFrequencyHz: string;
}

export type CalibrationRequestResult = { ok: true; request: CreateCalibrationRequest } | { ok: false; errors: FieldErrors };

/** Stands in for the capture until it is uploaded, so everything else is checked before any upload starts. */
export const PENDING_CAPTURE_ID = 'cap_pending_upload';

const NUMBER_FIELDS = ['inputChannel', 'dbfsAtOnePascal', 'microphoneMillivoltsPerPascal', 'fullScaleVolts', 'channel', 'statedLevelDbSpl', 'statedFrequencyHz'] as const;

function startOfLocalDayIso(day: string): string | undefined {
  const match = /^(\d{4})-(\d{2})-(\d{2})$/.exec(day);
  if (!match) return undefined;
  const start = new Date(Number(match[1]), Number(match[2]) - 1, Number(match[3]));
  return Number.isNaN(start.getTime()) ? undefined : start.toISOString();
}

type IssueLike = Parameters<typeof friendlyIssueMessage>[0] & { path: readonly PropertyKey[]; inclusive?: boolean };

function messageFor(issue: IssueLike): string {
  if (issue.origin === 'number' && issue.code === 'too_small') return issue.inclusive === false ? `Use a value above ${issue.minimum}.` : `Use a value of at least ${issue.minimum}.`;
  if (issue.origin === 'number' && issue.code === 'too_big') return issue.inclusive === false ? `Use a value below ${issue.maximum}.` : `Use a value of at most ${issue.maximum}.`;
  if (issue.code === 'invalid_type' && issue.input === undefined) return 'This field is required.';
  return friendlyIssueMessage(issue) ?? issue.message ?? 'Check this value.';
}

/** Request fields that the form shows under another name. */
const FORM_FIELD: Record<string, string> = { adcFullScaleVoltsRms: 'fullScaleVolts', adcFullScaleVoltsPeak: 'fullScaleVolts' };

/**
 * The create request for the chosen source, checked by the API's own schema; per-field messages when it is
 * not valid. Numbers must be plain decimal numbers; an empty optional field is left out.
 */
export function calibrationRequestFromForm(values: CalibrationFormValues, captureId = PENDING_CAPTURE_ID): CalibrationRequestResult {
  const errors: FieldErrors = {};
  const numbers: Partial<Record<(typeof NUMBER_FIELDS)[number], number>> = {};
  for (const name of NUMBER_FIELDS) {
    const text = values[name].trim();
    if (text === '') continue;
    const value = Number(text);
    if (!/^[+-]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i.test(text) || !Number.isFinite(value)) errors[name] = 'Enter a number, such as -38.5.';
    else numbers[name] = value;
  }
  const validFrom = values.validFrom ? startOfLocalDayIso(values.validFrom) : undefined;
  const validUntil = values.validUntil ? endOfLocalDayIso(values.validUntil) : undefined;
  if (values.validFrom && !validFrom) errors.validFrom = 'Enter a valid date.';
  if (values.validUntil && !validUntil) errors.validUntil = 'Enter a valid date.';
  if (validFrom && validUntil && validUntil <= validFrom) errors.validUntil = 'Pick a day on or after “Valid from”.';

  const common = {
    rigId: values.rigId.trim(),
    inputChannel: numbers.inputChannel,
    ...(validFrom ? { validFrom } : {}),
    ...(validUntil ? { validUntil } : {}),
    ...(values.notes.trim() ? { notes: values.notes.trim() } : {}),
  };
  const candidate =
    values.source === 'entered_dbfs'
      ? { source: values.source, ...common, dbfsAtOnePascal: numbers.dbfsAtOnePascal }
      : values.source === 'entered_microphone'
        ? {
            source: values.source,
            ...common,
            microphoneMillivoltsPerPascal: numbers.microphoneMillivoltsPerPascal,
            ...(values.fullScaleKind === 'peak' ? { adcFullScaleVoltsPeak: numbers.fullScaleVolts } : { adcFullScaleVoltsRms: numbers.fullScaleVolts }),
          }
        : {
            source: values.source,
            ...common,
            captureId,
            ...(numbers.channel !== undefined ? { channel: numbers.channel } : {}),
            statedLevelDbSpl: numbers.statedLevelDbSpl,
            ...(numbers.statedFrequencyHz !== undefined ? { statedFrequencyHz: numbers.statedFrequencyHz } : {}),
          };
  if (values.source === 'entered_microphone' && values.fullScaleVolts.trim() === '') errors.fullScaleVolts ??= 'This field is required.';

  const parsed = createCalibrationRequestSchema.safeParse(candidate);
  if (!parsed.success) {
    for (const issue of parsed.error.issues as unknown as IssueLike[]) {
      const name = issue.path.length > 0 ? String(issue.path[0]) : '';
      const field = FORM_FIELD[name] ?? name;
      if (field && !(field in errors)) errors[field] = messageFor(issue);
    }
  }
  if (Object.keys(errors).length > 0 || !parsed.success) return { ok: false, errors };
  return { ok: true, request: parsed.data };
}
