import { ANALYSIS_SORTS, type AnalysisSort } from '@shared/schemas/analyses';

export const DEFAULT_ANALYSIS_SORT: AnalysisSort = '-createdAt';

/** The API field a sortable column of the history sorts by (the server sorts; the table only shows the order). */
export const SORT_FIELD_OF_COLUMN = {
  device: 'model',
  verdict: 'verdict',
  worstMarginDb: 'worstMarginDb',
  createdAt: 'createdAt',
} as const;
export type SortableColumnId = keyof typeof SORT_FIELD_OF_COLUMN;
type SortField = (typeof SORT_FIELD_OF_COLUMN)[SortableColumnId];

/** The direction a column takes on its first click: newest first for time, ascending (worst margin, fail first) otherwise. */
const FIRST_DIRECTION: Record<SortField, 'asc' | 'desc'> = { model: 'asc', verdict: 'asc', worstMarginDb: 'asc', createdAt: 'desc' };

export const isSortableColumn = (columnId: string): columnId is SortableColumnId => Object.hasOwn(SORT_FIELD_OF_COLUMN, columnId);

/** Reads `sort` from the URL; a value the API would refuse falls back to the default (an edited URL never breaks the page). */
export function sortFromSearchParams(params: URLSearchParams): AnalysisSort {
  const value = params.get('sort');
  return value !== null && (ANALYSIS_SORTS as readonly string[]).includes(value) ? (value as AnalysisSort) : DEFAULT_ANALYSIS_SORT;
}

/** Writes `sort` into the search params (left out when it is the default), keeping every other parameter. */
export function withSort(params: URLSearchParams, sort: AnalysisSort): URLSearchParams {
  const next = new URLSearchParams(params);
  if (sort === DEFAULT_ANALYSIS_SORT) next.delete('sort');
  else next.set('sort', sort);
  return next;
}

export function parseSort(sort: AnalysisSort): { field: SortField | string; direction: 'asc' | 'desc' } {
  return sort.startsWith('-') ? { field: sort.slice(1), direction: 'desc' } : { field: sort, direction: 'asc' };
}

/** The column showing the current sort and its direction, for TanStack Table's sorting state; none for sorts no column shows. */
export function sortedColumnOf(sort: AnalysisSort): { id: SortableColumnId; desc: boolean } | null {
  const { field, direction } = parseSort(sort);
  const id = (Object.keys(SORT_FIELD_OF_COLUMN) as SortableColumnId[]).find((column) => SORT_FIELD_OF_COLUMN[column] === field);
  return id ? { id, desc: direction === 'desc' } : null;
}

/** Clicking a header: the column's first direction when it is not the sorted one, else the other direction. */
export function sortAfterClick(current: AnalysisSort, columnId: SortableColumnId): AnalysisSort {
  const field = SORT_FIELD_OF_COLUMN[columnId];
  const { field: currentField, direction } = parseSort(current);
  const nextDirection = currentField === field ? (direction === 'asc' ? 'desc' : 'asc') : FIRST_DIRECTION[field];
  return (nextDirection === 'desc' ? `-${field}` : field) as AnalysisSort;
}

/** WAI-ARIA `aria-sort` of a header: set on the sorted column only. */
export function ariaSortOf(sort: AnalysisSort, columnId: string): 'ascending' | 'descending' | undefined {
  const sorted = sortedColumnOf(sort);
  if (!sorted || sorted.id !== columnId) return undefined;
  return sorted.desc ? 'descending' : 'ascending';
}

const FIELD_WORDS: Record<string, string> = { createdAt: 'time created', model: 'model', serial: 'serial number', verdict: 'verdict', worstMarginDb: 'worst margin' };

/** The order in words, for the table caption ("Analyses by verdict, ascending"). */
export function describeSort(sort: AnalysisSort): string {
  const { field, direction } = parseSort(sort);
  if (sort === DEFAULT_ANALYSIS_SORT) return 'newest first';
  if (field === 'createdAt') return 'oldest first';
  return `by ${FIELD_WORDS[field] ?? field}, ${direction === 'asc' ? 'ascending' : 'descending'}`;
}
