import { useRef } from 'react';
import { Alert } from '@console/components/ui/alert';
import { Button } from '@console/components/ui/button';
import { Dialog } from '@console/components/ui/dialog';
import { SecretField } from '@console/components/ui/secret-field';
import type { CreatedApiKey } from '@shared/schemas/api-keys';

/** The only place the full secret ever appears; closing it forgets the secret for good. */
export function ApiKeySecretDialog({ created, onClose }: { created: CreatedApiKey | null; onClose: () => void }) {
  const secretRef = useRef<HTMLTextAreaElement>(null);

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
          <SecretField label="Secret" secret={created.secret} inputRef={secretRef} copiedMessage="Secret copied to the clipboard." testId="api-key-secret" />
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
