import { useState } from 'react';
import type { QueryClient } from '@tanstack/react-query';
import { Link, useNavigate, useParams, type LoaderFunctionArgs } from 'react-router';
import { Alert } from '@console/components/ui/alert';
import { Button, buttonClasses } from '@console/components/ui/button';
import { PageHeader } from '@console/components/ui/page-header';
import { Panel } from '@console/components/ui/panel';
import { ErrorState, LoadingState } from '@console/components/ui/states';
import { paths } from '@console/config/paths';
import { getSessionQueryOptions, useSession } from '@console/features/auth/api/get-session';
import { getWebhookDeliveriesQueryOptions, useWebhookDeliveries } from '@console/features/webhooks/api/get-webhook-deliveries';
import { getWebhookEndpointQueryOptions, useWebhookEndpoint } from '@console/features/webhooks/api/get-webhook-endpoint';
import { WebhookDeliveriesTable } from '@console/features/webhooks/components/webhook-deliveries-table';
import { WebhookEndpointPanel } from '@console/features/webhooks/components/webhook-endpoint-panel';
import { WebhookSecretDialog, type ShownSecret } from '@console/features/webhooks/components/webhook-secret-dialog';
import { hasPermission } from '@console/lib/authorization';

const WEBHOOKS_PERMISSION = 'webhooks:manage';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ params }: LoaderFunctionArgs) => {
    const session = await queryClient.ensureQueryData(getSessionQueryOptions());
    if (params.endpointId && hasPermission(session, WEBHOOKS_PERMISSION)) {
      void queryClient.prefetchQuery(getWebhookEndpointQueryOptions(params.endpointId));
      void queryClient.prefetchInfiniteQuery(getWebhookDeliveriesQueryOptions(params.endpointId));
    }
    return null;
  };

function DeliveriesPanel({ endpointId }: { endpointId: string }) {
  const deliveries = useWebhookDeliveries(endpointId);
  return (
    <Panel
      title="Delivery log"
      description="Newest first. A resend sends the same event (same webhook-id) again with a fresh signature."
      actions={
        <Button variant="secondary" size="sm" isPending={deliveries.isRefetching} onClick={() => deliveries.refetch()}>
          Refresh
        </Button>
      }
      flush
    >
      <WebhookDeliveriesTable endpointId={endpointId} />
    </Panel>
  );
}

function EndpointScreen({ endpointId }: { endpointId: string }) {
  const navigate = useNavigate();
  const endpoint = useWebhookEndpoint(endpointId);
  const [shown, setShown] = useState<ShownSecret | null>(null);

  if (endpoint.isPending) return <LoadingState label="Loading webhook endpoint…" />;
  if (endpoint.isError) return <ErrorState error={endpoint.error} onRetry={() => endpoint.refetch()} />;

  return (
    <>
      <PageHeader
        eyebrow="Webhooks"
        title={endpoint.data.description ?? 'Webhook endpoint'}
        description={<span className="font-mono text-xs">{endpoint.data.id}</span>}
        actions={
          <Link to={paths.app.webhooks.getHref()} className={buttonClasses('ghost', 'sm')}>
            All endpoints
          </Link>
        }
      />
      <div className="space-y-6">
        <WebhookEndpointPanel
          endpoint={endpoint.data}
          onSecret={setShown}
          onDeleted={() => navigate(paths.app.webhooks.getHref())}
        />
        <DeliveriesPanel endpointId={endpointId} />
      </div>
      <WebhookSecretDialog shown={shown} onClose={() => setShown(null)} />
    </>
  );
}

export default function WebhookDetailRoute() {
  const { endpointId = '' } = useParams();
  const { data: session } = useSession();
  if (!session) return null;
  if (!hasPermission(session, WEBHOOKS_PERMISSION)) {
    return (
      <>
        <PageHeader eyebrow="Webhooks" title="Webhook endpoint" />
        <Alert tone="info" title="Your role does not manage webhooks">
          Owners and admins of {session.activeOrganisation.name} read webhook delivery logs.
        </Alert>
      </>
    );
  }
  return <EndpointScreen endpointId={endpointId} />;
}
