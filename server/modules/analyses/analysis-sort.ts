import { and, asc, desc, eq, gt, isNotNull, isNull, lt, or, type SQL } from 'drizzle-orm';
import type { MySqlColumn } from 'drizzle-orm/mysql-core';
import type { AnalysisSort } from '@shared/schemas/analyses';
import type { AppDeps } from '@server/deps';
import { analyses } from '@server/db/tables';
import { decodeValuesCursor, encodeValuesCursor, invalidCursor, type CursorBinding } from '@server/http/pagination';

/** The sort key of a row: a timestamp, a label or a number; null where the row has none. */
export type SortKey = Date | string | number | null;

/** Where a page ended: the last row's sort key and id (the tiebreak). */
export interface SortPosition {
  key: SortKey;
  id: string;
}

export interface SortSpec {
  column: MySqlColumn;
  direction: 'asc' | 'desc';
  keyType: 'timestamp' | 'string' | 'number';
  /** Nullable keys put rows without a value last, in either direction (read as a second segment ordered by id). */
  nullable: boolean;
  keyOf(row: SortableRow): SortKey;
}

export interface SortableRow {
  id: string;
  createdAt: Date;
  dutModel: string | null;
  dutSerial: string | null;
  verdict: string | null;
  worstMarginDb: number | null;
}

const FIELDS = {
  createdAt: { column: analyses.createdAt, keyType: 'timestamp', nullable: false, keyOf: (row: SortableRow) => row.createdAt },
  model: { column: analyses.dutModel, keyType: 'string', nullable: true, keyOf: (row: SortableRow) => row.dutModel },
  serial: { column: analyses.dutSerial, keyType: 'string', nullable: true, keyOf: (row: SortableRow) => row.dutSerial },
  verdict: { column: analyses.verdict, keyType: 'string', nullable: true, keyOf: (row: SortableRow) => row.verdict },
  worstMarginDb: { column: analyses.worstMarginDb, keyType: 'number', nullable: true, keyOf: (row: SortableRow) => row.worstMarginDb },
} as const;

export function sortSpecOf(sort: AnalysisSort): SortSpec {
  const descending = sort.startsWith('-');
  const field = FIELDS[(descending ? sort.slice(1) : sort) as keyof typeof FIELDS];
  return { ...field, direction: descending ? 'desc' : 'asc' };
}

/** ORDER BY key, id in the sort's direction (an index on (organisation, key, id) serves it). */
export function orderOf(spec: SortSpec): SQL[] {
  const by = spec.direction === 'asc' ? asc : desc;
  return [by(spec.column), by(analyses.id)];
}

/** Rows with a key strictly after `position` in (key, id) order; pair with orderOf. */
export function afterPosition(spec: SortSpec, position: { key: Exclude<SortKey, null>; id: string }): SQL | undefined {
  const beyond = spec.direction === 'asc' ? gt : lt;
  return or(beyond(spec.column, position.key), and(eq(spec.column, position.key), beyond(analyses.id, position.id)));
}

/** Rows without a key after the id `afterId` (the null segment is ordered by id alone). */
export function nullSegmentAfter(spec: SortSpec, afterId: string | undefined): SQL | undefined {
  const beyond = spec.direction === 'asc' ? gt : lt;
  return and(isNull(spec.column), afterId === undefined ? undefined : beyond(analyses.id, afterId));
}

export const hasKey = (spec: SortSpec) => isNotNull(spec.column);

export function encodeSortCursor(deps: AppDeps, binding: CursorBinding, position: SortPosition): string {
  const key = position.key instanceof Date ? position.key.toISOString() : position.key;
  return encodeValuesCursor(deps, binding, [key, position.id]);
}

/** The position in a cursor of this sort; the binding holds the sort, so a cursor of another sort is a 400. */
export function decodeSortCursor(deps: AppDeps, binding: CursorBinding, spec: SortSpec, cursor: string | undefined): SortPosition | undefined {
  if (cursor === undefined) return undefined;
  const [key, id, ...rest] = decodeValuesCursor(deps, binding, cursor);
  if (typeof id !== 'string' || rest.length > 0) throw invalidCursor();
  if (key === null && spec.nullable) return { key: null, id };
  if (spec.keyType === 'number' && typeof key === 'number' && Number.isFinite(key)) return { key, id };
  if (spec.keyType === 'string' && typeof key === 'string') return { key, id };
  if (spec.keyType === 'timestamp' && typeof key === 'string') {
    const date = new Date(key);
    if (!Number.isNaN(date.getTime())) return { key: date, id };
  }
  throw invalidCursor();
}
