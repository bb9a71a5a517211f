import { SelectField, TextField } from '@console/components/ui/field';
import type { ReferenceChoice } from '../utils/mask-reference';

type ReferenceFieldsProps = { value: ReferenceChoice; onChange: (value: ReferenceChoice) => void; error?: string; absoluteLabel?: string };

/** What the mask's 0 dB is: the curve's own level at a frequency (relative), or the curve's dB as they are. */
export function ReferenceFields({ value, onChange, error, absoluteLabel = 'Absolute (the curve’s own dB)' }: ReferenceFieldsProps) {
  return (
    <div className="grid gap-4 sm:grid-cols-2">
      <SelectField
        label="Levels are"
        value={value.kind}
        onChange={(event) => onChange(event.target.value === 'absolute' ? { kind: 'absolute' } : { kind: 'at_frequency', frequencyHz: '1000' })}
      >
        <option value="at_frequency">Relative to the curve at a frequency</option>
        <option value="absolute">{absoluteLabel}</option>
      </SelectField>
      {value.kind === 'at_frequency' && (
        <TextField
          label="Reference frequency (Hz)"
          inputMode="decimal"
          value={value.frequencyHz}
          onChange={(event) => onChange({ kind: 'at_frequency', frequencyHz: event.target.value })}
          error={error}
          hint="The curve's level here counts as 0 dB."
        />
      )}
    </div>
  );
}
