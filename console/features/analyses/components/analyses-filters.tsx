import { useState, type FormEvent } from 'react';
import { Button } from '@console/components/ui/button';
import { SelectField, TextField } from '@console/components/ui/field';
import { ANALYSIS_KINDS, ANALYSIS_STATUSES } from '@shared/schemas/analyses';
import { hasFilters, VERDICTS, type AnalysisFilters } from '../utils/filters';
import { kindLabel, statusLabel, verdictLabel } from '../utils/labels';

type AnalysesFiltersProps = { filters: AnalysisFilters; onChange: (filters: AnalysisFilters) => void };

const TEXT_FILTERS = [
  { name: 'model', label: 'Model', placeholder: 'KB-65 woofer' },
  { name: 'serial', label: 'Serial', placeholder: 'KB65-24-000123' },
  { name: 'lot', label: 'Lot', placeholder: 'LOT-2024-11A' },
  { name: 'tag', label: 'Tag', placeholder: 'line-2' },
] as const;

/** Choices apply at once; typed values apply on Enter or "Apply", so the list is not refetched per keystroke. */
export function AnalysesFilters({ filters, onChange }: AnalysesFiltersProps) {
  const [draft, setDraft] = useState(filters);
  const [seen, setSeen] = useState(filters);
  if (seen !== filters) {
    setSeen(filters);
    setDraft(filters);
  }

  const set = (name: keyof AnalysisFilters, value: string, applyNow: boolean) => {
    const next = { ...draft, [name]: value || undefined };
    setDraft(next);
    if (applyNow) onChange(next);
  };

  const submit = (event: FormEvent) => {
    event.preventDefault();
    onChange(draft);
  };

  return (
    <form onSubmit={submit} aria-label="Filter analyses" className="grid grid-cols-2 gap-3 px-5 py-4 md:grid-cols-4 xl:grid-cols-[repeat(5,minmax(0,1fr))]">
      <SelectField label="Kind" value={draft.kind ?? ''} onChange={(e) => set('kind', e.target.value, true)}>
        <option value="">Any kind</option>
        {ANALYSIS_KINDS.map((kind) => (
          <option key={kind} value={kind}>
            {kindLabel[kind]}
          </option>
        ))}
      </SelectField>
      <SelectField label="Status" value={draft.status ?? ''} onChange={(e) => set('status', e.target.value, true)}>
        <option value="">Any status</option>
        {ANALYSIS_STATUSES.map((status) => (
          <option key={status} value={status}>
            {statusLabel[status]}
          </option>
        ))}
      </SelectField>
      <SelectField label="Verdict" value={draft.verdict ?? ''} onChange={(e) => set('verdict', e.target.value, true)}>
        <option value="">Any verdict</option>
        {VERDICTS.map((verdict) => (
          <option key={verdict} value={verdict}>
            {verdictLabel[verdict]}
          </option>
        ))}
      </SelectField>
      <TextField label="Created from" type="date" value={draft.createdFrom ?? ''} onChange={(e) => set('createdFrom', e.target.value, true)} />
      <TextField label="Created until" type="date" value={draft.createdTo ?? ''} onChange={(e) => set('createdTo', e.target.value, true)} />
      {TEXT_FILTERS.map((field) => (
        <TextField
          key={field.name}
          label={field.label}
          placeholder={field.placeholder}
          value={draft[field.name] ?? ''}
          onChange={(e) => set(field.name, e.target.value, false)}
        />
      ))}
      <div className="flex items-end gap-2">
        <Button type="submit" variant="secondary">
          Apply
        </Button>
        {hasFilters(filters) && (
          <Button variant="ghost" onClick={() => onChange({})}>
            Clear all
          </Button>
        )}
      </div>
    </form>
  );
}
