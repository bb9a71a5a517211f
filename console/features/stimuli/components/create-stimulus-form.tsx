import { useRef, useState, type FormEvent } from 'react';
import { ProblemAlert } from '@console/components/ui/alert';
import { Button } from '@console/components/ui/button';
import { TextField } from '@console/components/ui/field';
import { focusFirstInvalidField } from '@console/utils/form-errors';
import { cn } from '@console/utils/cn';
import type { Stimulus, StimulusType } from '@shared/schemas/stimuli';
import { useCreateStimulus } from '../api/create-stimulus';
import { STIMULUS_FIELDS, STIMULUS_TYPE_LABELS, STIMULUS_TYPE_SUMMARIES } from '../utils/stimulus-fields';
import { buildStimulusRequest, defaultStimulusValues, stimulusErrorsFromProblem, type StimulusFormErrors } from '../utils/stimulus-request';
import { ParameterInput } from './parameter-input';

const TYPES: StimulusType[] = ['sweep', 'stepped_sine', 'calibrator_check'];

export function CreateStimulusForm({ onCreated }: { onCreated: (stimulus: Stimulus) => void }) {
  const formRef = useRef<HTMLFormElement>(null);
  const idempotencyKey = useRef(crypto.randomUUID());
  const [type, setType] = useState<StimulusType>('sweep');
  const [name, setName] = useState('');
  const [values, setValues] = useState<Record<string, string>>(() => defaultStimulusValues('sweep'));
  const [clientErrors, setClientErrors] = useState<StimulusFormErrors>({});

  const create = useCreateStimulus({
    onSuccess: (stimulus) => {
      idempotencyKey.current = crypto.randomUUID();
      setName('');
      onCreated(stimulus);
    },
  });
  const errors = { ...stimulusErrorsFromProblem(create.error), ...clientErrors };

  // Changed values are a new request, so they get a new Idempotency-Key.
  const changed = () => {
    idempotencyKey.current = crypto.randomUUID();
  };

  const chooseType = (next: StimulusType) => {
    changed();
    setType(next);
    setValues(defaultStimulusValues(next));
    setClientErrors({});
    create.reset();
  };

  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const built = buildStimulusRequest(type, name, values);
    if (!built.ok) {
      setClientErrors(built.errors);
      focusFirstInvalidField(event.currentTarget, built.errors);
      return;
    }
    setClientErrors({});
    create.mutate({ input: built.request, idempotencyKey: idempotencyKey.current });
  };

  const fields = STIMULUS_FIELDS[type];
  const renderField = (field: (typeof fields)[number]) => (
    <ParameterInput
      key={`${type}-${field.name}`}
      field={field}
      value={values[field.name] ?? ''}
      error={errors[field.name]}
      onChange={(value) => {
        changed();
        setValues((current) => ({ ...current, [field.name]: value }));
      }}
    />
  );

  return (
    <form ref={formRef} noValidate onSubmit={onSubmit} className="space-y-6">
      {create.error ? <ProblemAlert error={create.error} /> : null}
      <fieldset className="space-y-2">
        <legend className="text-sm font-semibold text-ink-800">Signal</legend>
        <div className="grid gap-2 md:grid-cols-3">
          {TYPES.map((candidate) => (
            <label
              key={candidate}
              className={cn(
                'flex cursor-pointer items-start gap-3 rounded-md border px-3 py-2.5 transition-colors',
                candidate === type ? 'border-ink-600 bg-ink-50' : 'border-ink-200 hover:border-ink-400',
              )}
            >
              <input
                type="radio"
                name="type"
                value={candidate}
                checked={candidate === type}
                onChange={() => chooseType(candidate)}
                className="mt-0.5 size-4 shrink-0 accent-ink-700"
              />
              <span className="min-w-0">
                <span className="block text-sm font-semibold text-ink-900">{STIMULUS_TYPE_LABELS[candidate]}</span>
                <span className="block text-xs text-ink-600">{STIMULUS_TYPE_SUMMARIES[candidate]}</span>
              </span>
            </label>
          ))}
        </div>
      </fieldset>
      <TextField
        label="Name (optional)"
        name="name"
        value={name}
        placeholder="KB-65 woofer sweep 20 Hz – 20 kHz"
        maxLength={100}
        autoComplete="off"
        error={errors.name}
        onChange={(event) => {
          changed();
          setName(event.target.value);
        }}
        fieldClassName="max-w-xl"
      />
      <div className="grid gap-5 sm:grid-cols-2 lg:grid-cols-3 xl:grid-cols-5">{fields.filter((field) => !field.advanced).map(renderField)}</div>
      <details className="group rounded-md border border-ink-200 px-4 py-3">
        <summary className="cursor-pointer text-sm font-semibold text-ink-800">More settings (fades, silences{type === 'stepped_sine' ? ', settling' : ''})</summary>
        <p className="mt-2 text-xs text-ink-600">Leave a field empty for the engine’s default.</p>
        <div className="mt-4 grid gap-5 sm:grid-cols-2 lg:grid-cols-4">{fields.filter((field) => field.advanced).map(renderField)}</div>
      </details>
      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit" isPending={create.isPending}>
          {create.isPending ? 'Creating stimulus…' : 'Create stimulus'}
        </Button>
        <p className="text-xs text-ink-500">The engine checks the parameters; safety cautions come with the download.</p>
      </div>
    </form>
  );
}
