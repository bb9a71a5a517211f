import { useRef, useState, type FormEvent } from 'react';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { Alert, ProblemAlert } from '@console/components/ui/alert';
import { Button } from '@console/components/ui/button';
import { SelectField, TextField } from '@console/components/ui/field';
import { fieldErrorsFromProblem } from '@console/lib/problem-message';
import { focusFirstInvalidField, type FieldErrors } from '@console/utils/form-errors';
import type { Calibration, CALIBRATION_SOURCES } from '@shared/schemas/calibrations';

type CalibrationSource = (typeof CALIBRATION_SOURCES)[number];
import { createCalibration } from '../api/create-calibration';
import { calibrationKeys } from '../api/keys';
import { uploadCapture } from '../api/upload-capture';
import { calibrationRequestFromForm, type CalibrationFormValues } from '../utils/calibration-request';
import { dbfsAtOnePascalFromMicrophone, fullScaleRmsFromPeak } from '../utils/microphone-dbfs';

const INITIAL: CalibrationFormValues = {
  source: 'entered_dbfs',
  rigId: '',
  inputChannel: '0',
  validFrom: '',
  validUntil: '',
  notes: '',
  dbfsAtOnePascal: '',
  microphoneMillivoltsPerPascal: '',
  fullScaleVolts: '',
  fullScaleKind: 'rms',
  channel: '0',
  statedLevelDbSpl: '94',
  statedFrequencyHz: '1000',
};

const SOURCES: { value: CalibrationSource; label: string; hint: string }[] = [
  { value: 'calibrator_capture', label: 'Calibrator capture', hint: 'Upload a WAV of the calibrator on the microphone; the tone is measured.' },
  { value: 'entered_dbfs', label: 'dBFS at 1 Pa', hint: 'Type the level a 1 Pa tone reads in this chain.' },
  { value: 'entered_microphone', label: 'Microphone mV/Pa', hint: 'From the microphone sensitivity and the converter’s full scale.' },
];

function MicrophonePreview({ values }: { values: CalibrationFormValues }) {
  const millivolts = Number(values.microphoneMillivoltsPerPascal);
  const volts = Number(values.fullScaleVolts);
  if (!(millivolts > 0) || !(volts > 0)) return null;
  const rms = values.fullScaleKind === 'peak' ? fullScaleRmsFromPeak(volts) : volts;
  const dbfs = dbfsAtOnePascalFromMicrophone(millivolts, rms);
  return (
    <p className="text-xs text-ink-600" aria-live="polite">
      Gives <span className="font-mono font-semibold text-ink-900">{`${dbfs < 0 ? '\u2212' : ''}${Math.abs(dbfs).toFixed(2)} dBFS`}</span> at 1 Pa
      (20·log10(M / V<sub>FS,rms</sub>), full-scale sine = 0 dBFS).
    </p>
  );
}

/** Creates a calibration from entered values, or uploads a calibrator capture first and calibrates from it. */
export function CreateCalibrationForm({ onCreated }: { onCreated: (created: Calibration) => void }) {
  const queryClient = useQueryClient();
  const formRef = useRef<HTMLFormElement>(null);
  const [values, setValues] = useState(INITIAL);
  const [file, setFile] = useState<File | null>(null);
  const [clientErrors, setClientErrors] = useState<FieldErrors>({});
  // One key per attempt at the same values: a retry after a lost answer replays rather than stores twice.
  const keys = useRef({ upload: crypto.randomUUID(), create: crypto.randomUUID() });

  const create = useMutation({
    mutationFn: async ({ form, capture }: { form: CalibrationFormValues; capture: File | null }) => {
      let captureId: string | undefined;
      if (form.source === 'calibrator_capture' && capture) captureId = (await uploadCapture(capture, keys.current.upload)).id;
      const built = calibrationRequestFromForm(form, captureId);
      if (!built.ok) throw new Error('The form changed while it was being sent.');
      return createCalibration({ input: built.request, idempotencyKey: keys.current.create });
    },
    onSuccess: async (created) => {
      setValues({ ...INITIAL, rigId: values.rigId, source: values.source });
      setFile(null);
      formRef.current?.reset();
      keys.current = { upload: crypto.randomUUID(), create: crypto.randomUUID() };
      onCreated(created);
      await queryClient.invalidateQueries({ queryKey: calibrationKeys.lists() });
    },
  });
  const errors: FieldErrors = { ...fieldErrorsFromProblem(create.error), ...clientErrors };
  if (errors.adcFullScaleVoltsRms || errors.adcFullScaleVoltsPeak) errors.fullScaleVolts ??= errors.adcFullScaleVoltsRms ?? errors.adcFullScaleVoltsPeak;
  if (errors.captureId) errors.file ??= errors.captureId;

  const set = (name: keyof CalibrationFormValues) => (event: { target: { value: string } }) => {
    keys.current = { upload: keys.current.upload, create: crypto.randomUUID() };
    setValues((current) => ({ ...current, [name]: event.target.value }));
  };

  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const built = calibrationRequestFromForm(values);
    const found: FieldErrors = built.ok ? {} : { ...built.errors };
    if (values.source === 'calibrator_capture' && !file) found.file = 'Choose the WAV capture of the calibrator tone.';
    setClientErrors(found);
    if (Object.keys(found).length > 0) {
      focusFirstInvalidField(event.currentTarget, found);
      return;
    }
    create.mutate({ form: values, capture: file });
  };

  return (
    <form ref={formRef} noValidate onSubmit={onSubmit} className="space-y-5" aria-label="Create a calibration">
      {create.error && <ProblemAlert error={create.error} />}
      <fieldset className="space-y-2">
        <legend className="text-sm font-semibold text-ink-800">From</legend>
        <div className="grid gap-2 md:grid-cols-3">
          {SOURCES.map((source) => (
            <label
              key={source.value}
              className="flex cursor-pointer gap-2.5 rounded-md border border-ink-200 px-3 py-2.5 has-[:checked]:border-ink-700 has-[:checked]:bg-ink-50"
            >
              <input
                type="radio"
                name="source"
                value={source.value}
                checked={values.source === source.value}
                onChange={set('source')}
                className="mt-0.5 size-4 accent-ink-700"
              />
              <span>
                <span className="block text-sm font-semibold text-ink-900">{source.label}</span>
                <span className="block text-xs text-ink-600">{source.hint}</span>
              </span>
            </label>
          ))}
        </div>
      </fieldset>

      <div className="grid gap-4 md:grid-cols-[minmax(0,2fr)_minmax(0,1fr)]">
        <TextField label="Rig" name="rigId" value={values.rigId} onChange={set('rigId')} placeholder="kb-line2-rig1" error={errors.rigId} autoComplete="off" hint="As your organisation names the rig; analyses name it too." />
        <TextField label="Input channel" name="inputChannel" inputMode="numeric" value={values.inputChannel} onChange={set('inputChannel')} error={errors.inputChannel} hint="0-based." />
      </div>

      {values.source === 'entered_dbfs' && (
        <TextField
          label="Level of a 1 Pa tone (dBFS)"
          name="dbfsAtOnePascal"
          inputMode="decimal"
          value={values.dbfsAtOnePascal}
          onChange={set('dbfsAtOnePascal')}
          placeholder="-38.0"
          error={errors.dbfsAtOnePascal}
          hint="What a 1 Pa RMS tone (94 dB SPL) reads in this chain; full-scale sine = 0 dBFS."
        />
      )}
      {values.source === 'entered_microphone' && (
        <div className="space-y-2">
          <div className="grid gap-4 md:grid-cols-3">
            <TextField
              label="Microphone sensitivity (mV/Pa)"
              name="microphoneMillivoltsPerPascal"
              inputMode="decimal"
              value={values.microphoneMillivoltsPerPascal}
              onChange={set('microphoneMillivoltsPerPascal')}
              placeholder="12.5"
              error={errors.microphoneMillivoltsPerPascal}
              hint="Up to the converter input, preamp gain included."
            />
            <TextField
              label="Converter full scale (V)"
              name="fullScaleVolts"
              inputMode="decimal"
              value={values.fullScaleVolts}
              onChange={set('fullScaleVolts')}
              placeholder="1.0"
              error={errors.fullScaleVolts}
            />
            <SelectField label="Full scale stated as" name="fullScaleKind" value={values.fullScaleKind} onChange={set('fullScaleKind')}>
              <option value="rms">RMS of a full-scale sine</option>
              <option value="peak">Peak volts</option>
            </SelectField>
          </div>
          <MicrophonePreview values={values} />
        </div>
      )}
      {values.source === 'calibrator_capture' && (
        <div className="grid gap-4 md:grid-cols-4">
          <div className="flex flex-col gap-1.5 md:col-span-2">
            <label htmlFor="calibration-capture-file" className="text-sm font-semibold text-ink-800">
              Calibrator capture (WAV)
            </label>
            <input
              id="calibration-capture-file"
              name="file"
              type="file"
              accept=".wav,audio/wav,audio/x-wav"
              aria-invalid={errors.file ? true : undefined}
              aria-describedby={errors.file ? 'calibration-capture-file-error' : undefined}
              onChange={(event) => {
                keys.current = { upload: crypto.randomUUID(), create: crypto.randomUUID() };
                setFile(event.target.files?.[0] ?? null);
              }}
              className="block w-full text-sm text-ink-800 file:mr-3 file:h-9 file:rounded-md file:border file:border-ink-400 file:bg-surface file:px-3 file:text-sm file:font-semibold file:text-ink-800 hover:file:bg-ink-50"
            />
            {errors.file && (
              <p id="calibration-capture-file-error" className="text-xs font-semibold text-danger-700">
                {errors.file}
              </p>
            )}
          </div>
          <TextField label="Channel of the tone" name="channel" inputMode="numeric" value={values.channel} onChange={set('channel')} error={errors.channel} />
          <div />
          <TextField label="Stated level (dB SPL)" name="statedLevelDbSpl" inputMode="decimal" value={values.statedLevelDbSpl} onChange={set('statedLevelDbSpl')} error={errors.statedLevelDbSpl} hint="re 20 µPa, e.g. 94 or 114." />
          <TextField label="Stated frequency (Hz)" name="statedFrequencyHz" inputMode="decimal" value={values.statedFrequencyHz} onChange={set('statedFrequencyHz')} error={errors.statedFrequencyHz} />
        </div>
      )}

      <div className="grid gap-4 md:grid-cols-[minmax(0,1fr)_minmax(0,1fr)_minmax(0,2fr)]">
        <TextField label="Valid from (optional)" name="validFrom" type="date" value={values.validFrom} onChange={set('validFrom')} error={errors.validFrom} hint="Empty: from now." />
        <TextField label="Valid until (optional)" name="validUntil" type="date" value={values.validUntil} onChange={set('validUntil')} error={errors.validUntil} hint="Through the end of that day." />
        <TextField label="Notes (optional)" name="notes" value={values.notes} onChange={set('notes')} maxLength={500} placeholder="Class 1 calibrator KBC-0042; preamp gain 20 dB" error={errors.notes} />
      </div>

      {values.source === 'calibrator_capture' && (
        <Alert tone="warning" title="Keep the calibrator on the microphone">
          A calibrator at 94 or 114 dB SPL is loud at the ear. Follow your lab’s calibration procedure and local rules for sound exposure.
        </Alert>
      )}
      <div className="flex items-center gap-3">
        <Button type="submit" isPending={create.isPending}>
          {create.isPending ? (values.source === 'calibrator_capture' ? 'Uploading and measuring…' : 'Creating…') : 'Create calibration'}
        </Button>
        <p className="text-xs text-ink-500">Analyses naming this rig input use the latest calibration valid at the time.</p>
      </div>
    </form>
  );
}
