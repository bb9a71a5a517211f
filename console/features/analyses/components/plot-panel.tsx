import type { ReactNode } from 'react';
import { ChartLegend, type LegendItem } from '@console/components/charts/chart-legend';
import type { ChartSpec } from '@console/components/charts/chart-spec';
import { LogFrequencyChart } from '@console/components/charts/log-frequency-chart';
import { Panel } from '@console/components/ui/panel';

/** Legend entries for the non-auxiliary series of a spec, plus any region and band swatches. */
export function legendFor(spec: ChartSpec, extra: LegendItem[] = []): LegendItem[] {
  const lines = spec.series.filter((series) => !series.auxiliary).map((series) => ({ id: series.id, label: series.label, colour: series.colour, dash: series.dash }));
  const bounds = spec.series.some((series) => series.markers === 'hollow') ? [{ id: 'bounds', label: 'Upper bound (not above the noise)', colour: '#42557a', dash: [4, 3], markers: 'hollow' as const }] : [];
  const regions = [...new Map((spec.regions ?? []).map((region) => [region.label, { id: `region-${region.label}`, label: region.label, colour: region.fill, fill: true }])).values()];
  return [...lines, ...bounds, ...regions, ...extra];
}

type PlotPanelProps = { title: string; description?: ReactNode; spec: ChartSpec; summary: string; controls?: ReactNode; legendExtra?: LegendItem[]; heightPx?: number; id?: string };

export function PlotPanel({ title, description, spec, summary, controls, legendExtra, heightPx, id }: PlotPanelProps) {
  return (
    <Panel title={title} description={description} actions={controls} id={id}>
      <LogFrequencyChart spec={spec} summary={summary} heightPx={heightPx} footer={<ChartLegend items={legendFor(spec, legendExtra)} />} />
    </Panel>
  );
}
