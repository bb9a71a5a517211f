import { createHmac } from 'node:crypto';

export const SIGNATURE_HEADER = 'Stripe-Signature';

/**
 * The provider's webhook signature: `t=<unix seconds>,v1=<hex HMAC-SHA256 of "<t>.<payload>" keyed with the
 * endpoint secret>`, the secret used as its literal UTF-8 text.
 */
export function signatureHeader(payload: string, secret: string, timestampSeconds: number): string {
  const signature = createHmac('sha256', secret).update(`${timestampSeconds}.${payload}`, 'utf8').digest('hex');
  return `t=${timestampSeconds},v1=${signature}`;
}
