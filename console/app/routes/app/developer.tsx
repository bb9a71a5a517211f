import { useMemo } from 'react';
import { Icon } from '@console/components/ui/icons';
import { PageHeader } from '@console/components/ui/page-header';
import { Panel } from '@console/components/ui/panel';
import { buttonClasses } from '@console/components/ui/button';
import { env } from '@console/config/env';
import { useSession } from '@console/features/auth/api/get-session';
import { QuickStartSteps } from '@console/features/developer/components/quick-start-steps';
import { RigExampleTabs } from '@console/features/developer/components/rig-example-tabs';
import { normaliseBaseUrl } from '@console/features/developer/utils/base-url';
import { rigExamplesFor } from '@console/features/developer/utils/rig-examples';
import { hasPermission } from '@console/lib/authorization';

export default function DeveloperRoute() {
  const { data: session } = useSession();
  // The console is served by the API itself, so its own origin is the base URL rigs should call.
  const baseUrl = normaliseBaseUrl(window.location.origin);
  const examples = useMemo(() => rigExamplesFor(baseUrl), [baseUrl]);
  if (!session) return null;

  return (
    <>
      <PageHeader
        eyebrow="Developer"
        title="Developer corner"
        description="Everything a rig script needs: the API reference, a first call, webhook signatures and complete example loops."
      />
      <div className="space-y-6">
        <Panel title="API reference">
          <div className="flex flex-wrap items-center justify-between gap-4 text-sm text-ink-700">
            <div className="max-w-3xl space-y-1">
              <p>
                Every route with its parameters, answers, problem codes and the conventions behind each figure, generated
                from the same schemas that validate requests. Errors come back as application/problem+json with a stable
                code and, for a bad field, a JSON Pointer to it.
              </p>
              <p className="text-xs text-ink-600">
                Machine-readable:{' '}
                <a href={`${env.docsPath}/openapi.json`} className="font-mono text-ink-800 underline underline-offset-2">
                  {env.docsPath}/openapi.json
                </a>{' '}
                (OpenAPI 3.1).
              </p>
            </div>
            <a href={env.docsPath} className={buttonClasses('primary', 'md')}>
              Open the API reference
              <Icon name="external" className="size-4" />
            </a>
          </div>
        </Panel>
        <Panel title="Quick start" description="Three steps from a new key to a rig that hears about finished analyses.">
          <QuickStartSteps
            baseUrl={baseUrl}
            canManageKeys={hasPermission(session, 'keys:manage')}
            canManageWebhooks={hasPermission(session, 'webhooks:manage')}
          />
        </Panel>
        <Panel
          title="Rig examples"
          description="The full loop (stimulus → WAV → capture upload → analysis → headline figures) plus a webhook verifier, with this organisation’s base URL filled in."
        >
          <RigExampleTabs examples={examples} />
        </Panel>
      </div>
    </>
  );
}
