import { Link } from 'react-router';
import { Badge } from '@console/components/ui/badge';
import { Button } from '@console/components/ui/button';
import { EmptyState, ErrorState, LoadingState } from '@console/components/ui/states';
import { Table, Td, Th } from '@console/components/ui/table';
import { paths } from '@console/config/paths';
import { formatDate, formatDateTime } from '@console/utils/format-date';
import { useWebhookEndpoints } from '../api/get-webhook-endpoints';
import { endpointStatus } from '../utils/delivery-display';
import { BreakableUrl } from './breakable-url';
import { EventTypeChips } from './event-type-chips';

export function WebhookEndpointsTable() {
  const endpoints = useWebhookEndpoints();

  if (endpoints.isPending) return <LoadingState label="Loading webhook endpoints…" />;
  if (endpoints.isError) return <ErrorState error={endpoints.error} onRetry={() => endpoints.refetch()} />;

  const rows = endpoints.data.pages.flatMap((page) => page.data);
  if (rows.length === 0) {
    return (
      <EmptyState title="No webhook endpoints yet">
        Add one above so a line system hears about finished analyses instead of polling for them.
      </EmptyState>
    );
  }

  return (
    <>
      <Table caption="Webhook endpoints of this organisation">
        <thead>
          <tr>
            <Th>Endpoint</Th>
            <Th>Events</Th>
            <Th>Status</Th>
            <Th>Created</Th>
          </tr>
        </thead>
        <tbody>
          {rows.map((endpoint) => {
            const status = endpointStatus(endpoint);
            return (
              <tr key={endpoint.id} className="hover:bg-ink-50/60">
                <Td className="max-w-lg">
                  <Link
                    to={paths.app.webhook.getHref(endpoint.id)}
                    className="font-mono text-xs font-semibold break-words text-ink-900 underline-offset-2 hover:underline"
                  >
                    <BreakableUrl url={endpoint.url} />
                  </Link>
                  {endpoint.description && <div className="text-xs text-ink-600">{endpoint.description}</div>}
                </Td>
                <Td>
                  <EventTypeChips eventTypes={endpoint.eventTypes} />
                </Td>
                <Td>
                  <Badge tone={status.tone}>{status.label}</Badge>
                </Td>
                <Td className="text-xs whitespace-nowrap">
                  <time dateTime={endpoint.createdAt} title={formatDateTime(endpoint.createdAt)}>
                    {formatDate(endpoint.createdAt)}
                  </time>
                </Td>
              </tr>
            );
          })}
        </tbody>
      </Table>
      {endpoints.hasNextPage && (
        <div className="flex justify-center border-t border-ink-100 px-5 py-3">
          <Button variant="secondary" size="sm" isPending={endpoints.isFetchingNextPage} onClick={() => endpoints.fetchNextPage()}>
            Show more endpoints
          </Button>
        </div>
      )}
    </>
  );
}
