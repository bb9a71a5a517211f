import { useEffect, useRef, useState, type FormEvent } from 'react';
import { ProblemAlert } from '@console/components/ui/alert';
import { Button } from '@console/components/ui/button';
import { TextField } from '@console/components/ui/field';
import { fieldErrorsFromProblem } from '@console/lib/problem-message';
import type { Mask, MaskVersion } from '@shared/schemas/masks';
import { useAddMaskVersion, useCreateMask } from '../api/create-mask';
import { referenceChoiceOf, referenceContent, type ReferenceChoice } from '../utils/mask-reference';
import { checkMaskRows, rowsFromPoints, starterRows, type MaskRow } from '../utils/mask-rows';
import { MaskBandChart } from './mask-band-chart';
import { MaskPointsEditor } from './mask-points-editor';
import { ReferenceFields } from './reference-fields';

type MaskPointsFormProps =
  | { mode: 'create'; onCreated: (mask: Mask) => void }
  | { mode: 'version'; maskId: string; current: MaskVersion; onCreated: (version: MaskVersion) => void };

/** Up to this many points a stored version is copied into the editor as the start of the next one. */
const EDITABLE_POINTS = 60;

/** A mask (or a new version of one) typed in as points; the band is drawn as soon as the rows are valid. */
export function MaskPointsForm(props: MaskPointsFormProps) {
  const current = props.mode === 'version' ? props.current : null;
  const [name, setName] = useState('');
  const [reference, setReference] = useState<ReferenceChoice>(referenceChoiceOf(current));
  const [rows, setRows] = useState<MaskRow[]>(() =>
    current && (current.upper?.length ?? 0) <= EDITABLE_POINTS && current.upper && current.lower ? rowsFromPoints(current.upper, current.lower) : starterRows(),
  );
  const [note, setNote] = useState('');
  const [attempted, setAttempted] = useState(false);
  // Bumped by a refused submit; once the messages are on screen, focus moves to the first cell with one.
  const [refusals, setRefusals] = useState(0);
  const formRef = useRef<HTMLFormElement>(null);
  useEffect(() => {
    if (refusals > 0) formRef.current?.querySelector<HTMLElement>('[aria-invalid="true"]')?.focus();
  }, [refusals]);
  const idempotencyKey = useRef(crypto.randomUUID());
  const renew = () => (idempotencyKey.current = crypto.randomUUID());

  const onDone = () => {
    setAttempted(false);
    setName('');
    setNote('');
    renew();
  };
  const create = useCreateMask({
    onSuccess: (mask) => {
      onDone();
      if (props.mode === 'create') props.onCreated(mask);
    },
  });
  const addVersion = useAddMaskVersion(props.mode === 'version' ? props.maskId : '', {
    onSuccess: (version) => {
      onDone();
      if (props.mode === 'version') props.onCreated(version);
    },
  });
  const mutation = props.mode === 'create' ? create : addVersion;

  const check = checkMaskRows(rows);
  const referenceCheck = referenceContent(reference);
  const serverErrors = fieldErrorsFromProblem(mutation.error);
  const nameError = attempted && props.mode === 'create' && name.trim() === '' ? 'This field is required.' : serverErrors.name;

  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    setAttempted(true);
    if (!check.ok || !referenceCheck.ok || (props.mode === 'create' && name.trim() === '')) {
      setRefusals((count) => count + 1);
      return;
    }
    const content = { ...referenceCheck.content, upper: check.upper, lower: check.lower, ...(note.trim() ? { note: note.trim() } : {}) };
    if (props.mode === 'create') create.mutate({ input: { name: name.trim(), ...content }, idempotencyKey: idempotencyKey.current });
    else addVersion.mutate({ input: content, idempotencyKey: idempotencyKey.current });
  };

  return (
    <form ref={formRef} noValidate onSubmit={onSubmit} onChange={renew} className="space-y-5" aria-label={props.mode === 'create' ? 'Create a mask from points' : 'Add a version from points'}>
      {mutation.error && <ProblemAlert error={mutation.error} />}
      {props.mode === 'create' && (
        <TextField label="Name" value={name} onChange={(event) => setName(event.target.value)} maxLength={100} placeholder="KB-65 woofer production limits" error={nameError} />
      )}
      <ReferenceFields value={reference} onChange={(value) => {
          renew();
          setReference(value);
        }} error={attempted && !referenceCheck.ok ? referenceCheck.error : undefined} />
      <div className="grid gap-6 2xl:grid-cols-[minmax(0,1.1fr)_minmax(0,1fr)]">
        <MaskPointsEditor
          rows={rows}
          onChange={(next) => {
            renew();
            setRows(next);
          }}
          cellErrors={attempted && !check.ok ? check.cellErrors : {}}
          formError={attempted && !check.ok ? check.formError : null}
        />
        <div className="min-w-0">
          {check.ok ? (
            <MaskBandChart
              name={name || 'the new mask'}
              lines={{
                levelReference: reference.kind === 'absolute' ? 'absolute' : 'relative',
                referenceLevel: referenceCheck.ok && 'referenceLevel' in referenceCheck.content ? referenceCheck.content.referenceLevel : null,
                upper: check.upper,
                lower: check.lower,
              }}
              heightPx={240}
            />
          ) : (
            <p className="rounded-md border border-dashed border-ink-300 px-4 py-10 text-center text-sm text-ink-600">The band is drawn here once every row is valid.</p>
          )}
        </div>
      </div>
      <TextField label="Note (optional)" value={note} onChange={(event) => setNote(event.target.value)} maxLength={500} placeholder="Tightened 8–12 kHz after the cone supplier change" />
      <Button type="submit" isPending={mutation.isPending}>
        {props.mode === 'create' ? 'Create mask' : 'Save as a new version'}
      </Button>
    </form>
  );
}
