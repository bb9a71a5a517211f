import { SelectField, TextField } from '@console/components/ui/field';
import type { ParameterField } from '../utils/stimulus-fields';

type ParameterInputProps = { field: ParameterField; value: string; error?: string; onChange: (value: string) => void };

export function ParameterInput({ field, value, error, onChange }: ParameterInputProps) {
  const label = field.unit ? `${field.label} (${field.unit})` : field.label;
  if (field.options) {
    return (
      <SelectField label={label} name={field.name} value={value} hint={field.hint} error={error} onChange={(event) => onChange(event.target.value)}>
        {field.options.map((option) => (
          <option key={option} value={option}>
            {option}
          </option>
        ))}
      </SelectField>
    );
  }
  return (
    <TextField
      label={label}
      name={field.name}
      inputMode="decimal"
      autoComplete="off"
      value={value}
      placeholder={field.required ? undefined : 'default'}
      hint={field.hint}
      error={error}
      onChange={(event) => onChange(event.target.value)}
      className="tabular"
    />
  );
}
