import { useRef } from 'react';
import { Alert } from '@console/components/ui/alert';
import { Button } from '@console/components/ui/button';
import { Dialog } from '@console/components/ui/dialog';
import { SecretField } from '@console/components/ui/secret-field';
import { formatDateTime } from '@console/utils/format-date';
import type { CreatedWebhookEndpoint } from '@shared/schemas/webhooks';
import { BreakableUrl } from './breakable-url';

export type ShownSecret = CreatedWebhookEndpoint & { reason: 'created' | 'rotated' };

/** The only place a signing secret ever appears; closing the dialog forgets it for good. */
export function WebhookSecretDialog({ shown, onClose }: { shown: ShownSecret | null; onClose: () => void }) {
  const secretRef = useRef<HTMLTextAreaElement>(null);
  const rotated = shown?.reason === 'rotated';

  return (
    <Dialog
      open={shown !== null}
      onClose={onClose}
      closeOnBackdropClick={false}
      initialFocusRef={secretRef}
      title={rotated ? 'Store the new signing secret now' : 'Store the signing secret now'}
      description={
        shown && (
          <p>
            {rotated ? 'A new secret signs deliveries to ' : 'Sweepline will sign every delivery to '}
            <span className="font-mono break-words text-ink-800">
              <BreakableUrl url={shown.endpoint.url} />
            </span> with it.
          </p>
        )
      }
      footer={<Button onClick={onClose}>I have stored the secret</Button>}
    >
      {shown && (
        <div className="space-y-4">
          <Alert tone="warning" title="This secret will not be shown again.">
            <p>
              Put it in the receiver’s secret store now; the receiver needs it to check the webhook-signature header
              of every delivery. If it is lost, rotate the secret here and store the new one.
            </p>
            {rotated && shown.endpoint.previousSecretExpiresAt && (
              <p className="mt-1">
                Until {formatDateTime(shown.endpoint.previousSecretExpiresAt)} each delivery carries two
                signatures, one per secret, so the receiver can switch without losing events.
              </p>
            )}
          </Alert>
          <SecretField label="Signing secret" secret={shown.secret} inputRef={secretRef} copiedMessage="Signing secret copied to the clipboard." testId="webhook-secret" />
          <div className="rounded-md bg-ink-950 px-4 py-3 font-mono text-xs text-ink-200">
            <p className="text-ink-400"># on the receiver, e.g. with the rig examples</p>
            <p>
              SWEEPLINE_WEBHOOK_SECRET=<span className="text-signal-300">whsec_…</span>
            </p>
          </div>
        </div>
      )}
    </Dialog>
  );
}
