import { useMemo } from 'react';
import { flexRender, getCoreRowModel, useReactTable, type OnChangeFn, type RowSelectionState, type SortingState } from '@tanstack/react-table';
import type { AnalysisSort } from '@shared/schemas/analyses';
import { Button } from '@console/components/ui/button';
import { EmptyState, ErrorState, LoadingState } from '@console/components/ui/states';
import { Table, Td, Th } from '@console/components/ui/table';
import { cn } from '@console/utils/cn';
import { useAnalyses, type AnalysisSummary } from '../api/get-analyses';
import { hasFilters, type AnalysisFilters } from '../utils/filters';
import { ariaSortOf, describeSort, isSortableColumn, sortAfterClick, sortedColumnOf } from '../utils/sort';
import { analysisColumns } from './analysis-columns';

type AnalysesTableProps = {
  filters: AnalysisFilters;
  /** The server-side order (the page's `sort` URL parameter). */
  sort: AnalysisSort;
  onSortChange: (sort: AnalysisSort) => void;
  selection: RowSelectionState;
  onSelectionChange: OnChangeFn<RowSelectionState>;
};

const sortMark = { asc: '▲', desc: '▼' } as const;
const NO_ROWS: AnalysisSummary[] = [];

/**
 * The job history. The server sorts (GET /v1/analyses?sort=…) and pages with a cursor ("Load more" continues in
 * the same order); a header button sets the URL's `sort`, so every page loaded is in one order across the whole
 * history, not just the rows in the browser.
 */
export function AnalysesTable({ filters, sort, onSortChange, selection, onSelectionChange }: AnalysesTableProps) {
  const analyses = useAnalyses(filters, sort);
  const sorting = useMemo<SortingState>(() => {
    const sorted = sortedColumnOf(sort);
    return sorted ? [sorted] : [];
  }, [sort]);
  // The table re-derives its rows whenever `data` changes identity, so it gets one array per fetched result.
  const rows = useMemo(() => analyses.data?.pages.flatMap((page) => page.data) ?? NO_ROWS, [analyses.data]);
  const table = useReactTable({
    data: rows,
    columns: analysisColumns,
    state: { sorting, rowSelection: selection },
    getRowId: (row) => row.id,
    autoResetAll: false,
    manualSorting: true,
    enableMultiSort: false,
    onRowSelectionChange: onSelectionChange,
    getCoreRowModel: getCoreRowModel(),
  });

  if (analyses.isPending) return <LoadingState label="Loading analyses…" />;
  if (analyses.isError) return <ErrorState error={analyses.error} onRetry={() => analyses.refetch()} />;
  if (rows.length === 0) {
    return (
      <EmptyState title={hasFilters(filters) ? 'No analysis matches these filters' : 'No analyses yet'}>
        {hasFilters(filters)
          ? 'Widen the time range or clear a filter.'
          : 'Analyses appear here as soon as a rig posts a capture to POST /v1/analyses.'}
      </EmptyState>
    );
  }

  return (
    <>
      <Table caption={`Analyses, ${describeSort(sort)}`}>
        <thead>
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id}>
              {group.headers.map((header) => {
                const columnId = header.column.id;
                const sortable = header.column.getCanSort() && isSortableColumn(columnId);
                const ariaSort = ariaSortOf(sort, columnId);
                return (
                  <Th key={header.id} aria-sort={ariaSort}>
                    {sortable ? (
                      <button
                        type="button"
                        className="inline-flex items-center gap-1 uppercase hover:text-ink-900 focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-signal-600"
                        onClick={() => onSortChange(sortAfterClick(sort, columnId))}
                      >
                        {flexRender(header.column.columnDef.header, header.getContext())}
                        <span aria-hidden="true" className={cn('text-[0.6rem]', !ariaSort && 'opacity-0')}>
                          {sortMark[ariaSort === 'ascending' ? 'asc' : 'desc']}
                        </span>
                      </button>
                    ) : (
                      flexRender(header.column.columnDef.header, header.getContext())
                    )}
                  </Th>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody>
          {table.getRowModel().rows.map((row) => (
            <tr key={row.id} className={row.getIsSelected() ? 'bg-signal-50/60' : 'hover:bg-ink-50/60'}>
              {row.getVisibleCells().map((cell) => (
                <Td key={cell.id}>{flexRender(cell.column.columnDef.cell, cell.getContext())}</Td>
              ))}
            </tr>
          ))}
        </tbody>
      </Table>
      <div className="flex items-center justify-between gap-3 border-t border-ink-100 px-5 py-3 text-xs text-ink-600">
        <span className="tabular">
          {rows.length} loaded{analyses.hasNextPage ? ', more on the server' : ''}
          {analyses.isRefetching && !analyses.isFetchingNextPage ? ' · updating…' : ''}
        </span>
        {analyses.hasNextPage && (
          <Button variant="secondary" size="sm" isPending={analyses.isFetchingNextPage} onClick={() => analyses.fetchNextPage()}>
            Load more
          </Button>
        )}
      </div>
    </>
  );
}
