import { useId, useRef } from 'react';
import { Alert } from '@console/components/ui/alert';
import { Button } from '@console/components/ui/button';
import { Dialog } from '@console/components/ui/dialog';
import { controlClasses } from '@console/components/ui/field';
import { Icon } from '@console/components/ui/icons';
import { useCopyToClipboard } from '@console/hooks/use-copy-to-clipboard';
import { cn } from '@console/utils/cn';
import { formatDateTime } from '@console/utils/format-date';
import type { CreatedWebhookEndpoint } from '@shared/schemas/webhooks';
import { BreakableUrl } from './breakable-url';

export type ShownSecret = CreatedWebhookEndpoint & { reason: 'created' | 'rotated' };

const copyMessages = {
  idle: '',
  copied: 'Signing secret copied to the clipboard.',
  failed: 'Copying was blocked by the browser. Select the secret and press Ctrl+C (⌘C on a Mac).',
} as const;

/** The only place a signing secret ever appears; closing the dialog forgets it for good. */
export function WebhookSecretDialog({ shown, onClose }: { shown: ShownSecret | null; onClose: () => void }) {
  const secretId = useId();
  const secretRef = useRef<HTMLTextAreaElement>(null);
  const { state, copy } = useCopyToClipboard();
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
          <div className="space-y-1.5">
            <label htmlFor={secretId} className="text-sm font-semibold text-ink-800">
              Signing secret
            </label>
            <div className="flex items-start gap-2">
              <textarea
                id={secretId}
                ref={secretRef}
                readOnly
                rows={2}
                value={shown.secret}
                spellCheck={false}
                autoComplete="off"
                onFocus={(event) => event.currentTarget.select()}
                className={cn(controlClasses, 'resize-none py-2 font-mono text-xs leading-5 break-all')}
                data-testid="webhook-secret"
              />
              <Button variant="secondary" onClick={() => copy(shown.secret, secretRef.current)}>
                <Icon name={state === 'copied' ? 'check' : 'copy'} className="size-4" />
                {state === 'copied' ? 'Copied' : 'Copy'}
              </Button>
            </div>
            <p role="status" className="min-h-4 text-xs text-ink-600">
              {copyMessages[state]}
            </p>
          </div>
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
