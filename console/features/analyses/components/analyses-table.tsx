import { useMemo, useState } from 'react';
import { flexRender, getCoreRowModel, getSortedRowModel, useReactTable, type OnChangeFn, type RowSelectionState, type SortingState } from '@tanstack/react-table';
import { Button } from '@console/components/ui/button';
import { EmptyState, ErrorState, LoadingState } from '@console/components/ui/states';
import { Table, Td, Th } from '@console/components/ui/table';
import { cn } from '@console/utils/cn';
import { useAnalyses, type AnalysisSummary } from '../api/get-analyses';
import { hasFilters, type AnalysisFilters } from '../utils/filters';
import { analysisColumns } from './analysis-columns';

type AnalysesTableProps = {
  filters: AnalysisFilters;
  selection: RowSelectionState;
  onSelectionChange: OnChangeFn<RowSelectionState>;
};

const sortMark = { asc: '▲', desc: '▼' } as const;
const NO_ROWS: AnalysisSummary[] = [];

/**
 * The job history. Pages come from the API newest first (cursor pagination, "Load more"); the column headers
 * sort the rows loaded so far in the browser — the API has no sort parameter.
 */
export function AnalysesTable({ filters, selection, onSelectionChange }: AnalysesTableProps) {
  const analyses = useAnalyses(filters);
  const [sorting, setSorting] = useState<SortingState>([{ id: 'createdAt', desc: true }]);
  // The table re-derives its rows whenever `data` changes identity, so it gets one array per fetched result.
  const rows = useMemo(() => analyses.data?.pages.flatMap((page) => page.data) ?? NO_ROWS, [analyses.data]);
  const table = useReactTable({
    data: rows,
    columns: analysisColumns,
    state: { sorting, rowSelection: selection },
    getRowId: (row) => row.id,
    autoResetAll: false,
    onSortingChange: setSorting,
    onRowSelectionChange: onSelectionChange,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
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
      <Table caption="Analyses, newest first">
        <thead>
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id}>
              {group.headers.map((header) => {
                const sorted = header.column.getIsSorted();
                return (
                  <Th key={header.id} aria-sort={sorted ? (sorted === 'asc' ? 'ascending' : 'descending') : undefined}>
                    {header.column.getCanSort() ? (
                      <button type="button" className="inline-flex items-center gap-1 uppercase hover:text-ink-900" onClick={header.column.getToggleSortingHandler()}>
                        {flexRender(header.column.columnDef.header, header.getContext())}
                        <span aria-hidden="true" className={cn('text-[0.6rem]', !sorted && 'opacity-0')}>
                          {sortMark[sorted || 'desc']}
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
