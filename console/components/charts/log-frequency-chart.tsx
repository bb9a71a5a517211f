import { useId, useMemo, useRef, useState, type KeyboardEvent, type ReactNode } from 'react';
import { cn } from '@console/utils/cn';
import { alignSeries, type ChartSpec } from './chart-spec';
import { chartTableRows } from './chart-table';
import { formatFrequency } from './format-units';
import { useUplot } from './use-uplot';

type LogFrequencyChartProps = {
  spec: ChartSpec;
  /** What the chart shows, in one sentence, for people who cannot see it (also the focus label). */
  summary: string;
  heightPx?: number;
  /** Legend or controls under the plot. */
  footer?: ReactNode;
  onFirstDraw?: (durationMs: number) => void;
  className?: string;
};

const formatX = (spec: ChartSpec, x: number) => (spec.xAxis === 'log-frequency' ? formatFrequency(x) : `${Number(x.toPrecision(4))} ${spec.xLabel.match(/\(([^)]+)\)/)?.[1] ?? ''}`.trim());

/**
 * A uPlot chart of curves against frequency (log axis, 1/3-octave grid, decade lines) or time (linear axis).
 * Focus it and use ← → (Shift for larger steps) to read values; a table of the same values sits below it.
 */
export function LogFrequencyChart({ spec, summary, heightPx = 300, footer, onFirstDraw, className }: LogFrequencyChartProps) {
  const containerRef = useRef<HTMLDivElement>(null);
  const [cursorIndex, setCursorIndex] = useState<number | null>(null);
  const [tableOpen, setTableOpen] = useState(false);
  const summaryId = useId();
  const data = useMemo(() => alignSeries(spec.series), [spec]);
  const listed = useMemo(() => spec.series.flatMap((series, i) => (series.auxiliary || series.visible === false ? [] : [i])), [spec]);
  const chartRef = useUplot(containerRef, spec, data, heightPx, { onFirstDraw, onCursor: setCursorIndex });
  const formatY = spec.formatY ?? ((value: number) => String(Number(value.toFixed(2))));

  const moveCursor = (event: KeyboardEvent<HTMLDivElement>) => {
    const chart = chartRef.current;
    if (!chart || data.x.length === 0 || (event.key !== 'ArrowLeft' && event.key !== 'ArrowRight')) return;
    event.preventDefault();
    const step = (event.shiftKey ? Math.ceil(data.x.length / 20) : 1) * (event.key === 'ArrowRight' ? 1 : -1);
    const next = Math.min(data.x.length - 1, Math.max(0, (cursorIndex ?? -1) + step));
    chart.setCursor({ left: chart.valToPos(data.x[next], 'x'), top: chart.over.clientHeight / 2 });
  };

  const readout =
    cursorIndex === null || data.x[cursorIndex] === undefined
      ? null
      : `${formatX(spec, data.x[cursorIndex])}: ${listed
          .map((i) => {
            const value = data.ys[i][cursorIndex];
            return `${spec.series[i].label} ${value === null || value === undefined ? '—' : formatY(value)}`;
          })
          .join(' · ')}`;

  return (
    <figure className={cn('space-y-2', className)}>
      <div
        ref={containerRef}
        tabIndex={0}
        role="img"
        aria-label={summary}
        aria-describedby={summaryId}
        onKeyDown={moveCursor}
        className="sweep-chart w-full rounded-md"
        style={{ minHeight: heightPx }}
      />
      <p id={summaryId} className="min-h-5 font-mono text-xs text-ink-600 tabular" aria-live="polite">
        {readout ?? <span className="text-ink-500">Point at the plot, or focus it and use ← →, to read values.</span>}
      </p>
      {footer}
      {/* The table is built when opened: a closed one would cost every chart its rows of DOM for nothing. */}
      <details className="text-xs text-ink-700" onToggle={(event) => setTableOpen(event.currentTarget.open)}>
        <summary className="cursor-pointer font-semibold text-ink-600 hover:text-ink-900">Values as a table</summary>
        {tableOpen && <ChartValuesTable spec={spec} rows={chartTableRows(spec, data, listed)} listed={listed} formatY={formatY} />}
      </details>
    </figure>
  );
}

type TableProps = { spec: ChartSpec; rows: ReturnType<typeof chartTableRows>; listed: number[]; formatY: (value: number) => string };

function ChartValuesTable({ spec, rows, listed, formatY }: TableProps) {
  return (
    <div className="mt-2 max-h-72 overflow-auto rounded-md border border-ink-100">
      <table className="w-full text-left font-mono tabular">
        <caption className="sr-only">{`${spec.yLabel} against ${spec.xLabel}`}</caption>
        <thead className="sticky top-0 bg-ink-50">
          <tr>
            <th scope="col" className="px-3 py-1.5">{spec.xLabel}</th>
            {listed.map((i) => (
              <th scope="col" key={spec.series[i].id} className="px-3 py-1.5">
                {spec.series[i].label}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {rows.map((row) => (
            <tr key={row.x} className="border-t border-ink-100">
              <th scope="row" className="px-3 py-1 font-normal">{formatX(spec, row.x)}</th>
              {row.values.map((value, column) => (
                <td key={listed[column]} className="px-3 py-1">
                  {value === null ? '—' : formatY(value)}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
