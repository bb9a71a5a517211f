import { useId } from 'react';

export interface Bar {
  /** Under the bar (a class, a day). */
  label: string;
  /** null draws no bar (e.g. a day without verdicts) and says so in the table. */
  value: number | null;
  /** The value in words, for the tooltip and the table ("3 units", "75 %"). */
  valueText: string;
}

type BarChartProps = {
  bars: Bar[];
  xLabel: string;
  yLabel: string;
  /** Top of the value axis; the largest value when absent. */
  yMax?: number;
  /** Format of the axis tick values. */
  formatTick?: (value: number) => string;
  /** The chart in one sentence, for people who cannot see it. */
  summary: string;
  colour: string;
  /** Show every n-th label when bars are many (labels would collide). */
  maxLabels?: number;
  /** Label for the first column of the text table. */
  tableHeading?: string;
};

function ticksUpTo(max: number): number[] {
  if (max <= 0) return [0];
  const raw = max / 4;
  const decade = 10 ** Math.floor(Math.log10(raw));
  const step = ([1, 2, 2.5, 5, 10].find((factor) => factor * decade >= raw) ?? 10) * decade;
  const ticks: number[] = [];
  for (let value = 0; value <= max + step * 1e-9; value += step) ticks.push(Number(value.toPrecision(12)));
  return ticks;
}

/**
 * Vertical bars drawn with plain HTML, so text stays crisp at any width and reads aloud: the figure is an image
 * with a one-sentence summary, and a table of the same values follows it.
 */
export function BarChart({ bars, xLabel, yLabel, yMax, formatTick = String, summary, colour, maxLabels = 12, tableHeading }: BarChartProps) {
  const headingId = useId();
  const largest = Math.max(0, ...bars.map((bar) => bar.value ?? 0));
  const ticks = ticksUpTo(yMax ?? Math.max(largest, 1));
  const top = ticks[ticks.length - 1] || 1;
  const labelEvery = Math.max(1, Math.ceil(bars.length / maxLabels));

  return (
    <figure className="space-y-2">
      <div role="img" aria-label={summary} className="grid grid-cols-[1.5rem_2.75rem_minmax(0,1fr)] grid-rows-[12rem_auto_auto] text-xs text-ink-600">
        <div className="row-span-1 flex items-center justify-center">
          <span className="-rotate-90 font-semibold whitespace-nowrap text-ink-800">{yLabel}</span>
        </div>
        <div className="relative" aria-hidden="true">
          {ticks.map((tick) => (
            <span key={tick} className="absolute right-1.5 -translate-y-1/2 font-mono tabular" style={{ top: `${100 - (100 * tick) / top}%` }}>
              {formatTick(tick)}
            </span>
          ))}
        </div>
        <div className="relative border-b border-l border-ink-400" aria-hidden="true">
          {ticks.map((tick) => (
            <div key={tick} className="absolute inset-x-0 border-t border-ink-100" style={{ top: `${100 - (100 * tick) / top}%` }} />
          ))}
          <div className="absolute inset-0 flex items-end justify-center gap-[2px] px-[2px]">
            {bars.map((bar, i) => (
              <div key={`${bar.label}-${i}`} className="flex h-full max-w-28 min-w-0 flex-1 items-end" title={`${bar.label}: ${bar.valueText}`}>
                {bar.value === null ? (
                  <div className="h-full w-full bg-[repeating-linear-gradient(135deg,transparent_0_4px,rgba(122,138,168,0.18)_4px_6px)]" />
                ) : (
                  <div className="w-full rounded-t-sm" style={{ height: `${(100 * bar.value) / top}%`, minHeight: bar.value > 0 ? 2 : 0, background: colour }} />
                )}
              </div>
            ))}
          </div>
        </div>
        <div />
        <div />
        <div className="flex justify-center gap-[2px] px-[2px] pt-1" aria-hidden="true">
          {bars.map((bar, i) => (
            <span key={`${bar.label}-${i}`} className="max-w-28 min-w-0 flex-1 truncate text-center font-mono tabular">
              {i % labelEvery === 0 ? bar.label : ''}
            </span>
          ))}
        </div>
        <div />
        <div />
        <p className="pt-1 text-center font-semibold text-ink-800">{xLabel}</p>
      </div>
      <details className="text-xs text-ink-700">
        <summary className="cursor-pointer font-semibold text-ink-600 hover:text-ink-900">Values as a table</summary>
        <div className="mt-2 max-h-60 overflow-auto rounded-md border border-ink-100">
          <table className="w-full text-left font-mono tabular" aria-labelledby={headingId}>
            <caption id={headingId} className="sr-only">{`${yLabel} by ${xLabel}`}</caption>
            <thead className="sticky top-0 bg-ink-50">
              <tr>
                <th scope="col" className="px-3 py-1.5">{tableHeading ?? xLabel}</th>
                <th scope="col" className="px-3 py-1.5">{yLabel}</th>
              </tr>
            </thead>
            <tbody>
              {bars.map((bar, i) => (
                <tr key={`${bar.label}-${i}`} className="border-t border-ink-100">
                  <th scope="row" className="px-3 py-1 font-normal">{bar.label}</th>
                  <td className="px-3 py-1">{bar.valueText}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </details>
    </figure>
  );
}
