import { useMemo, useState } from 'react';
import { ChartLegend } from '@console/components/charts/chart-legend';
import { overlayStyle } from '@console/components/charts/chart-palette';
import type { ChartSpec } from '@console/components/charts/chart-spec';
import { markChart } from '@console/components/charts/chart-timing';
import { formatDb } from '@console/components/charts/format-units';
import { LogFrequencyChart } from '@console/components/charts/log-frequency-chart';
import { Alert } from '@console/components/ui/alert';
import { differenceToReference, prepareOverlay, type NormalisationChoice, type OverlayCurve } from '../utils/overlay';
import { CompareControls, type CompareMode } from './compare-controls';

type CompareViewProps = {
  curves: OverlayCurve[];
  /** The level axis label of the curves (their stated dB reference). */
  levelLabel: string;
  onFirstDraw?: (durationMs: number) => void;
};

const AUDIO_RANGE_HZ: [number, number] = [20, 20_000];

/** Responses on one set of axes, with per-curve visibility, a normalisation choice and a difference view. */
export function CompareView({ curves, levelLabel, onFirstDraw }: CompareViewProps) {
  const [normalisation, setNormalisation] = useState<NormalisationChoice>('none');
  const [mode, setMode] = useState<CompareMode>('overlay');
  const [referenceId, setReferenceId] = useState(curves[0]?.id ?? '');
  const [hidden, setHidden] = useState<Set<string>>(new Set());

  const prepared = useMemo(() => {
    markChart('prepare');
    return prepareOverlay(curves, normalisation);
  }, [curves, normalisation]);
  const styles = useMemo(() => new Map(curves.map((curve, i) => [curve.id, overlayStyle(i)])), [curves]);

  const spec = useMemo<ChartSpec>(() => {
    const base = { xAxis: 'log-frequency' as const, xLabel: 'Frequency (Hz)', xRange: AUDIO_RANGE_HZ };
    const difference = mode === 'difference' ? differenceToReference(prepared.curves, referenceId) : null;
    if (difference) {
      return {
        ...base,
        yLabel: 'Difference to the reference (dB)',
        minimumYSpan: 6,
        series: difference.differences.map((d) => ({ id: d.id, label: d.label, x: difference.gridHz, y: d.differenceDb, ...styles.get(d.id)!, visible: !hidden.has(d.id), width: d.id === referenceId ? 1 : 1.5 })),
        formatY: (v) => formatDb(v, { decimals: 2, signed: true }),
      };
    }
    return {
      ...base,
      yLabel: normalisation === 'none' ? levelLabel : 'Level (dB re the curve’s reference level)',
      series: prepared.curves.map((curve) => ({ id: curve.id, label: curve.label, x: curve.frequencyHz, y: curve.magnitudeDb, ...styles.get(curve.id)!, visible: !hidden.has(curve.id) })),
      formatY: (v) => formatDb(v, { decimals: 2 }),
    };
  }, [mode, prepared, referenceId, styles, hidden, normalisation, levelLabel]);

  const toggle = (id: string, visible: boolean) =>
    setHidden((current) => {
      const next = new Set(current);
      if (visible) next.delete(id);
      else next.add(id);
      return next;
    });

  return (
    <div className="space-y-4">
      <CompareControls
        normalisation={normalisation}
        onNormalisation={setNormalisation}
        mode={mode}
        onMode={setMode}
        referenceId={referenceId}
        onReference={setReferenceId}
        curves={prepared.curves}
      />
      {prepared.problems.length > 0 && (
        <Alert tone="warning" title="Left out of the plot">
          <ul>
            {prepared.problems.map((problem) => (
              <li key={problem.id}>
                {problem.label}: {problem.reason}
              </li>
            ))}
          </ul>
        </Alert>
      )}
      {mode === 'difference' && spec.series.length === 0 && <Alert tone="info" title="The curves share no frequency span to compare on." />}
      <LogFrequencyChart
        spec={spec}
        summary={`${spec.series.length} responses ${mode === 'difference' ? 'as differences to the reference' : 'overlaid'} from 20 Hz to 20 kHz.`}
        heightPx={380}
        onFirstDraw={onFirstDraw}
        footer={
          <ChartLegend
            items={spec.series.map((series) => ({ id: series.id, label: series.id === referenceId && mode === 'difference' ? `${series.label} (reference)` : series.label, colour: series.colour, dash: series.dash, visible: series.visible }))}
            onToggle={toggle}
          />
        }
      />
    </div>
  );
}
