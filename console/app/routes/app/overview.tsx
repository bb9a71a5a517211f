import type { QueryClient } from '@tanstack/react-query';
import type { ReactNode } from 'react';
import { Link } from 'react-router';
import { buttonClasses } from '@console/components/ui/button';
import { Icon } from '@console/components/ui/icons';
import { PageHeader } from '@console/components/ui/page-header';
import { Panel } from '@console/components/ui/panel';
import { env } from '@console/config/env';
import { paths } from '@console/config/paths';
import { useSession } from '@console/features/auth/api/get-session';
import { getHealthQueryOptions } from '@console/features/health/api/get-health';
import { HealthPanel } from '@console/features/health/components/health-panel';
import { hasPermission } from '@console/lib/authorization';
import { roleLabel, roleSummary } from '@console/utils/roles';

export const clientLoader = (queryClient: QueryClient) => () => {
  void queryClient.prefetchQuery(getHealthQueryOptions());
  return null;
};

function Step({ number, title, children }: { number: number; title: string; children: ReactNode }) {
  return (
    <li className="flex gap-4">
      <span
        aria-hidden="true"
        className="flex size-7 shrink-0 items-center justify-center rounded-full border border-ink-300 font-mono text-xs font-bold"
      >
        {number}
      </span>
      <div className="space-y-1.5 pt-0.5">
        <p className="text-sm font-bold text-ink-900">{title}</p>
        <div className="text-sm text-ink-600">{children}</div>
      </div>
    </li>
  );
}

export default function OverviewRoute() {
  const { data: session } = useSession();
  if (!session) return null;
  const canManageKeys = hasPermission(session, 'keys:manage');
  const origin = window.location.origin;

  return (
    <>
      <PageHeader
        eyebrow={session.activeOrganisation.name}
        title="Overview"
        description={`Signed in as ${session.user.displayName}. The service state, and how a rig starts sending captures.`}
      />
      <div className="grid gap-6 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
        <div className="space-y-6">
          <Panel title="Service status" description="This Sweepline instance and its database.">
            <HealthPanel />
          </Panel>
          <Panel title="Connect a rig" description="Three steps from a new organisation to a rig that talks to Sweepline.">
            <ol className="space-y-5">
              <Step number={1} title="Create an API key for the rig">
                {canManageKeys ? (
                  <Link to={paths.app.apiKeys.getHref()} className="font-semibold text-ink-800 underline underline-offset-2">
                    Open API keys
                  </Link>
                ) : (
                  <span>Ask an owner or admin of {session.activeOrganisation.name} for a key.</span>
                )}
              </Step>
              <Step number={2} title="Store it in the rig’s secret store">
                An environment variable such as <code className="font-mono text-xs text-ink-800">SWEEPLINE_API_KEY</code>,
                never a file under source control.
              </Step>
              <Step number={3} title="Call the API with it">
                <pre className="mt-1 overflow-x-auto rounded-md bg-ink-950 px-4 py-3 font-mono text-xs text-ink-200">
                  {`curl -H "Authorization: Bearer $SWEEPLINE_API_KEY" \\\n  ${origin}${env.apiBasePath}/api-keys/current`}
                </pre>
              </Step>
            </ol>
          </Panel>
        </div>
        <div className="space-y-6">
          <Panel title="Developer" description="Every endpoint, with request and response schemas.">
            <a href={env.docsPath} className={buttonClasses('primary', 'md', 'w-full')}>
              <Icon name="docs" className="size-4" />
              Open the API reference
            </a>
            <p className="mt-3 text-xs text-ink-500">
              Served by this instance at <span className="font-mono">{env.docsPath}</span>; the OpenAPI document is
              generated from the same schemas the server validates with.
            </p>
          </Panel>
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
