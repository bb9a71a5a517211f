import { useMemo } from 'react';
import { Link, useSearchParams } from 'react-router';
import { buttonClasses } from '@console/components/ui/button';
import { PageHeader } from '@console/components/ui/page-header';
import { Panel } from '@console/components/ui/panel';
import { EmptyState, ErrorState, LoadingState } from '@console/components/ui/states';
import { paths } from '@console/config/paths';
import { useAnalysesByIds } from '@console/features/analyses/api/get-analysis';
import { levelAxisLabel } from '@console/features/analyses/utils/conventions-words';
import { deviceName } from '@console/features/analyses/utils/labels';
import { resultOf, responseView } from '@console/features/analyses/utils/result-view';
import { CompareView } from '@console/features/compare/components/compare-view';
import { MAX_OVERLAY_CURVES, type OverlayCurve } from '@console/features/compare/utils/overlay';
import { syntheticCurves } from '@console/features/compare/utils/synthetic-curves';

declare global {
  interface Window {
    /** Set by the overlay benchmark page: ms from creating the chart to its first draw, one entry per chart built. */
    __sweeplineOverlayDrawsMs?: number[];
  }
}

function parseIds(value: string | null): string[] {
  return [...new Set((value ?? '').split(',').map((id) => id.trim()).filter(Boolean))].slice(0, MAX_OVERLAY_CURVES);
}

/** `?bench=overlay`: 10 synthetic curves × 2 000 points, timed for `npm run bench:console`. */
function BenchOverlay() {
  const curves = useMemo(() => syntheticCurves(10, 2000), []);
  return (
    <Panel title="Overlay benchmark" description="Synthetic curves; nothing is fetched.">
      <CompareView
        curves={curves}
        levelLabel="Level (dB, synthetic)"
        onFirstDraw={(ms) => {
          window.__sweeplineOverlayDrawsMs = [...(window.__sweeplineOverlayDrawsMs ?? []), ms];
          document.body.dataset.benchOverlayDraws = String(window.__sweeplineOverlayDrawsMs.length);
        }}
      />
    </Panel>
  );
}

function AnalysesOverlay({ ids }: { ids: string[] }) {
  const queries = useAnalysesByIds(ids);
  const pending = queries.some((query) => query.isPending);
  const failed = queries.find((query) => query.isError);
  const loaded = queries.flatMap((query) => (query.data ? [query.data] : []));
  const curves = useMemo<OverlayCurve[]>(
    () =>
      loaded.flatMap((analysis) => {
        const result = resultOf(analysis);
        const view = result ? responseView(result) : null;
        return view ? [{ id: analysis.id, label: deviceName(analysis.dut, analysis.id), frequencyHz: view.frequencyHz, magnitudeDb: view.magnitudeDb }] : [];
      }),
    // The loaded analyses change identity on every poll; their ids and update times say when the curves do.
    [loaded.map((analysis) => `${analysis.id}@${analysis.updatedAt}`).join(',')],
  );
  if (pending) return <LoadingState label={`Loading ${ids.length} analyses…`} />;
  if (failed) return <ErrorState error={failed.error} onRetry={() => failed.refetch()} />;
  const withoutCurve = loaded.filter((analysis) => !curves.some((curve) => curve.id === analysis.id));
  const references = new Set(loaded.map((analysis) => resultOf(analysis)?.conventions.magnitudeReference).filter(Boolean));
  return (
    <div className="space-y-4">
      {withoutCurve.length > 0 && (
        <p className="text-sm text-ink-600">
          Without a response curve (not finished, or a kind without one): {withoutCurve.map((analysis) => analysis.id).join(', ')}.
        </p>
      )}
      {references.size > 1 && (
        <p className="text-sm font-semibold text-signal-800">These curves state different dB references; normalise them before reading differences.</p>
      )}
      {curves.length > 0 ? (
        <CompareView curves={curves} levelLabel={levelAxisLabel(references.size === 1 ? [...references][0] : undefined)} />
      ) : (
        <EmptyState title="Nothing to draw yet">The chosen analyses have no finished response curve.</EmptyState>
      )}
    </div>
  );
}

export default function CompareRoute() {
  const [searchParams] = useSearchParams();
  const ids = parseIds(searchParams.get('ids'));
  const bench = searchParams.get('bench') === 'overlay';
  return (
    <>
      <PageHeader
        eyebrow="Workspace"
        title="Compare"
        description={`Up to ${MAX_OVERLAY_CURVES} frequency responses on the same axes — a lot of units, or before and after a design change.`}
        actions={
          <Link to={paths.app.analyses.getHref()} className={buttonClasses('secondary', 'sm')}>
            Choose analyses
          </Link>
        }
      />
      {bench ? (
        <BenchOverlay />
      ) : ids.length === 0 ? (
        <Panel>
          <EmptyState title="No analyses chosen">Select up to {MAX_OVERLAY_CURVES} rows in Analyses and press Compare.</EmptyState>
        </Panel>
      ) : (
        <Panel>
          <AnalysesOverlay ids={ids} />
        </Panel>
      )}
    </>
  );
}
