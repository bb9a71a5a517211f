import { useId, useState } from 'react';
import { EmptyState, ErrorState, LoadingState } from '@console/components/ui/states';
import { Table, Td, Th } from '@console/components/ui/table';
import { cn } from '@console/utils/cn';
import { useDailyUsage } from '../api/get-daily-usage';
import { dailyBars, dayLabel, niceAxis, type DailyMetric } from '../utils/daily-chart';
import { formatCount, formatMinutes } from '../utils/meters';

const METRICS: Array<{ value: DailyMetric; label: string; format: (value: number) => string }> = [
  { value: 'analyses', label: 'Analyses', format: formatCount },
  { value: 'audioMinutes', label: 'Audio minutes', format: formatMinutes },
];

const WIDTH = 720;
const HEIGHT = 220;
const PLOT = { left: 48, right: 12, top: 12, bottom: 28 };

/** Bars per UTC day of the current period; the same figures are in the table below it. */
export function DailyUsageChart() {
  const daily = useDailyUsage();
  const [metric, setMetric] = useState<DailyMetric>('analyses');
  const titleId = useId();
  if (daily.isPending) return <LoadingState label="Loading daily usage…" />;
  if (daily.isError) return <ErrorState error={daily.error} onRetry={() => daily.refetch()} />;

  const chosen = METRICS.find((candidate) => candidate.value === metric)!;
  const bars = dailyBars(daily.data, metric);
  const total = bars.reduce((sum, bar) => sum + (bar.value ?? 0), 0);
  const axis = niceAxis(Math.max(...bars.map((bar) => bar.value ?? 0), 0), { integer: metric === 'analyses' });
  const plotWidth = WIDTH - PLOT.left - PLOT.right;
  const plotHeight = HEIGHT - PLOT.top - PLOT.bottom;
  const slot = plotWidth / Math.max(bars.length, 1);
  const barWidth = Math.max(2, Math.min(28, slot * 0.7));
  const y = (value: number) => PLOT.top + plotHeight - (value / axis.max) * plotHeight;
  const ticks = Array.from({ length: Math.round(axis.max / axis.step) + 1 }, (_, index) => index * axis.step);
  // Label about every 5th day so names never overlap.
  const labelEvery = Math.max(1, Math.ceil(bars.length / 7));

  return (
    <div className="space-y-4">
      <fieldset className="flex flex-wrap items-center gap-3">
        <legend className="sr-only">Quantity shown</legend>
        {METRICS.map((option) => (
          <label
            key={option.value}
            className={cn(
              'flex cursor-pointer items-center gap-2 rounded-md border px-3 py-1.5 text-sm font-semibold',
              'has-[:focus-visible]:outline-2 has-[:focus-visible]:outline-signal-700',
              metric === option.value ? 'border-ink-700 bg-ink-700 text-white' : 'border-ink-300 text-ink-700 hover:border-ink-500',
            )}
          >
            <input
              type="radio"
              name="daily-metric"
              value={option.value}
              checked={metric === option.value}
              onChange={() => setMetric(option.value)}
              className="sr-only"
            />
            {option.label}
          </label>
        ))}
        <span className="text-sm text-ink-600">
          This period so far: <span className="font-mono font-semibold text-ink-900">{chosen.format(total)}</span>
        </span>
      </fieldset>

      {total === 0 ? (
        <EmptyState title="Nothing used this period yet">Each accepted analysis shows here on the day it was charged (UTC).</EmptyState>
      ) : (
        <svg viewBox={`0 0 ${WIDTH} ${HEIGHT}`} role="img" aria-labelledby={titleId} className="h-auto w-full">
          <title id={titleId}>{`${chosen.label} per day this period, ${chosen.format(total)} in total`}</title>
          {ticks.map((tick) => (
            <g key={tick}>
              <line x1={PLOT.left} x2={WIDTH - PLOT.right} y1={y(tick)} y2={y(tick)} className="stroke-ink-200" strokeWidth={1} />
              <text x={PLOT.left - 8} y={y(tick)} dy="0.32em" textAnchor="end" className="fill-ink-600 font-mono text-[11px]">
                {formatCount(tick)}
              </text>
            </g>
          ))}
          {bars.map((bar, index) => {
            const x = PLOT.left + index * slot + (slot - barWidth) / 2;
            const showLabel = index % labelEvery === 0;
            return (
              <g key={bar.date}>
                {bar.value !== null && bar.value > 0 && (
                  <rect x={x} y={y(bar.value)} width={barWidth} height={Math.max(1, y(0) - y(bar.value))} rx={1.5} className="fill-ink-600">
                    <title>{`${dayLabel(bar.date)}: ${chosen.format(bar.value)}`}</title>
                  </rect>
                )}
                {showLabel && (
                  <text x={x + barWidth / 2} y={HEIGHT - 8} textAnchor="middle" className="fill-ink-600 text-[11px]">
                    {dayLabel(bar.date)}
                  </text>
                )}
              </g>
            );
          })}
        </svg>
      )}

      <details className="rounded-md border border-ink-200">
        <summary className="cursor-pointer px-4 py-2 text-sm font-semibold text-ink-700">Daily figures as a table</summary>
        <Table caption={`${chosen.label} per day (UTC)`}>
          <thead>
            <tr>
              <Th>Day (UTC)</Th>
              <Th className="text-right">Analyses</Th>
              <Th className="text-right">Audio minutes</Th>
            </tr>
          </thead>
          <tbody>
            {daily.data.days.map((day) => (
              <tr key={day.date}>
                <Td className="font-mono text-xs">{day.date}</Td>
                <Td className="text-right font-mono">{formatCount(day.analyses)}</Td>
                <Td className="text-right font-mono">{formatMinutes(day.audioMinutes)}</Td>
              </tr>
            ))}
          </tbody>
        </Table>
      </details>
    </div>
  );
}
