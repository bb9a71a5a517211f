import type { AnalysisRow } from './analyses.repo';

type Column = { name: string; values: unknown[] };

/** Every array in `curves` (nested objects included) as long as the frequency axis, named by its dotted path. */
function curveColumns(curves: Record<string, unknown>, length: number, prefix = ''): Column[] {
  const columns: Column[] = [];
  for (const [key, value] of Object.entries(curves)) {
    const name = prefix ? `${prefix}.${key}` : key;
    if (Array.isArray(value) && value.length === length && value.every((v) => v === null || ['number', 'string', 'boolean'].includes(typeof v))) {
      columns.push({ name, values: value });
    } else if (value && typeof value === 'object' && !Array.isArray(value)) {
      columns.push(...curveColumns(value as Record<string, unknown>, length, name));
    }
  }
  return columns;
}

function axisLength(curves: Record<string, unknown>): number | null {
  if (Array.isArray(curves.frequencyHz)) return curves.frequencyHz.length;
  for (const value of Object.values(curves)) {
    if (value && typeof value === 'object' && !Array.isArray(value)) {
      const nested = axisLength(value as Record<string, unknown>);
      if (nested !== null) return nested;
    }
  }
  return null;
}

const cell = (value: unknown) => {
  if (value === null || value === undefined) return '';
  const text = String(value);
  return /[",\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
};

/**
 * CSV export: `#` comment lines first (analysis id, kind, DUT, engine version, calibration, every convention and
 * warning, so the numbers never travel without their meaning), then one row per frequency with every curve of that
 * length as a column (dotted names, e.g. harmonicDistortion.thdFPercent). Numbers are written as JSON writes them
 * (shortest round-trip form); null cells are empty.
 */
export function analysisCsv(row: AnalysisRow): string {
  const result = JSON.parse(row.resultJson ?? '{}') as { kind?: string; engineVersion?: string; conventions?: Record<string, unknown>; warnings?: { code: string; message: string }[]; curves?: Record<string, unknown> };
  const lines = [
    `# analysis: ${row.id}`,
    `# kind: ${row.kind}`,
    `# dut: model=${row.dutModel ?? ''} serial=${row.dutSerial ?? ''} lot=${row.dutLot ?? ''}`,
    `# engineVersion: ${result.engineVersion ?? row.engineVersion ?? ''}`,
    `# calibration: ${row.calibration ? JSON.stringify(row.calibration) : 'none (relative levels)'}`,
    ...Object.entries(result.conventions ?? {}).map(([key, value]) => `# convention.${key}: ${String(value).replace(/\n/g, ' ')}`),
    ...(result.warnings ?? []).map((warning) => `# warning.${warning.code}: ${warning.message.replace(/\n/g, ' ')}`),
  ];
  const curves = result.curves ?? {};
  const length = axisLength(curves);
  if (length === null) return `${lines.join('\n')}\n`;
  const columns = curveColumns(curves, length);
  lines.push(columns.map((column) => cell(column.name)).join(','));
  for (let i = 0; i < length; i++) lines.push(columns.map((column) => cell(column.values[i])).join(','));
  return `${lines.join('\n')}\n`;
}
