import { useState, type FormEvent } from 'react';
import { Button } from '@console/components/ui/button';
import { ProblemAlert } from '@console/components/ui/alert';
import { SelectField, TextField } from '@console/components/ui/field';
import { Panel } from '@console/components/ui/panel';
import type { Analysis } from '@shared/schemas/analyses';
import { useRerunAnalysis } from '../api/rerun-analysis';
import { originalOctaveFraction, rerunChoicesFor, rerunInput, type RerunChoice } from '../utils/rerun-options';

const SMOOTHING_CHOICES = ['none', 1, 3, 6, 12, 24, 48] as const;
const ORDER_CHOICES = [2, 3, 4, 5, 6, 7, 8, 9, 10];
const smoothingLabel = (value: (typeof SMOOTHING_CHOICES)[number]) => (value === 'none' ? 'None' : `1/${value} octave`);

type RerunFormProps = { analysis: Analysis; onQueued: (created: Analysis) => void };

/** Runs the same capture again with other options; the original analysis is kept unchanged. */
export function RerunForm({ analysis, onQueued }: RerunFormProps) {
  const choices = rerunChoicesFor(analysis.kind);
  const originalGate = analysis.request.conditions?.gate?.lengthSeconds;
  const [smoothing, setSmoothing] = useState(String(originalOctaveFraction(analysis) ?? ''));
  const [gateMs, setGateMs] = useState(originalGate !== undefined ? String(Number((originalGate * 1000).toPrecision(4))) : '');
  const [maxOrder, setMaxOrder] = useState('');
  const [gateError, setGateError] = useState<string | undefined>();
  const rerun = useRerunAnalysis({ onSuccess: onQueued });
  const [idempotencyKey] = useState(() => crypto.randomUUID());

  if (!choices.smoothing && !choices.gate && !choices.orders) return null;

  const submit = (event: FormEvent) => {
    event.preventDefault();
    const choice: RerunChoice = {};
    if (smoothing !== '') choice.octaveFraction = smoothing === 'none' ? 'none' : Number(smoothing);
    if (choices.gate && gateMs.trim() !== '') {
      const value = Number(gateMs);
      if (!(value > 0 && value <= 1000)) {
        setGateError('Enter a gate length between 0 and 1000 ms.');
        return;
      }
      choice.gateMs = value;
    }
    if (maxOrder !== '') choice.maxOrder = Number(maxOrder);
    setGateError(undefined);
    rerun.mutate({ analysisId: analysis.id, input: rerunInput(analysis, choice), idempotencyKey: `${idempotencyKey}-${JSON.stringify(choice)}` });
  };

  return (
    <Panel title="Re-run with other options" description="A new analysis of the same capture; this one stays as it is.">
      <form onSubmit={submit} className="space-y-4" aria-label="Re-run options">
        {choices.smoothing && (
          <SelectField label="Smoothing" value={smoothing} onChange={(e) => setSmoothing(e.target.value)}>
            <option value="">As before</option>
            {SMOOTHING_CHOICES.map((value) => (
              <option key={value} value={String(value)}>
                {smoothingLabel(value)}
              </option>
            ))}
          </SelectField>
        )}
        {choices.gate && (
          <TextField
            label="Gate after the IR peak (ms)"
            inputMode="decimal"
            value={gateMs}
            onChange={(e) => setGateMs(e.target.value)}
            placeholder="no gate"
            hint="Ends before the first reflection; sets the lowest valid frequency ≈ 1/T."
            error={gateError}
          />
        )}
        {choices.orders && (
          <SelectField label="Highest harmonic order" value={maxOrder} onChange={(e) => setMaxOrder(e.target.value)}>
            <option value="">As before</option>
            {ORDER_CHOICES.map((order) => (
              <option key={order} value={order}>
                {order}
              </option>
            ))}
          </SelectField>
        )}
        {rerun.error ? <ProblemAlert error={rerun.error} /> : null}
        <Button type="submit" isPending={rerun.isPending}>
          Re-run analysis
        </Button>
      </form>
    </Panel>
  );
}
