import { useRef, useState, type FormEvent } from 'react';
import { ProblemAlert } from '@console/components/ui/alert';
import { Button } from '@console/components/ui/button';
import { TextField } from '@console/components/ui/field';
import { EmptyState, ErrorState, LoadingState } from '@console/components/ui/states';
import { fieldErrorsFromProblem } from '@console/lib/problem-message';
import { formatDateTime } from '@console/utils/format-date';
import type { Mask } from '@shared/schemas/masks';
import { useDeriveMask } from '../api/derive-mask';
import { useGoldenCandidates, type CandidateAnalysis } from '../api/get-golden-candidates';
import { DEFAULT_REFERENCE, referenceContent, type ReferenceChoice } from '../utils/mask-reference';
import { ReferenceFields } from './reference-fields';

/** Kinds whose results hold a frequency-response curve (the ones a mask can be derived from). */
const KINDS_WITH_CURVE: Record<string, string> = {
  frequency_response: 'Frequency response',
  response_and_distortion: 'Response + distortion',
  stepped_sine: 'Stepped sine',
  spectrum: 'Spectrum',
};

const unitName = (analysis: CandidateAnalysis) => [analysis.dut.model, analysis.dut.serial].filter(Boolean).join(' · ') || analysis.id;

function CandidateList({ candidates, selected, onToggle }: { candidates: CandidateAnalysis[]; selected: ReadonlySet<string>; onToggle: (id: string, on: boolean) => void }) {
  return (
    <fieldset className="max-h-72 overflow-y-auto rounded-md border border-ink-200">
      <legend className="sr-only">Golden analyses</legend>
      <ul className="divide-y divide-ink-100">
        {candidates.map((analysis) => (
          <li key={analysis.id}>
            <label className="flex cursor-pointer items-start gap-3 px-4 py-2.5 hover:bg-ink-50">
              <input type="checkbox" className="mt-0.5 size-4 accent-ink-700" checked={selected.has(analysis.id)} onChange={(event) => onToggle(analysis.id, event.target.checked)} />
              <span className="min-w-0 flex-1">
                <span className="block text-sm font-semibold text-ink-900">{unitName(analysis)}</span>
                <span className="block text-xs text-ink-600">
                  {KINDS_WITH_CURVE[analysis.kind]} · lot {analysis.dut.lot ?? '—'} · <time dateTime={analysis.createdAt}>{formatDateTime(analysis.createdAt)}</time>
                  {analysis.verdict ? ` · ${analysis.verdict}` : ''}
                </span>
              </span>
              <span className="hidden font-mono text-xs text-ink-500 sm:block">{analysis.id}</span>
            </label>
          </li>
        ))}
      </ul>
    </fieldset>
  );
}

type DeriveMaskFormProps = { maskId?: string; onDerived: (mask: Mask) => void };

/**
 * Golden units picked from the history (succeeded analyses with a response curve, narrowed by model and lot)
 * become limits at mean ± max(k·σ, minimum half-width) — a new mask, or a new version of `maskId`.
 */
export function DeriveMaskForm({ maskId, onDerived }: DeriveMaskFormProps) {
  const [filters, setFilters] = useState<{ model?: string; lot?: string }>({});
  const [draft, setDraft] = useState({ model: '', lot: '' });
  const [selected, setSelected] = useState<ReadonlySet<string>>(new Set());
  const [name, setName] = useState('');
  const [k, setK] = useState('3');
  const [minHalfWidthDb, setMinHalfWidthDb] = useState('1');
  const [reference, setReference] = useState<ReferenceChoice>(DEFAULT_REFERENCE);
  const [clientErrors, setClientErrors] = useState<Record<string, string>>({});
  const idempotencyKey = useRef(crypto.randomUUID());
  const candidates = useGoldenCandidates(filters);
  const derive = useDeriveMask({
    onSuccess: (mask) => {
      setSelected(new Set());
      setName('');
      idempotencyKey.current = crypto.randomUUID();
      onDerived(mask);
    },
  });
  const errors = { ...fieldErrorsFromProblem(derive.error), ...clientErrors };
  const usable = (candidates.data?.data ?? []).filter((analysis) => analysis.kind in KINDS_WITH_CURVE);

  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const found: Record<string, string> = {};
    const kValue = Number(k);
    const widthValue = Number(minHalfWidthDb);
    if (!maskId && name.trim() === '') found.name = 'This field is required.';
    if (selected.size < 2) found.analysisIds = 'Pick at least 2 golden analyses (3 or more recommended).';
    if (k.trim() === '' || !Number.isFinite(kValue) || kValue <= 0 || kValue > 10) found.k = 'Use a number above 0, at most 10.';
    if (minHalfWidthDb.trim() === '' || !Number.isFinite(widthValue) || widthValue < 0 || widthValue > 100) found.minHalfWidthDb = 'Use a number from 0 to 100 dB.';
    const referenceCheck = referenceContent(reference);
    if (!referenceCheck.ok) found.referenceLevel = referenceCheck.error;
    setClientErrors(found);
    if (Object.keys(found).length > 0 || !referenceCheck.ok) return;
    derive.mutate({
      input: {
        name: maskId ? 'new version' : name.trim(),
        analysisIds: [...selected],
        k: kValue,
        minHalfWidthDb: widthValue,
        ...('referenceLevel' in referenceCheck.content ? { referenceLevel: referenceCheck.content.referenceLevel } : {}),
        ...(maskId ? { maskId } : {}),
      },
      idempotencyKey: idempotencyKey.current,
    });
  };

  return (
    <form noValidate onSubmit={onSubmit} onChange={() => (idempotencyKey.current = crypto.randomUUID())} className="space-y-5" aria-label="Derive a mask from golden units">
      {derive.error && <ProblemAlert error={derive.error} />}
      <div className="grid gap-3 sm:grid-cols-[minmax(0,1fr)_minmax(0,1fr)_auto]">
        <TextField label="Model" placeholder="KB-65 woofer" value={draft.model} onChange={(event) => setDraft({ ...draft, model: event.target.value })} />
        <TextField label="Lot" placeholder="LOT-2024-11A" value={draft.lot} onChange={(event) => setDraft({ ...draft, lot: event.target.value })} />
        <div className="flex items-end">
          <Button variant="secondary" onClick={() => setFilters({ model: draft.model.trim() || undefined, lot: draft.lot.trim() || undefined })}>
            Find analyses
          </Button>
        </div>
      </div>
      <div className="space-y-1.5">
        <p className="text-sm font-semibold text-ink-800" id="golden-analyses-label">
          Golden analyses <span className="font-normal text-ink-600">({selected.size} picked)</span>
        </p>
        {candidates.isPending ? (
          <LoadingState label="Loading succeeded analyses…" />
        ) : candidates.isError ? (
          <ErrorState error={candidates.error} onRetry={() => candidates.refetch()} />
        ) : usable.length === 0 ? (
          <EmptyState title="No analyses with a response curve">Change the model or lot, or measure the golden units first.</EmptyState>
        ) : (
          <CandidateList
            candidates={usable}
            selected={selected}
            onToggle={(id, on) =>
              setSelected((current) => {
                const next = new Set(current);
                if (on) next.add(id);
                else next.delete(id);
                return next;
              })
            }
          />
        )}
        {errors.analysisIds && <p className="text-xs font-semibold text-danger-700" role="alert">{errors.analysisIds}</p>}
      </div>
      <div className="grid gap-4 sm:grid-cols-[minmax(0,2fr)_minmax(0,1fr)_minmax(0,1fr)]">
        {maskId ? <div /> : <TextField label="Name" value={name} onChange={(event) => setName(event.target.value)} maxLength={100} placeholder="KB-65 golden units 2024-11" error={errors.name} />}
        <TextField label="Coverage factor k" inputMode="decimal" value={k} onChange={(event) => setK(event.target.value)} error={errors.k} hint="Limits at mean ± k·σ." />
        <TextField label="Minimum half-width (dB)" inputMode="decimal" value={minHalfWidthDb} onChange={(event) => setMinHalfWidthDb(event.target.value)} error={errors.minHalfWidthDb} hint="Never narrower than this." />
      </div>
      <ReferenceFields value={reference} onChange={setReference} error={errors.referenceLevel} absoluteLabel="Absolute (curves as measured)" />
      <Button type="submit" isPending={derive.isPending}>
        {maskId ? 'Derive a new version' : 'Derive mask'}
      </Button>
    </form>
  );
}
