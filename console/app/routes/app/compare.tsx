import { useMemo } from 'react';
import { Link, useSearchParams } from 'react-router';
import { enableChartTiming, latestChartMarks } from '@console/components/charts/chart-timing';
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

/** One chart built by the overlay benchmark page: ms spent in each phase up to its first draw. */
export interface OverlayDrawTiming {
  /** Building the uPlot options, creating the chart and its first draw. */
  chartMs: number;
  /** From the start of the data preparation (normalisation) to the end of the first draw: what a person waits. */
  totalMs: number;
  /** Normalisation, series config and the React render and commit, up to the chart effect. */
  prepareAndRenderMs: number;
  /** Waiting for the chart fonts (and their one-time canvas set-up). */
  fontsMs: number;
}

declare global {
  interface Window {
    /** Set by the overlay benchmark page, one entry per chart built. */
    __sweeplineOverlayDraws?: OverlayDrawTiming[];
  }
}

function parseIds(value: string | null): string[] {
  return [...new Set((value ?? '').split(',').map((id) => id.trim()).filter(Boolean))].slice(0, MAX_OVERLAY_CURVES);
}

/** `?bench=overlay`: 10 synthetic curves × 2 000 points, timed for `npm run bench:console`. */
function BenchOverlay() {
  const curves = useMemo(() => {
    enableChartTiming();
    return syntheticCurves(10, 2000);
  }, []);
  return (
    <Panel title="Overlay benchmark" description="Synthetic curves; nothing is fetched.">
      <CompareView
        curves={curves}
        levelLabel="Level (dB, synthetic)"
        onFirstDraw={(chartMs) => {
          const marks = latestChartMarks();
          const since = (from: number | null, to: number | null) => (from !== null && to !== null ? to - from : Number.NaN);
          const timing: OverlayDrawTiming = {
            chartMs,
            totalMs: since(marks.prepare, marks.drawn),
            prepareAndRenderMs: since(marks.prepare, marks.effect),
            fontsMs: since(marks.effect, marks.fonts),
          };
          window.__sweeplineOverlayDraws = [...(window.__sweeplineOverlayDraws ?? []), timing];
          document.body.dataset.benchOverlayDraws = String(window.__sweeplineOverlayDraws.length);
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
