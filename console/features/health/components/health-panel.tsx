import type { ReactNode } from 'react';
import { Badge } from '@console/components/ui/badge';
import { ErrorState, LoadingState } from '@console/components/ui/states';
import { formatDateTime } from '@console/utils/format-date';
import { useHealth } from '../api/get-health';

function Reading({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div className="space-y-1">
      <dt className="font-mono text-eyebrow font-semibold text-ink-500 uppercase">{label}</dt>
      <dd className="text-sm font-semibold text-ink-900">{children}</dd>
    </div>
  );
}

/** Service and database state, refreshed every 30 s while the page is open. */
export function HealthPanel() {
  const health = useHealth();

  if (health.isPending) return <LoadingState label="Checking the service…" />;
  if (health.isError) return <ErrorState error={health.error} onRetry={() => health.refetch()} />;

  const { status, database, version } = health.data;
  return (
    <div aria-live="polite" className="space-y-4">
      <dl className="grid grid-cols-2 gap-5 sm:grid-cols-4">
        <Reading label="Service">
          <Badge tone={status === 'ok' ? 'ok' : 'danger'}>{status === 'ok' ? 'Operational' : 'Degraded'}</Badge>
        </Reading>
        <Reading label="Database">
          <Badge tone={database.status === 'ok' ? 'ok' : 'danger'}>
            {database.status === 'ok' ? 'Reachable' : 'Unavailable'}
          </Badge>
        </Reading>
        <Reading label="Round trip">
          <span className="font-mono tabular">
            {database.latencyMs === null ? '—' : `${database.latencyMs.toFixed(1)} ms`}
          </span>
        </Reading>
        <Reading label="Version">
          <span className="font-mono">{version}</span>
        </Reading>
      </dl>
      <p className="text-xs text-ink-500">
        Checked {formatDateTime(new Date(health.dataUpdatedAt).toISOString())}; refreshed every 30 seconds.
      </p>
    </div>
  );
}
