import { ErrorState, LoadingState } from '@console/components/ui/states';
import { cn } from '@console/utils/cn';
import { formatDate } from '@console/utils/format-date';
import { useUsage } from '../api/get-usage';
import { formatCount, meterRows, type MeterTone } from '../utils/meters';

const barClasses: Record<MeterTone, string> = {
  ok: 'bg-ink-600',
  warning: 'bg-signal-500',
  danger: 'bg-danger-600',
};

const percentClasses: Record<MeterTone, string> = {
  ok: 'text-ink-700',
  warning: 'text-signal-800',
  danger: 'text-danger-700',
};

const percentFormat = new Intl.NumberFormat(undefined, { maximumFractionDigits: 1 });

/** Usage of the current period against the plan's limits, one bar per quota; the words carry the figures. */
export function UsageMeters() {
  const usage = useUsage();
  if (usage.isPending) return <LoadingState label="Loading usage…" />;
  if (usage.isError) return <ErrorState error={usage.error} onRetry={() => usage.refetch()} />;
  const { data } = usage;

  return (
    <div className="space-y-5">
      <p className="text-sm text-ink-600">
        Period {formatDate(data.period.start)} – {formatDate(data.period.end)}; monthly counters start again on {formatDate(data.period.end)}.
      </p>
      <ul className="space-y-5">
        {meterRows(data).map((row) => (
          <li key={row.key} className="space-y-1.5">
            <div className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-0.5">
              <span id={`meter-${row.key}`} className="text-sm font-bold text-ink-900">
                {row.label}
              </span>
              <span className="text-sm text-ink-700">
                <span className="font-mono">{row.used}</span> of <span className="font-mono">{row.limit}</span>
                <span className={cn('ml-2 font-mono font-semibold', percentClasses[row.tone])}>{percentFormat.format(row.percentUsed)} %</span>
              </span>
            </div>
            <div
              role="meter"
              aria-labelledby={`meter-${row.key}`}
              aria-valuemin={0}
              aria-valuemax={100}
              aria-valuenow={row.barPercent}
              aria-valuetext={`${row.used} of ${row.limit} (${percentFormat.format(row.percentUsed)} %)`}
              className="relative h-2.5 overflow-hidden rounded-sm bg-ink-100"
            >
              <div className={cn('h-full rounded-sm', barClasses[row.tone])} style={{ width: `${row.barPercent}%` }} />
              {/* The 80 % mark, where owners and admins get an e-mail. */}
              <div aria-hidden="true" className="absolute inset-y-0 left-[80%] w-px bg-ink-400" />
            </div>
            <p className="text-xs text-ink-500">{row.note}</p>
          </li>
        ))}
      </ul>
      <dl className="grid gap-x-6 gap-y-2 border-t border-ink-100 pt-4 text-sm sm:grid-cols-2">
        <div>
          <dt className="text-xs font-semibold text-ink-500">Request rate</dt>
          <dd className="text-ink-800">
            <span className="font-mono">{formatCount(data.requestsPerMinute.limit)}</span> requests per minute per key or user
          </dd>
        </div>
        <div>
          <dt className="text-xs font-semibold text-ink-500">Largest upload</dt>
          <dd className="text-ink-800">
            <span className="font-mono">{formatCount(data.uploadLimits.maxUploadDurationSeconds)} s</span>,{' '}
            <span className="font-mono">{formatCount(data.uploadLimits.maxUploadChannels)}</span> channels,{' '}
            <span className="font-mono">{formatCount(data.uploadLimits.maxUploadSampleRateHz / 1000)} kHz</span>
          </dd>
        </div>
      </dl>
    </div>
  );
}
