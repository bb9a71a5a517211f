import { useState } from 'react';
import type { QueryClient } from '@tanstack/react-query';
import { Alert } from '@console/components/ui/alert';
import { PageHeader } from '@console/components/ui/page-header';
import { Panel } from '@console/components/ui/panel';
import { getSessionQueryOptions, useSession } from '@console/features/auth/api/get-session';
import { getWebhookEndpointsQueryOptions } from '@console/features/webhooks/api/get-webhook-endpoints';
import { CreateWebhookEndpointForm } from '@console/features/webhooks/components/create-webhook-endpoint-form';
import { WebhookEndpointsTable } from '@console/features/webhooks/components/webhook-endpoints-table';
import { WebhookSecretDialog, type ShownSecret } from '@console/features/webhooks/components/webhook-secret-dialog';
import { hasPermission } from '@console/lib/authorization';

const WEBHOOKS_PERMISSION = 'webhooks:manage';

export const clientLoader = (queryClient: QueryClient) => async () => {
  const session = await queryClient.ensureQueryData(getSessionQueryOptions());
  if (hasPermission(session, WEBHOOKS_PERMISSION)) void queryClient.prefetchInfiniteQuery(getWebhookEndpointsQueryOptions());
  return null;
};

export default function WebhooksRoute() {
  const { data: session } = useSession();
  const [shown, setShown] = useState<ShownSecret | null>(null);
  if (!session) return null;
  const canManage = hasPermission(session, WEBHOOKS_PERMISSION);

  return (
    <>
      <PageHeader
        eyebrow="Organisation"
        title="Webhooks"
        description="Sweepline POSTs a signed notification to these endpoints when an analysis finishes or a quota runs low, so line systems need not poll."
      />
      {canManage ? (
        <div className="space-y-6">
          <Panel title="Add an endpoint" description="One endpoint per receiving system; each has its own signing secret.">
            <CreateWebhookEndpointForm onCreated={(created) => setShown({ ...created, reason: 'created' })} />
          </Panel>
          <Panel title="Endpoints" description="Open an endpoint for its delivery log, to pause it or to rotate its secret." flush>
            <WebhookEndpointsTable />
          </Panel>
          <WebhookSecretDialog shown={shown} onClose={() => setShown(null)} />
        </div>
      ) : (
        <Alert tone="info" title="Your role does not manage webhooks">
          Owners and admins of {session.activeOrganisation.name} add webhook endpoints and read their delivery logs.
        </Alert>
      )}
    </>
  );
}
