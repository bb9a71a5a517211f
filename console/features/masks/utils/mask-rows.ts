/** One row of the points editor, as typed. `id` keeps React's row identity across inserts and deletes. */
export interface MaskRow {
  id: string;
  frequencyHz: string;
  lowerDb: string;
  upperDb: string;
}

export type MaskCell = 'frequencyHz' | 'lowerDb' | 'upperDb';
export type CellErrors = Partial<Record<MaskCell, string>>;

export interface MaskPoint {
  frequencyHz: number;
  levelDb: number;
}

export type MaskRowsCheck =
  | { ok: true; upper: MaskPoint[]; lower: MaskPoint[] }
  | { ok: false; cellErrors: Record<string, CellErrors>; formError: string | null };

/** The audio band the editor accepts; the API itself takes up to 1 MHz, the console keeps to what people hear. */
export const MASK_FREQUENCY_RANGE_HZ = [20, 20_000] as const;
/** The API's limit on a limit level. */
export const MASK_LEVEL_LIMIT_DB = 400;
export const MIN_MASK_POINTS = 2;
export const MAX_MASK_POINTS = 500;

const DECIMAL = /^[+\-\u2212]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i;

/** A plain decimal number ("−3", "1e3" and "2.5" too), or a message saying what is wrong with the text. */
function readNumber(text: string): number | string {
  const trimmed = text.trim();
  if (trimmed === '') return 'Required.';
  if (!DECIMAL.test(trimmed)) return 'Numbers only.';
  const value = Number(trimmed.replace('\u2212', '-'));
  return Number.isFinite(value) ? value : 'Numbers only.';
}

const formatHz = (value: number) => (value >= 1000 ? `${Number((value / 1000).toPrecision(4))} kHz` : `${Number(value.toPrecision(4))} Hz`);

/**
 * Checks the editor's rows the way the API will, with a message per cell: numbers only, frequencies strictly
 * ascending within 20 Hz–20 kHz, levels within ±400 dB, lower below upper, at least two rows. On success gives
 * the upper and lower limit lines on the same frequencies.
 */
export function checkMaskRows(rows: readonly MaskRow[]): MaskRowsCheck {
  const cellErrors: Record<string, CellErrors> = {};
  const mark = (rowId: string, cell: MaskCell, message: string) => {
    cellErrors[rowId] = { ...cellErrors[rowId], [cell]: cellErrors[rowId]?.[cell] ?? message };
  };
  const parsed = rows.map((row) => ({ id: row.id, frequencyHz: readNumber(row.frequencyHz), lowerDb: readNumber(row.lowerDb), upperDb: readNumber(row.upperDb) }));

  let previousHz: number | null = null;
  for (const row of parsed) {
    for (const cell of ['frequencyHz', 'lowerDb', 'upperDb'] as const) {
      if (typeof row[cell] === 'string') mark(row.id, cell, row[cell] as string);
    }
    if (typeof row.frequencyHz === 'number') {
      const [low, high] = MASK_FREQUENCY_RANGE_HZ;
      if (row.frequencyHz < low || row.frequencyHz > high) mark(row.id, 'frequencyHz', `Use ${low} Hz to ${high / 1000} kHz.`);
      else if (previousHz !== null && row.frequencyHz <= previousHz) mark(row.id, 'frequencyHz', `Must be above the row before (${formatHz(previousHz)}).`);
      previousHz = Math.max(previousHz ?? -Infinity, row.frequencyHz);
    }
    for (const cell of ['lowerDb', 'upperDb'] as const) {
      const value = row[cell];
      if (typeof value === 'number' && Math.abs(value) > MASK_LEVEL_LIMIT_DB) mark(row.id, cell, `Use −${MASK_LEVEL_LIMIT_DB} to ${MASK_LEVEL_LIMIT_DB} dB.`);
    }
    if (typeof row.lowerDb === 'number' && typeof row.upperDb === 'number' && row.lowerDb >= row.upperDb) mark(row.id, 'upperDb', 'Must be above the lower limit.');
  }

  const formError =
    rows.length < MIN_MASK_POINTS
      ? `Give at least ${MIN_MASK_POINTS} points.`
      : rows.length > MAX_MASK_POINTS
        ? `Use at most ${MAX_MASK_POINTS} points here; derive larger masks from golden units.`
        : null;
  if (formError || Object.keys(cellErrors).length > 0) return { ok: false, cellErrors, formError };
  return {
    ok: true,
    upper: parsed.map((row) => ({ frequencyHz: row.frequencyHz as number, levelDb: row.upperDb as number })),
    lower: parsed.map((row) => ({ frequencyHz: row.frequencyHz as number, levelDb: row.lowerDb as number })),
  };
}

let nextRowNumber = 1;
export const newRowId = () => `row-${nextRowNumber++}`;

export const rowsFromPoints = (upper: readonly MaskPoint[] | null, lower: readonly MaskPoint[] | null): MaskRow[] => {
  const lowerAt = new Map((lower ?? []).map((point) => [point.frequencyHz, point.levelDb]));
  return (upper ?? []).map((point) => ({
    id: newRowId(),
    frequencyHz: String(point.frequencyHz),
    upperDb: String(point.levelDb),
    lowerDb: lowerAt.has(point.frequencyHz) ? String(lowerAt.get(point.frequencyHz)) : '',
  }));
};

/** Where a new row starts: empty. */
export const emptyRow = (): MaskRow => ({ id: newRowId(), frequencyHz: '', lowerDb: '', upperDb: '' });

/** A ±3 dB band from 100 Hz to 10 kHz: a starting point people edit rather than a blank table. */
export const starterRows = (): MaskRow[] =>
  [100, 1000, 10_000].map((frequencyHz) => ({ id: newRowId(), frequencyHz: String(frequencyHz), lowerDb: '-3', upperDb: '3' }));
