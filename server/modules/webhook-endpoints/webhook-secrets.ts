import type { AppDeps } from '@server/deps';
import { deriveKey } from '@server/lib/crypto';
import { openSecret, sealSecret } from '@server/webhooks/secret-box';
import type { WebhookEndpointRow } from './webhook-endpoints.repo';

const keys = new Map<string, Buffer>();

/** The sealing key is derived from the server secret, so no second secret needs configuring. */
function sealingKey(deps: Pick<AppDeps, 'config'>): Buffer {
  const secret = deps.config.sessionSecret;
  let key = keys.get(secret);
  if (!key) {
    key = deriveKey(secret, 'webhook-secret-box');
    keys.set(secret, key);
  }
  return key;
}

export function sealEndpointSecret(deps: Pick<AppDeps, 'config'>, endpointId: string, secret: string): string {
  return sealSecret(secret, sealingKey(deps), endpointId);
}

/** The secrets that sign a delivery now: the current one, plus the previous one during its grace period. */
export function signingSecrets(deps: Pick<AppDeps, 'config'>, endpoint: WebhookEndpointRow, now: Date): string[] {
  const key = sealingKey(deps);
  const secrets = [openSecret(endpoint.secretSealed, key, endpoint.id)];
  if (endpoint.previousSecretSealed && endpoint.previousSecretExpiresAt && endpoint.previousSecretExpiresAt.getTime() > now.getTime()) {
    secrets.push(openSecret(endpoint.previousSecretSealed, key, endpoint.id));
  }
  return secrets;
}
