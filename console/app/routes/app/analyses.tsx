import { useMemo, useState } from 'react';
import type { QueryClient } from '@tanstack/react-query';
import type { RowSelectionState } from '@tanstack/react-table';
import { Link, useSearchParams, type LoaderFunctionArgs } from 'react-router';
import { buttonClasses } from '@console/components/ui/button';
import { PageHeader } from '@console/components/ui/page-header';
import { Panel } from '@console/components/ui/panel';
import { paths } from '@console/config/paths';
import { getAnalysesQueryOptions } from '@console/features/analyses/api/get-analyses';
import { AnalysesFilters } from '@console/features/analyses/components/analyses-filters';
import { AnalysesTable } from '@console/features/analyses/components/analyses-table';
import { BulkExportBar } from '@console/features/analyses/components/bulk-export-bar';
import { filtersFromSearchParams, withFilters, type AnalysisFilters } from '@console/features/analyses/utils/filters';
import { sortFromSearchParams, withSort } from '@console/features/analyses/utils/sort';
import type { AnalysisSort } from '@shared/schemas/analyses';
import { MAX_OVERLAY_CURVES } from '@console/features/compare/utils/overlay';

const MAX_COMPARED = MAX_OVERLAY_CURVES;

export const clientLoader =
  (queryClient: QueryClient) =>
  ({ request }: LoaderFunctionArgs) => {
    const params = new URL(request.url).searchParams;
    void queryClient.prefetchInfiniteQuery(getAnalysesQueryOptions(filtersFromSearchParams(params), sortFromSearchParams(params)));
    return null;
  };

export default function AnalysesRoute() {
  const [searchParams, setSearchParams] = useSearchParams();
  const filters = useMemo(() => filtersFromSearchParams(searchParams), [searchParams]);
  const sort = sortFromSearchParams(searchParams);
  const [selection, setSelection] = useState<RowSelectionState>({});
  const selectedIds = Object.keys(selection).filter((id) => selection[id]);

  const applyFilters = (next: AnalysisFilters) => {
    setSelection({});
    setSearchParams(withFilters(searchParams, next));
  };

  const applySort = (next: AnalysisSort) => {
    setSelection({});
    setSearchParams(withSort(searchParams, next));
  };

  return (
    <>
      <PageHeader
        eyebrow="Workspace"
        title="Analyses"
        description="Every analysis the organisation's rigs and scripts ran, newest first unless a column header sorts it otherwise. Running jobs update here by themselves."
      />
      <Panel flush>
        <AnalysesFilters filters={filters} onChange={applyFilters} />
        <BulkExportBar selectedIds={selectedIds} onClear={() => setSelection({})}>
          {selectedIds.length >= 1 && selectedIds.length <= MAX_COMPARED ? (
            <Link to={paths.app.compare.getHref(selectedIds)} className={buttonClasses('primary', 'sm')}>
              Compare {selectedIds.length}
            </Link>
          ) : (
            <span className="text-xs text-ink-600">Select at most {MAX_COMPARED} to compare.</span>
          )}
        </BulkExportBar>
        <div className="border-t border-ink-100">
          <AnalysesTable filters={filters} sort={sort} onSortChange={applySort} selection={selection} onSelectionChange={setSelection} />
        </div>
      </Panel>
    </>
  );
}
