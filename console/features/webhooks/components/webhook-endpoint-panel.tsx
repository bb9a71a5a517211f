import { useState } from 'react';
import { ProblemAlert } from '@console/components/ui/alert';
import { Badge } from '@console/components/ui/badge';
import { Button } from '@console/components/ui/button';
import { ConfirmDialog } from '@console/components/ui/confirm-dialog';
import { useNotify } from '@console/components/ui/notifications';
import { Panel } from '@console/components/ui/panel';
import { formatDateTime } from '@console/utils/format-date';
import type { WebhookEndpoint } from '@shared/schemas/webhooks';
import { useDeleteWebhookEndpoint } from '../api/delete-webhook-endpoint';
import { useRotateWebhookSecret } from '../api/rotate-webhook-secret';
import { useUpdateWebhookEndpoint } from '../api/update-webhook-endpoint';
import { endpointStatus } from '../utils/delivery-display';
import { BreakableUrl } from './breakable-url';
import { EventTypeChips } from './event-type-chips';
import type { ShownSecret } from './webhook-secret-dialog';

type WebhookEndpointPanelProps = {
  endpoint: WebhookEndpoint;
  onSecret: (shown: ShownSecret) => void;
  onDeleted: () => void;
};

type Pending = 'rotate' | 'delete' | null;

/** The endpoint's settings and what an admin can do with it: pause or resume, rotate the secret, delete. */
export function WebhookEndpointPanel({ endpoint, onSecret, onDeleted }: WebhookEndpointPanelProps) {
  const notify = useNotify();
  const [confirming, setConfirming] = useState<Pending>(null);
  const status = endpointStatus(endpoint);

  const update = useUpdateWebhookEndpoint({
    onSuccess: (changed) =>
      notify(changed.enabled ? 'Deliveries resumed; waiting events go out now.' : 'Deliveries paused; new events wait until you resume.'),
  });
  const rotate = useRotateWebhookSecret({
    onSuccess: (rotated) => {
      setConfirming(null);
      onSecret({ ...rotated, reason: 'rotated' });
    },
  });
  const remove = useDeleteWebhookEndpoint({
    onSuccess: () => {
      setConfirming(null);
      notify('Webhook endpoint deleted with its delivery log.');
      onDeleted();
    },
  });

  return (
    <Panel
      title="Endpoint"
      actions={
        <>
          <Button
            variant="secondary"
            size="sm"
            isPending={update.isPending}
            onClick={() => update.mutate({ endpointId: endpoint.id, changes: { enabled: !endpoint.enabled } })}
          >
            {endpoint.enabled ? 'Pause deliveries' : 'Resume deliveries'}
          </Button>
          <Button
            variant="secondary"
            size="sm"
            onClick={() => {
              rotate.reset();
              setConfirming('rotate');
            }}
          >
            Rotate secret
          </Button>
          <Button
            variant="ghost-danger"
            size="sm"
            onClick={() => {
              remove.reset();
              setConfirming('delete');
            }}
          >
            Delete
          </Button>
        </>
      }
    >
      {update.error ? <ProblemAlert error={update.error} className="mb-4" /> : null}
      <dl className="grid gap-x-6 gap-y-4 text-sm sm:grid-cols-2 xl:grid-cols-4">
        <div className="space-y-1 sm:col-span-2">
          <dt className="font-mono text-eyebrow font-semibold text-ink-600 uppercase">URL</dt>
          <dd className="font-mono text-xs break-words text-ink-900">
            <BreakableUrl url={endpoint.url} />
          </dd>
        </div>
        <div className="space-y-1">
          <dt className="font-mono text-eyebrow font-semibold text-ink-600 uppercase">Status</dt>
          <dd>
            <Badge tone={status.tone}>{status.label}</Badge>
          </dd>
        </div>
        <div className="space-y-1">
          <dt className="font-mono text-eyebrow font-semibold text-ink-600 uppercase">Events</dt>
          <dd>
            <EventTypeChips eventTypes={endpoint.eventTypes} />
          </dd>
        </div>
        {endpoint.description && (
          <div className="space-y-1 sm:col-span-2">
            <dt className="font-mono text-eyebrow font-semibold text-ink-600 uppercase">Description</dt>
            <dd className="text-ink-800">{endpoint.description}</dd>
          </div>
        )}
        {endpoint.previousSecretExpiresAt && (
          <div className="space-y-1 sm:col-span-2">
            <dt className="font-mono text-eyebrow font-semibold text-ink-600 uppercase">Previous secret</dt>
            <dd className="text-ink-800">Still signs beside the new one until {formatDateTime(endpoint.previousSecretExpiresAt)}.</dd>
          </div>
        )}
      </dl>
      {endpoint.disabledReason === 'gone' && (
        <p className="mt-4 text-sm text-ink-700">
          The receiver answered 410 Gone, so Sweepline stopped sending. Resume once the receiver is back.
        </p>
      )}
      <ConfirmDialog
        open={confirming === 'rotate'}
        tone="primary"
        title="Rotate the signing secret?"
        description={
          <p>
            A new secret signs every delivery from now on. For 24 hours the old one signs beside it, so the receiver can
            switch over without refusing events. The new secret is shown once.
          </p>
        }
        confirmLabel="Rotate secret"
        onConfirm={() => rotate.mutate({ endpointId: endpoint.id })}
        onCancel={() => setConfirming(null)}
        isPending={rotate.isPending}
        error={rotate.error}
      />
      <ConfirmDialog
        open={confirming === 'delete'}
        title="Delete this webhook endpoint?"
        description={
          <p>
            Sweepline stops sending to <span className="font-mono break-words text-ink-800">
              <BreakableUrl url={endpoint.url} />
            </span>; waiting
            deliveries and the delivery log are deleted with it. This cannot be undone.
          </p>
        }
        confirmLabel="Delete endpoint"
        onConfirm={() => remove.mutate(endpoint.id)}
        onCancel={() => setConfirming(null)}
        isPending={remove.isPending}
        error={remove.error}
      />
    </Panel>
  );
}
