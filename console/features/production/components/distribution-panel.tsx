import { Panel } from '@console/components/ui/panel';
import { EmptyState } from '@console/components/ui/states';
import type { Distribution } from '@shared/schemas/production';
import { histogram } from '../utils/histogram';
import { BarChart } from './bar-chart';

type DistributionPanelProps = {
  id: string;
  title: string;
  /** Axis label with unit and reference. */
  axisLabel: string;
  unit: string;
  values: number[];
  distribution: Distribution | null;
  colour: string;
  decimals: number;
};

/** A histogram of one figure over the units, with the summary's mean, σ and percentiles above it. */
export function DistributionPanel({ id, title, axisLabel, unit, values, distribution, colour, decimals }: DistributionPanelProps) {
  const { bins } = histogram(values);
  const format = (value: number) => value.toFixed(decimals);
  const description = distribution
    ? `n = ${distribution.count} · mean ${format(distribution.mean)} ${unit}${distribution.standardDeviation !== null ? ` · σ ${format(distribution.standardDeviation)} ${unit}` : ''} · p5–p95 ${format(distribution.p5)}–${format(distribution.p95)} ${unit}`
    : undefined;
  return (
    <Panel id={id} title={title} description={description}>
      {bins.length === 0 ? (
        <EmptyState title="No values">No succeeded analysis of this selection states this figure.</EmptyState>
      ) : (
        <BarChart
          bars={bins.map((bin) => ({
            label: `${format(bin.fromValue)}–${format(bin.toValue)}`,
            value: bin.count,
            valueText: `${bin.count} unit${bin.count === 1 ? '' : 's'}`,
          }))}
          xLabel={axisLabel}
          yLabel="Units"
          formatTick={(tick) => (Number.isInteger(tick) ? String(tick) : '')}
          colour={colour}
          tableHeading={`Class (${unit})`}
          summary={`Histogram of ${values.length} values of ${axisLabel} in ${bins.length} classes from ${format(bins[0].fromValue)} to ${format(bins[bins.length - 1].toValue)} ${unit}; the fullest class, ${(() => {
            const fullest = bins.reduce((best, bin) => (bin.count > best.count ? bin : best));
            return `${format(fullest.fromValue)}–${format(fullest.toValue)}, holds ${fullest.count}`;
          })()}.`}
        />
      )}
    </Panel>
  );
}
