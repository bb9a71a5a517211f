import { useState, type FormEvent } from 'react';
import { Button } from '@console/components/ui/button';
import { SelectField, TextField } from '@console/components/ui/field';
import type { ProductionLot } from '@shared/schemas/production';
import type { ProductionFilter } from '../utils/production-filter';

type ProductionFilterFormProps = { lots: ProductionLot[]; filter: ProductionFilter; onChange: (filter: ProductionFilter) => void };

/** Model and lot come from what the organisation has measured; the model choice resets the lot. */
export function ProductionFilterForm({ lots, filter, onChange }: ProductionFilterFormProps) {
  const [draft, setDraft] = useState(filter);
  const [seen, setSeen] = useState(filter);
  if (seen !== filter) {
    setSeen(filter);
    setDraft(filter);
  }
  const models = [...new Set(lots.map((pair) => pair.model))].sort();
  const lotsOfModel = lots.filter((pair) => pair.model === draft.model && pair.lot !== null).sort((a, b) => (a.lot! < b.lot! ? -1 : 1));

  const submit = (event: FormEvent) => {
    event.preventDefault();
    onChange(draft);
  };

  return (
    <form onSubmit={submit} aria-label="Choose model and lot" className="grid grid-cols-2 gap-3 px-5 py-4 md:grid-cols-[minmax(0,1.4fr)_minmax(0,1.2fr)_minmax(0,1fr)_minmax(0,1fr)_auto]">
      <SelectField label="Model" value={draft.model ?? ''} onChange={(e) => onChange({ ...draft, model: e.target.value || undefined, lot: undefined })}>
        <option value="">Choose a model…</option>
        {models.map((model) => (
          <option key={model} value={model}>
            {model}
          </option>
        ))}
      </SelectField>
      <SelectField
        label="Lot"
        value={draft.lot ?? ''}
        disabled={!draft.model}
        onChange={(e) => onChange({ ...draft, lot: e.target.value || undefined })}
      >
        <option value="">All lots</option>
        {lotsOfModel.map((pair) => (
          <option key={pair.lot} value={pair.lot!}>
            {`${pair.lot} (${pair.analyses})`}
          </option>
        ))}
      </SelectField>
      <TextField label="From (UTC day)" type="date" value={draft.from ?? ''} onChange={(e) => setDraft({ ...draft, from: e.target.value || undefined })} />
      <TextField label="Until (UTC day)" type="date" value={draft.to ?? ''} onChange={(e) => setDraft({ ...draft, to: e.target.value || undefined })} />
      <div className="flex items-end gap-2">
        <Button type="submit" variant="secondary">
          Apply
        </Button>
        {(draft.from || draft.to) && (
          <Button variant="ghost" onClick={() => onChange({ ...draft, from: undefined, to: undefined })}>
            Any date
          </Button>
        )}
      </div>
    </form>
  );
}
