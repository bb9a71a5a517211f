import { ChartLegend } from '@console/components/charts/chart-legend';
import { chartFills } from '@console/components/charts/chart-palette';
import { LogFrequencyChart } from '@console/components/charts/log-frequency-chart';
import { formatFrequency } from '@console/components/charts/format-units';
import { maskBandSpec } from '../utils/mask-chart';

type MaskBandChartProps = { lines: Parameters<typeof maskBandSpec>[0]; heightPx?: number; name: string };

/** A mask's band on the console's log-frequency chart, with its legend. */
export function MaskBandChart({ lines, heightPx = 280, name }: MaskBandChartProps) {
  const spec = maskBandSpec(lines);
  const points = lines.upper ?? lines.lower ?? [];
  const summary =
    points.length > 0
      ? `Tolerance band of ${name}: ${points.length} points from ${formatFrequency(points[0].frequencyHz)} to ${formatFrequency(points[points.length - 1].frequencyHz)}.`
      : `Tolerance band of ${name}: no limit lines.`;
  const legend = [
    ...spec.series.map((series) => ({ id: series.id, label: series.label, colour: series.colour, dash: series.dash, markers: series.markers })),
    { id: 'mask-band', label: 'Inside the mask', colour: chartFills.maskBand, fill: true },
  ];
  return <LogFrequencyChart spec={spec} summary={summary} heightPx={heightPx} footer={<ChartLegend items={legend} />} />;
}
