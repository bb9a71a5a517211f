import { Link } from 'react-router';
import { ChartLegend } from '@console/components/charts/chart-legend';
import { okabeIto } from '@console/components/charts/chart-palette';
import type { ChartSpec } from '@console/components/charts/chart-spec';
import { formatDb } from '@console/components/charts/format-units';
import { LogFrequencyChart } from '@console/components/charts/log-frequency-chart';
import { Panel } from '@console/components/ui/panel';
import { LoadingState } from '@console/components/ui/states';
import { paths } from '@console/config/paths';
import type { Analysis } from '@shared/schemas/analyses';
import { useAnalysis } from '../api/get-analysis';
import { conventionLines, levelAxisLabel } from '../utils/conventions-words';
import { AUDIO_RANGE_HZ } from '../utils/response-plots';
import { resultOf, responseView } from '../utils/result-view';
import { StatusBadge } from './status-badge';

function smoothingOf(analysis: Analysis): string {
  const result = resultOf(analysis);
  const text = conventionLines(result?.conventions).find((line) => line.key === 'smoothing')?.text;
  // The stated smoothing opens with its width ("1/24 octave, power …"); the rest is in the conventions block.
  return text ? text.split(/[,;(]/)[0].trim() : '—';
}

/** This analysis next to the one it was compared with (after a re-run): both responses on one plot, and what differs. */
export function BesideComparison({ analysis, besideId }: { analysis: Analysis; besideId: string }) {
  const other = useAnalysis(besideId);
  if (other.isPending) return <LoadingState label="Loading the other analysis…" />;
  if (!other.data) return null;
  const pair = [
    { analysis: other.data, label: `${besideId === analysis.rerunOf ? 'Original' : 'Other'} · ${other.data.id}`, colour: okabeIto.blue, dash: undefined },
    { analysis, label: `This one · ${analysis.id}`, colour: okabeIto.vermillion, dash: [6, 3] },
  ];
  const views = pair.map((entry) => {
    const result = resultOf(entry.analysis);
    return { ...entry, view: result ? responseView(result) : null, reference: result?.conventions.magnitudeReference };
  });
  const drawable = views.filter((entry) => entry.view !== null);
  const spec: ChartSpec = {
    xAxis: 'log-frequency',
    xLabel: 'Frequency (Hz)',
    xRange: AUDIO_RANGE_HZ,
    yLabel: levelAxisLabel(views[1].reference ?? views[0].reference),
    series: drawable.map((entry) => ({ id: entry.analysis.id, label: entry.label, x: entry.view!.frequencyHz, y: entry.view!.magnitudeDb, colour: entry.colour, dash: entry.dash })),
    formatY: (v) => formatDb(v, { decimals: 2 }),
  };
  return (
    <Panel
      id="beside-original"
      title="Beside the original"
      description="Both runs of the same capture; the plot fills in when the new run has finished."
      actions={
        <Link to={paths.app.compare.getHref([besideId, analysis.id])} className="text-sm font-semibold text-ink-700 underline">
          Open in Compare
        </Link>
      }
    >
      <div className="mb-4 grid gap-3 md:grid-cols-2">
        {pair.map((entry) => (
          <div key={entry.analysis.id} className="flex items-start justify-between gap-3 rounded-md border border-ink-100 px-3 py-2">
            <div className="min-w-0 text-sm">
              <Link to={paths.app.analysis.getHref(entry.analysis.id)} className="font-mono text-xs font-semibold underline">
                {entry.label}
              </Link>
              <p className="text-xs text-ink-600">Smoothing: {smoothingOf(entry.analysis)}</p>
            </div>
            <StatusBadge status={entry.analysis.status} progress={entry.analysis.progress} />
          </div>
        ))}
      </div>
      {drawable.length > 0 && (
        <LogFrequencyChart spec={spec} summary="The two runs' frequency responses on one plot." heightPx={280} footer={<ChartLegend items={spec.series.map((s) => ({ id: s.id, label: s.label, colour: s.colour, dash: s.dash }))} />} />
      )}
    </Panel>
  );
}
