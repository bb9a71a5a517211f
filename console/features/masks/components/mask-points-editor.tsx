import { useId } from 'react';
import { Button } from '@console/components/ui/button';
import { Icon } from '@console/components/ui/icons';
import { controlClasses } from '@console/components/ui/field';
import { cn } from '@console/utils/cn';
import { emptyRow, MASK_FREQUENCY_RANGE_HZ, type CellErrors, type MaskCell, type MaskRow } from '../utils/mask-rows';

type MaskPointsEditorProps = {
  rows: MaskRow[];
  onChange: (rows: MaskRow[]) => void;
  /** Messages per row id and cell; shown under the cell they concern. */
  cellErrors?: Record<string, CellErrors>;
  formError?: string | null;
};

const COLUMNS: { cell: MaskCell; label: string; placeholder: string }[] = [
  { cell: 'frequencyHz', label: 'Frequency (Hz)', placeholder: '1000' },
  { cell: 'lowerDb', label: 'Lower limit (dB)', placeholder: '-3' },
  { cell: 'upperDb', label: 'Upper limit (dB)', placeholder: '3' },
];

/**
 * A table of limit points, one row per frequency. Every cell is a labelled text input; its message sits under it
 * and is tied to it with aria-describedby, so a screen reader reads the message with the cell.
 */
export function MaskPointsEditor({ rows, onChange, cellErrors = {}, formError }: MaskPointsEditorProps) {
  const baseId = useId();
  const update = (rowId: string, cell: MaskCell, value: string) => onChange(rows.map((row) => (row.id === rowId ? { ...row, [cell]: value } : row)));
  const insertAfter = (index: number) => onChange([...rows.slice(0, index + 1), emptyRow(), ...rows.slice(index + 1)]);
  const remove = (rowId: string) => onChange(rows.filter((row) => row.id !== rowId));
  const formErrorId = `${baseId}-form-error`;

  return (
    <div className="space-y-2">
      <div className="overflow-x-auto rounded-md border border-ink-200">
        <table className="w-full border-collapse text-left text-sm" aria-describedby={formError ? formErrorId : undefined}>
          <caption className="sr-only">Limit points: frequency, lower and upper limit per row</caption>
          <thead>
            <tr className="bg-ink-50">
              <th scope="col" className="w-10 px-3 py-2 font-mono text-eyebrow font-semibold text-ink-600 uppercase">
                #
              </th>
              {COLUMNS.map((column) => (
                <th key={column.cell} scope="col" className="px-3 py-2 font-mono text-eyebrow font-semibold whitespace-nowrap text-ink-600 uppercase">
                  {column.label}
                </th>
              ))}
              <th scope="col" className="px-3 py-2">
                <span className="sr-only">Row actions</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {rows.map((row, index) => (
              <tr key={row.id} className="border-t border-ink-100 align-top">
                <th scope="row" className="px-3 py-2.5 font-mono text-xs font-normal text-ink-500">
                  {index + 1}
                </th>
                {COLUMNS.map((column) => {
                  const error = cellErrors[row.id]?.[column.cell];
                  const errorId = `${baseId}-${row.id}-${column.cell}-error`;
                  return (
                    <td key={column.cell} className="px-2 py-1.5">
                      <input
                        type="text"
                        inputMode="decimal"
                        autoComplete="off"
                        aria-label={`Row ${index + 1} ${column.label}`}
                        aria-invalid={error ? true : undefined}
                        aria-describedby={error ? errorId : undefined}
                        value={row[column.cell]}
                        placeholder={column.placeholder}
                        onChange={(event) => update(row.id, column.cell, event.target.value)}
                        className={cn(controlClasses, 'h-9 min-w-24 font-mono tabular')}
                      />
                      {error && (
                        <p id={errorId} className="mt-1 text-xs font-semibold text-danger-700">
                          {error}
                        </p>
                      )}
                    </td>
                  );
                })}
                <td className="px-2 py-1.5 whitespace-nowrap">
                  <Button variant="ghost" size="sm" onClick={() => insertAfter(index)} aria-label={`Insert a row after row ${index + 1}`}>
                    <Icon name="plus" className="size-4" />
                  </Button>
                  <Button variant="ghost-danger" size="sm" onClick={() => remove(row.id)} aria-label={`Remove row ${index + 1}`}>
                    ×
                  </Button>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <div className="flex flex-wrap items-center justify-between gap-3">
        <Button variant="secondary" size="sm" onClick={() => onChange([...rows, emptyRow()])}>
          <Icon name="plus" className="size-4" />
          Add row
        </Button>
        <p className="text-xs text-ink-500">
          Frequencies ascending, {MASK_FREQUENCY_RANGE_HZ[0]} Hz to {MASK_FREQUENCY_RANGE_HZ[1] / 1000} kHz; lower below upper. Limits are read linearly in dB
          against log frequency between points.
        </p>
      </div>
      {formError && (
        <p id={formErrorId} role="alert" className="text-sm font-semibold text-danger-700">
          {formError}
        </p>
      )}
    </div>
  );
}
