import type { QueryClient } from '@tanstack/react-query';
import { PageHeader } from '@console/components/ui/page-header';
import { Panel } from '@console/components/ui/panel';
import { useSession } from '@console/features/auth/api/get-session';
import { getHealthQueryOptions } from '@console/features/health/api/get-health';
import { HealthPanel } from '@console/features/health/components/health-panel';
import { CalibrationsCard } from '@console/features/overview/components/calibrations-card';
import { QuickLinksCard } from '@console/features/overview/components/quick-links-card';
import { RecentAnalysesCard } from '@console/features/overview/components/recent-analyses-card';
import { UsageCard } from '@console/features/overview/components/usage-card';
import { WeekTallyCard } from '@console/features/overview/components/week-tally-card';
import { hasPermission } from '@console/lib/authorization';
import { roleLabel, roleSummary } from '@console/utils/roles';

export const clientLoader = (queryClient: QueryClient) => () => {
  void queryClient.prefetchQuery(getHealthQueryOptions());
  return null;
};

export default function OverviewRoute() {
  const { data: session } = useSession();
  if (!session) return null;
  const canReadAnalyses = hasPermission(session, 'analyses:read');

  return (
    <>
      <PageHeader
        eyebrow={session.activeOrganisation.name}
        title="Overview"
        description={`Signed in as ${session.user.displayName}. What the rigs measured lately, and what needs a look.`}
      />
      <div className="space-y-6">
        <WeekTallyCard canRead={canReadAnalyses} />
        <div className="grid gap-6 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
          <RecentAnalysesCard canRead={canReadAnalyses} />
          <div className="space-y-6">
            <CalibrationsCard canRead={hasPermission(session, 'calibrations:read')} />
            <UsageCard canRead={hasPermission(session, 'usage:read')} />
          </div>
        </div>
        <div className="grid gap-6 lg:grid-cols-2">
          <QuickLinksCard session={session} />
          <Panel title="Service status" description="This Sweepline instance and its database.">
            <HealthPanel />
          </Panel>
        </div>
        <div>
          <Panel title="Your access">
            <dl className="space-y-3 text-sm">
              <div>
                <dt className="font-mono text-eyebrow font-semibold text-ink-500 uppercase">Role</dt>
                <dd className="font-semibold text-ink-900">{roleLabel(session.activeOrganisation.role)}</dd>
                <dd className="text-xs text-ink-600">{roleSummary(session.activeOrganisation.role)}</dd>
              </div>
              <div>
                <dt className="font-mono text-eyebrow font-semibold text-ink-500 uppercase">Permissions</dt>
                <dd>
                  <ul className="mt-1 flex flex-wrap gap-1">
                    {session.permissions.map((permission) => (
                      <li key={permission} className="rounded-sm bg-ink-100 px-1.5 py-0.5 font-mono text-[11px]">
                        {permission}
                      </li>
                    ))}
                  </ul>
                </dd>
              </div>
            </dl>
          </Panel>
        </div>
      </div>
    </>
  );
}
