import { useId, useRef } from 'react';
import { Alert } from '@console/components/ui/alert';
import { Button } from '@console/components/ui/button';
import { Dialog } from '@console/components/ui/dialog';
import { controlClasses } from '@console/components/ui/field';
import { Icon } from '@console/components/ui/icons';
import { useCopyToClipboard } from '@console/hooks/use-copy-to-clipboard';
import { cn } from '@console/utils/cn';
import type { CreatedApiKey } from '@shared/schemas/api-keys';

const copyMessages = {
  idle: '',
  copied: 'Secret copied to the clipboard.',
  failed: 'Copying was blocked by the browser. Select the secret and press Ctrl+C (⌘C on a Mac).',
} as const;

/** The only place the full secret ever appears; closing it forgets the secret for good. */
export function ApiKeySecretDialog({ created, onClose }: { created: CreatedApiKey | null; onClose: () => void }) {
  const secretId = useId();
  const secretRef = useRef<HTMLTextAreaElement>(null);
  const { state, copy } = useCopyToClipboard();

  return (
    <Dialog
      open={created !== null}
      onClose={onClose}
      closeOnBackdropClick={false}
      initialFocusRef={secretRef}
      title="Store your new API key now"
      description={created && <p>Key “{created.apiKey.name}” was created.</p>}
      footer={<Button onClick={onClose}>I have stored the secret</Button>}
    >
      {created && (
        <div className="space-y-4">
          <Alert tone="warning" title="This secret will not be shown again.">
            <p>
              Put it in the rig’s secret store, such as the environment or credential vault its test script reads
              from. Never commit it to source control or paste it into tickets. If it is lost, revoke this key and
              create a new one.
            </p>
          </Alert>
          <div className="space-y-1.5">
            <label htmlFor={secretId} className="text-sm font-semibold text-ink-800">
              Secret
            </label>
            <div className="flex items-start gap-2">
              <textarea
                id={secretId}
                ref={secretRef}
                readOnly
                rows={2}
                value={created.secret}
                spellCheck={false}
                autoComplete="off"
                onFocus={(event) => event.currentTarget.select()}
                className={cn(controlClasses, 'resize-none py-2 font-mono text-xs leading-5 break-all')}
                data-testid="api-key-secret"
              />
              <Button variant="secondary" onClick={() => copy(created.secret, secretRef.current)}>
                <Icon name={state === 'copied' ? 'check' : 'copy'} className="size-4" />
                {state === 'copied' ? 'Copied' : 'Copy'}
              </Button>
            </div>
            <p role="status" className="min-h-4 text-xs text-ink-600">
              {copyMessages[state]}
            </p>
          </div>
          <div className="rounded-md bg-ink-950 px-4 py-3 font-mono text-xs text-ink-200">
            <p className="text-ink-400"># every request from the rig</p>
            <p>
              Authorization: Bearer <span className="text-signal-300">$SWEEPLINE_API_KEY</span>
            </p>
          </div>
        </div>
      )}
    </Dialog>
  );
}
