import { SelectField } from '@console/components/ui/field';
import { cn } from '@console/utils/cn';
import type { NormalisationChoice } from '../utils/overlay';

export type CompareMode = 'overlay' | 'difference';

function Segmented<T extends string>({ legend, value, options, onChange }: { legend: string; value: T; options: { value: T; label: string }[]; onChange: (value: T) => void }) {
  return (
    <fieldset className="space-y-1.5">
      <legend className="text-sm font-semibold text-ink-800">{legend}</legend>
      <div className="inline-flex rounded-md border border-ink-300 p-0.5">
        {options.map((option) => (
          <label
            key={option.value}
            className={cn(
              'cursor-pointer rounded-sm px-3 py-1.5 text-sm font-semibold has-[:focus-visible]:outline-2 has-[:focus-visible]:outline-signal-700',
              value === option.value ? 'bg-ink-800 text-white' : 'text-ink-700 hover:bg-ink-100',
            )}
          >
            <input type="radio" className="sr-only" name={legend} value={option.value} checked={value === option.value} onChange={() => onChange(option.value)} />
            {option.label}
          </label>
        ))}
      </div>
    </fieldset>
  );
}

type CompareControlsProps = {
  normalisation: NormalisationChoice;
  onNormalisation: (choice: NormalisationChoice) => void;
  mode: CompareMode;
  onMode: (mode: CompareMode) => void;
  referenceId: string;
  onReference: (id: string) => void;
  curves: { id: string; label: string }[];
};

export function CompareControls({ normalisation, onNormalisation, mode, onMode, referenceId, onReference, curves }: CompareControlsProps) {
  return (
    <div className="flex flex-wrap items-end gap-6">
      <Segmented
        legend="Normalisation"
        value={normalisation}
        onChange={onNormalisation}
        options={[
          { value: 'none', label: 'None' },
          { value: 'at_1khz', label: '0 dB at 1 kHz' },
          { value: 'band_mean', label: 'Band mean 300 Hz–3 kHz' },
        ]}
      />
      <Segmented
        legend="View"
        value={mode}
        onChange={onMode}
        options={[
          { value: 'overlay', label: 'Overlay' },
          { value: 'difference', label: 'Difference to reference' },
        ]}
      />
      {mode === 'difference' && (
        <SelectField label="Reference curve" value={referenceId} onChange={(event) => onReference(event.target.value)} fieldClassName="min-w-56">
          {curves.map((curve) => (
            <option key={curve.id} value={curve.id}>
              {curve.label}
            </option>
          ))}
        </SelectField>
      )}
    </div>
  );
}
