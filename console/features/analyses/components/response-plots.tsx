import { chartFills } from '@console/components/charts/chart-palette';
import { formatFrequency, formatMilliseconds } from '@console/components/charts/format-units';
import type { Analysis } from '@shared/schemas/analyses';
import { useMaskVersion } from '../api/get-mask-version';
import { groupDelaySpec, impulseSpec, phaseSpec, responseSpec } from '../utils/response-plots';
import { impulseView, maskFigure, responseView, type ResultEnvelope } from '../utils/result-view';
import { PlotPanel } from './plot-panel';

function maskReferenceOf(analysis: Analysis, result: ResultEnvelope) {
  const figure = maskFigure(result);
  const maskId = figure?.id ?? analysis.request.mask?.maskId;
  const version = figure?.version ?? analysis.request.mask?.version;
  return maskId && version ? { maskId, version } : null;
}

/** Response magnitude (with the mask), phase, group delay and the impulse response — each only when the result has it. */
export function ResponsePlots({ analysis, result }: { analysis: Analysis; result: ResultEnvelope }) {
  const view = responseView(result);
  const mask = maskFigure(result);
  const maskLines = useMaskVersion(view ? maskReferenceOf(analysis, result) : null);
  const impulse = impulseView(result);
  if (!view && !impulse) return null;

  const failing = mask ? [...(mask.upper?.failingRegionsHz ?? []), ...(mask.lower?.failingRegionsHz ?? [])] : [];
  const phase = view && phaseSpec(view);
  const groupDelay = view && groupDelaySpec(view);
  return (
    <>
      {view && (
        <PlotPanel
          id="response-plot"
          title="Frequency response"
          description={
            mask
              ? failing.length > 0
                ? `Outside the mask in ${failing.map(([from, to]) => `${formatFrequency(from)}–${formatFrequency(to)}`).join(', ')}.`
                : mask.verdict === 'pass'
                  ? 'Inside the mask everywhere it was checked.'
                  : 'The curve does not cover the whole mask.'
              : undefined
          }
          spec={responseSpec(view, result.conventions.magnitudeReference, mask, maskLines.data ?? null)}
          summary={`Frequency response of ${view.frequencyHz.length} points from ${formatFrequency(view.frequencyHz[0])} to ${formatFrequency(view.frequencyHz[view.frequencyHz.length - 1])}${mask ? `, mask verdict ${mask.verdict}` : ''}.`}
          legendExtra={maskLines.data ? [{ id: 'mask-band', label: 'Inside the mask', colour: chartFills.maskBand, fill: true }] : []}
          heightPx={340}
        />
      )}
      {mask && maskLines.isError && <p className="text-xs text-ink-600">The mask’s limit lines could not be loaded; the failing spans are still marked.</p>}
      {(phase || groupDelay) && (
        <div className="grid gap-6">
          {phase && <PlotPanel title="Phase" description="Bulk delay removed." spec={phase} summary="Phase against frequency, bulk delay removed." heightPx={240} />}
          {groupDelay && <PlotPanel title="Group delay" description="Bulk delay included." spec={groupDelay} summary="Group delay against frequency." heightPx={240} />}
        </div>
      )}
      {impulse && (
        <PlotPanel
          title="Impulse response"
          description={
            impulse.gateMs
              ? `${impulse.gated ? 'Gate' : 'Analysis window (no gate)'} from ${formatMilliseconds(impulse.gateMs[0])} to ${formatMilliseconds(impulse.gateMs[1])}; the plot shows the part around the peak.`
              : undefined
          }
          spec={impulseSpec(impulse)}
          summary="Impulse response against time, scaled to its peak, with the time window drawn."
          heightPx={240}
        />
      )}
    </>
  );
}
