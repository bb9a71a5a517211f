import { Fragment, useState } from 'react';
import { ProblemAlert } from '@console/components/ui/alert';
import { Badge } from '@console/components/ui/badge';
import { Button } from '@console/components/ui/button';
import { useNotify } from '@console/components/ui/notifications';
import { EmptyState, ErrorState, LoadingState } from '@console/components/ui/states';
import { Table, Td, Th } from '@console/components/ui/table';
import { formatDateTime, formatRelativeTime } from '@console/utils/format-date';
import type { WebhookDelivery } from '@shared/schemas/webhooks';
import { useWebhookDeliveries } from '../api/get-webhook-deliveries';
import { useResendWebhookDelivery } from '../api/resend-webhook-delivery';
import { deliveryStatus, responseCodeText } from '../utils/delivery-display';
import { DeliveryAttempts } from './delivery-attempts';

function When({ iso, empty = '—' }: { iso: string | null; empty?: string }) {
  if (!iso) return <span className="text-ink-500">{empty}</span>;
  return (
    <time dateTime={iso} title={formatDateTime(iso)}>
      {formatRelativeTime(iso)}
    </time>
  );
}

const COLUMN_COUNT = 7;

/** Every attempt ever made: a resend restarts the retry count, but the log keeps the earlier attempts. */
const totalAttempts = (delivery: WebhookDelivery) => Math.max(delivery.attempts, delivery.attemptLog.length);

export function WebhookDeliveriesTable({ endpointId }: { endpointId: string }) {
  const deliveries = useWebhookDeliveries(endpointId);
  const notify = useNotify();
  const [expanded, setExpanded] = useState<ReadonlySet<string>>(new Set());
  const resend = useResendWebhookDelivery({
    onSuccess: (delivery) => notify(`${delivery.eventType} queued again; it goes out within a few seconds.`),
  });

  if (deliveries.isPending) return <LoadingState label="Loading deliveries…" />;
  if (deliveries.isError) return <ErrorState error={deliveries.error} onRetry={() => deliveries.refetch()} />;

  const rows = deliveries.data.pages.flatMap((page) => page.data);
  if (rows.length === 0) {
    return (
      <EmptyState title="No deliveries yet">
        Each event this endpoint subscribes to appears here with its attempts, once it happens.
      </EmptyState>
    );
  }

  const toggle = (deliveryId: string) =>
    setExpanded((current) => {
      const next = new Set(current);
      if (next.has(deliveryId)) next.delete(deliveryId);
      else next.add(deliveryId);
      return next;
    });

  const resending = (delivery: WebhookDelivery) => resend.isPending && resend.variables?.deliveryId === delivery.id;

  return (
    <>
      {resend.error ? <ProblemAlert error={resend.error} className="mx-5 my-4" /> : null}
      <Table caption="Deliveries to this endpoint, newest first">
        <thead>
          <tr>
            <Th>Event</Th>
            <Th>Status</Th>
            <Th className="text-right">Attempts</Th>
            <Th>Response</Th>
            <Th>Created</Th>
            <Th>Last attempt</Th>
            <Th>
              <span className="sr-only">Actions</span>
            </Th>
          </tr>
        </thead>
        <tbody>
          {rows.map((delivery) => {
            const status = deliveryStatus(delivery);
            const isOpen = expanded.has(delivery.id);
            const detailsId = `attempts-${delivery.id}`;
            return (
              <Fragment key={delivery.id}>
                <tr className="hover:bg-ink-50/60" data-delivery-id={delivery.id}>
                  <Td>
                    <div className="font-mono text-xs font-semibold text-ink-900">{delivery.eventType}</div>
                    <div className="font-mono text-[11px] text-ink-500">{delivery.eventId}</div>
                  </Td>
                  <Td>
                    <Badge tone={status.tone}>{status.label}</Badge>
                    {delivery.nextAttemptAt && delivery.attempts > 0 && (
                      <div className="mt-1 text-xs text-ink-600">
                        next <When iso={delivery.nextAttemptAt} />
                      </div>
                    )}
                  </Td>
                  <Td className="text-right font-mono text-xs">{totalAttempts(delivery)}</Td>
                  <Td className="font-mono text-xs whitespace-nowrap">{responseCodeText(delivery)}</Td>
                  <Td className="text-xs whitespace-nowrap">
                    <When iso={delivery.createdAt} />
                  </Td>
                  <Td className="text-xs whitespace-nowrap">
                    <When iso={delivery.lastAttemptAt} empty="Not yet" />
                  </Td>
                  <Td className="text-right whitespace-nowrap">
                    <Button variant="ghost" size="sm" aria-expanded={isOpen} aria-controls={isOpen ? detailsId : undefined} onClick={() => toggle(delivery.id)}>
                      {isOpen ? 'Hide attempts' : 'Attempts'}
                    </Button>
                    <Button
                      variant="secondary"
                      size="sm"
                      className="ml-2"
                      aria-label={`Resend ${delivery.eventType} delivery ${delivery.id}`}
                      isPending={resending(delivery)}
                      disabled={resend.isPending && !resending(delivery)}
                      onClick={() => resend.mutate({ endpointId, deliveryId: delivery.id })}
                    >
                      Resend
                    </Button>
                  </Td>
                </tr>
                {isOpen && (
                  <tr id={detailsId}>
                    <td colSpan={COLUMN_COUNT} className="border-b border-ink-100 bg-ink-50 px-5 py-3">
                      <DeliveryAttempts delivery={delivery} />
                    </td>
                  </tr>
                )}
              </Fragment>
            );
          })}
        </tbody>
      </Table>
      {deliveries.hasNextPage && (
        <div className="flex justify-center border-t border-ink-100 px-5 py-3">
          <Button variant="secondary" size="sm" isPending={deliveries.isFetchingNextPage} onClick={() => deliveries.fetchNextPage()}>
            Show older deliveries
          </Button>
        </div>
      )}
    </>
  );
}
