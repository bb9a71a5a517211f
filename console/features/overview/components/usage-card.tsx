import { Link } from 'react-router';
import { Panel } from '@console/components/ui/panel';
import { paths } from '@console/config/paths';
import { cn } from '@console/utils/cn';
import { formatDate } from '@console/utils/format-date';
import type { Usage } from '@shared/schemas/usage';
import { useUsage } from '../api/get-usage';
import { CardQuery, NotForRole } from './card-states';

type Meter = Usage['analyses'];

const number = new Intl.NumberFormat(undefined, { maximumFractionDigits: 1 });

/** Decimal SI prefixes (BIPM SI Brochure, 9th ed., Table 7), as storage limits are stated. */
function bytesWords(bytes: number): string {
  if (bytes >= 1e9) return `${number.format(bytes / 1e9)} GB`;
  if (bytes >= 1e6) return `${number.format(bytes / 1e6)} MB`;
  if (bytes >= 1e3) return `${number.format(bytes / 1e3)} kB`;
  return `${number.format(bytes)} B`;
}

function MeterRow({ label, meter, format }: { label: string; meter: Meter; format: (value: number) => string }) {
  const percent = Math.min(100, meter.percentUsed);
  const tone = meter.percentUsed >= 100 ? 'bg-danger-600' : meter.percentUsed >= 80 ? 'bg-signal-500' : 'bg-ink-700';
  const words = `${format(meter.used)} of ${format(meter.limit)}`;
  return (
    <div className="space-y-1">
      <div className="flex items-baseline justify-between gap-3 text-sm">
        <span className="font-semibold text-ink-800">{label}</span>
        <span className="font-mono text-xs text-ink-700 tabular">{words}</span>
      </div>
      <div
        role="meter"
        aria-label={label}
        aria-valuemin={0}
        aria-valuemax={meter.limit}
        aria-valuenow={meter.used}
        aria-valuetext={`${words}, ${meter.percentUsed} %`}
        className="h-1.5 overflow-hidden rounded-full bg-ink-100"
      >
        <div className={cn('h-full rounded-full', tone)} style={{ width: `${percent}%` }} />
      </div>
    </div>
  );
}

/** The current period's usage against the plan's limits. */
export function UsageCard({ canRead }: { canRead: boolean }) {
  const query = useUsage(canRead);
  return (
    <Panel
      id="overview-usage"
      title="This period"
      description="Usage against your plan’s limits."
      actions={
        canRead && (
          <Link to={paths.app.usage.getHref()} className="text-sm font-semibold text-ink-700 underline underline-offset-2 hover:text-ink-900">
            Usage and plan
          </Link>
        )
      }
    >
      {!canRead ? (
        <NotForRole>Your role does not read usage.</NotForRole>
      ) : (
        <CardQuery query={query} loadingLabel="Loading usage…">
          {(usage) => (
            <div className="space-y-3">
              <MeterRow label="Analyses" meter={usage.analyses} format={(v) => number.format(v)} />
              <MeterRow label="Audio minutes" meter={usage.audioMinutes} format={(v) => number.format(v)} />
              <MeterRow label="Storage" meter={usage.storageBytes} format={bytesWords} />
              <p className="text-xs text-ink-600">
                Plan <span className="font-mono font-semibold text-ink-800">{usage.planId}</span>; the monthly counters start again on{' '}
                {formatDate(usage.period.end)}.
              </p>
            </div>
          )}
        </CardQuery>
      )}
    </Panel>
  );
}
