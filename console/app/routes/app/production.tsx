import { useMemo } from 'react';
import type { QueryClient } from '@tanstack/react-query';
import { Link, useSearchParams, type LoaderFunctionArgs } from 'react-router';
import { okabeIto } from '@console/components/charts/chart-palette';
import { buttonClasses } from '@console/components/ui/button';
import { PageHeader } from '@console/components/ui/page-header';
import { Panel } from '@console/components/ui/panel';
import { EmptyState, ErrorState, LoadingState } from '@console/components/ui/states';
import { paths } from '@console/config/paths';
import { getProductionLotsQueryOptions, useProductionLots } from '@console/features/production/api/get-production-lots';
import { getProductionSummaryQueryOptions, useProductionSummary } from '@console/features/production/api/get-production-summary';
import { getProductionUnitsQueryOptions, useProductionUnits } from '@console/features/production/api/get-production-units';
import { DistributionPanel } from '@console/features/production/components/distribution-panel';
import { FailingUnitsTable } from '@console/features/production/components/failing-units-table';
import { ProductionFilterForm } from '@console/features/production/components/production-filter-form';
import { SummaryTiles } from '@console/features/production/components/summary-tiles';
import { TrendPanel } from '@console/features/production/components/trend-panel';
import { dailyTrend } from '@console/features/production/utils/daily-trend';
import {
  productionFilterFromSearchParams,
  toProductionQuery,
  withProductionFilter,
  type ProductionFilter,
  type ProductionQuery,
} from '@console/features/production/utils/production-filter';
import {
  sensitivityAxisLabel,
  sensitivityKindOf,
  sensitivityReader,
  sensitivityUnit,
  THD_AXIS_LABEL,
} from '@console/features/production/utils/sensitivity-kinds';

export const clientLoader =
  (queryClient: QueryClient) =>
  ({ request }: LoaderFunctionArgs) => {
    void queryClient.prefetchQuery(getProductionLotsQueryOptions());
    const query = toProductionQuery(productionFilterFromSearchParams(new URL(request.url).searchParams));
    if (query) {
      void queryClient.prefetchQuery(getProductionSummaryQueryOptions(query));
      void queryClient.prefetchQuery(getProductionUnitsQueryOptions(query));
    }
    return null;
  };

function ProductionReport({ query, filter }: { query: ProductionQuery; filter: ProductionFilter }) {
  const summary = useProductionSummary(query);
  const units = useProductionUnits(query);
  const kind = summary.data ? sensitivityKindOf(summary.data) : null;
  const unitList = units.data?.data;
  const days = useMemo(() => (unitList ? dailyTrend(unitList, sensitivityReader(kind)) : []), [unitList, kind]);

  if (summary.isPending || units.isPending) return <LoadingState label={`Reading the results of ${query.model}…`} />;
  if (summary.isError) return <ErrorState error={summary.error} onRetry={() => summary.refetch()} />;
  if (units.isError) return <ErrorState error={units.error} onRetry={() => units.refetch()} />;
  if (summary.data.counts.analyses === 0) {
    return (
      <Panel>
        <EmptyState title="No analyses in this selection">Widen the date range or choose another lot.</EmptyState>
      </Panel>
    );
  }
  const failing = units.data.data.filter((unit) => unit.verdict === 'fail');
  const historyHref = paths.app.analyses.getHref(
    new URLSearchParams({ model: query.model, verdict: 'fail', ...(query.lot ? { lot: query.lot } : {}), ...(filter.from ? { createdFrom: filter.from } : {}), ...(filter.to ? { createdTo: filter.to } : {}) }).toString(),
  );
  return (
    <div className="space-y-6">
      {units.data.truncated && (
        <p className="text-sm font-semibold text-signal-800">Only the newest units are drawn below; narrow the date range to see them all.</p>
      )}
      <Panel id="production-counts" title="Counts and yield" description={`${query.model}${query.lot ? ` · ${query.lot}` : ' · all lots'}`}>
        <SummaryTiles summary={summary.data} />
      </Panel>
      <div className="grid gap-6 xl:grid-cols-2">
        <DistributionPanel
          id="production-sensitivity"
          title="Sensitivity"
          axisLabel={kind ? sensitivityAxisLabel[kind] : 'Sensitivity'}
          unit={kind ? sensitivityUnit[kind] : ''}
          values={units.data.data.map(sensitivityReader(kind)).filter((value): value is number => value !== null)}
          distribution={kind ? summary.data.sensitivity[kind] : null}
          colour={okabeIto.blue}
          decimals={2}
        />
        <DistributionPanel
          id="production-thd"
          title="THD at 1 kHz"
          axisLabel={THD_AXIS_LABEL}
          unit="%"
          values={units.data.data.map((unit) => unit.thdFAtOneKilohertzPercent).filter((value): value is number => value !== null)}
          distribution={summary.data.thdFAtOneKilohertzPercent}
          colour={okabeIto.vermillion}
          decimals={3}
        />
      </div>
      <TrendPanel days={days} sensitivityUnit={kind ? sensitivityUnit[kind] : null} />
      <Panel
        id="failing-units"
        title="Failing units"
        description="Open a unit to see where its response leaves the mask."
        actions={
          failing.length > 0 ? (
            <Link to={historyHref} className={buttonClasses('secondary', 'sm')}>
              In the history
            </Link>
          ) : undefined
        }
        flush
      >
        <FailingUnitsTable units={failing} sensitivityKind={kind} />
      </Panel>
    </div>
  );
}

export default function ProductionRoute() {
  const [searchParams, setSearchParams] = useSearchParams();
  const filter = useMemo(() => productionFilterFromSearchParams(searchParams), [searchParams]);
  const query = useMemo(() => toProductionQuery(filter), [filter]);
  const lots = useProductionLots();

  return (
    <>
      <PageHeader
        eyebrow="Workspace"
        title="Production"
        description="Yield and unit-to-unit spread of a model and lot, read from the stored results of its analyses."
      />
      <div className="space-y-6">
        <Panel flush>
          {lots.isPending ? (
            <LoadingState label="Loading the measured models…" />
          ) : lots.isError ? (
            <ErrorState error={lots.error} onRetry={() => lots.refetch()} />
          ) : lots.data.data.length === 0 ? (
            <EmptyState title="No models measured yet">Analyses that name a DUT model (dut.model) appear here, grouped by lot.</EmptyState>
          ) : (
            <ProductionFilterForm lots={lots.data.data} filter={filter} onChange={(next) => setSearchParams(withProductionFilter(searchParams, next))} />
          )}
        </Panel>
        {query ? (
          <ProductionReport query={query} filter={filter} />
        ) : (
          lots.isSuccess &&
          lots.data.data.length > 0 && (
            <Panel>
              <EmptyState title="Choose a model">Pick a model, and optionally a lot and dates, to see its yield and spread.</EmptyState>
            </Panel>
          )
        )}
      </div>
    </>
  );
}
