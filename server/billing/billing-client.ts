import Stripe from 'stripe';
import { BillingError } from './billing-error';
import { LOCAL_FAKE_SECRET_KEY, type BillingConfig } from './billing-config';

const REQUEST_TIMEOUT_MS = 20_000;
const MAX_NETWORK_RETRIES = 2;
const LOOPBACK_HOSTS = new Set(['127.0.0.1', 'localhost', '::1', '[::1]']);

/**
 * The provider's official SDK, configured. Without a real key it is pointed at the local fake (which must be
 * on loopback); with a real key it talks to the provider unless `apiBaseUrl` overrides the address.
 */
export function createBillingClient(config: BillingConfig): Stripe {
  const usesLocalFake = !config.secretKey || config.secretKey === LOCAL_FAKE_SECRET_KEY;
  if (usesLocalFake && !config.apiBaseUrl) {
    throw new BillingError('billing_not_configured', 'Without a payment provider key, the address of the local fake (PAYMENTS_API_BASE) is required.', {
      status: 500,
    });
  }
  const address = config.apiBaseUrl ? parseApiBaseUrl(config.apiBaseUrl) : undefined;
  if (usesLocalFake && !LOOPBACK_HOSTS.has(address?.host ?? '')) {
    throw new BillingError('billing_not_configured', 'The local payment fake is reached on loopback only; set a real key to use another address.', {
      status: 500,
    });
  }
  return new Stripe(config.secretKey ?? LOCAL_FAKE_SECRET_KEY, {
    ...address,
    maxNetworkRetries: MAX_NETWORK_RETRIES,
    timeout: REQUEST_TIMEOUT_MS,
    telemetry: false,
    appInfo: { name: 'Sweepline' },
  });
}

function parseApiBaseUrl(apiBaseUrl: string): { host: string; port: number; protocol: 'http' | 'https' } {
  let url: URL;
  try {
    url = new URL(apiBaseUrl);
  } catch (cause) {
    throw new BillingError('billing_not_configured', `The payment API address "${apiBaseUrl}" is not a URL.`, { status: 500, cause });
  }
  if (url.protocol !== 'http:' && url.protocol !== 'https:') {
    throw new BillingError('billing_not_configured', 'The payment API address must be http:// or https://.', { status: 500 });
  }
  if (url.pathname !== '/' && url.pathname !== '') {
    throw new BillingError('billing_not_configured', 'The payment API address is an origin only (the SDK adds /v1/…).', { status: 500 });
  }
  const protocol = url.protocol === 'https:' ? 'https' : 'http';
  return { host: url.hostname, port: url.port ? Number(url.port) : protocol === 'https' ? 443 : 80, protocol };
}
