import { lookup } from 'node:dns/promises';
import type { LookupAddress } from 'node:dns';
import { Agent } from 'undici';
import { blockedAddressReason, parseIpAddress } from './ip-ranges';
import { WebhookError } from './webhook-error';

/**
 * Server-side request forgery guard for webhook deliveries (Standard Webhooks v1.0.0 "Server side request
 * forgery"; OWASP API Security Top 10 2023, API7). A customer-supplied URL is checked statically, its host is
 * resolved once, every resolved address must be public, and the connection is then pinned to those checked
 * addresses so a second DNS answer (rebinding) can never redirect it.
 */

export interface EgressPolicy {
  /** Plain http:// targets. Only for development and tests; production sends over HTTPS only. */
  allowHttp: boolean;
  /** Loopback, private and other non-public targets. Only for development and tests (local receivers). */
  allowPrivateTargets: boolean;
  /** Ports a target may use; 'any' only makes sense together with allowPrivateTargets. */
  allowedPorts: readonly number[] | 'any';
}

export const STRICT_EGRESS_POLICY: EgressPolicy = Object.freeze({
  allowHttp: false,
  allowPrivateTargets: false,
  allowedPorts: Object.freeze([80, 443]),
});

export type RuntimeEnvironment = 'production' | 'development' | 'test';

/** Strict everywhere except development and test, where local http receivers on any port are allowed. */
export function egressPolicyFor(environment: RuntimeEnvironment, overrides: Partial<EgressPolicy> = {}): EgressPolicy {
  const base: EgressPolicy =
    environment === 'production' ? STRICT_EGRESS_POLICY : { allowHttp: true, allowPrivateTargets: true, allowedPorts: 'any' };
  return { ...base, ...overrides };
}

export interface ResolvedAddress {
  address: string;
  family: 4 | 6;
}

/** Every address a host name resolves to. Injected in tests; the default asks the system resolver. */
export type HostResolver = (hostname: string) => Promise<ResolvedAddress[]>;

export const systemHostResolver: HostResolver = async (hostname) => {
  const answers: LookupAddress[] = await lookup(hostname, { all: true });
  return answers.map((answer) => ({ address: answer.address, family: answer.family === 6 ? 6 : 4 }));
};

export interface ResolvedWebhookTarget {
  url: URL;
  /** Host name without IPv6 brackets. */
  hostname: string;
  port: number;
  /** The checked addresses the connection may use, in resolver order. */
  addresses: ResolvedAddress[];
}

const MAX_URL_LENGTH = 2048;
// RFC 6761 §6.3 (localhost), RFC 6762 (.local, multicast DNS), RFC 8375 (home.arpa); ".internal" is reserved
// for private use (ICANN, 2024; from memory). Single-label names are refused too: search domains can turn them
// into internal hosts.
const PRIVATE_NAME_SUFFIXES = ['.localhost', '.local', '.internal', '.home.arpa'];

function isPrivateHostName(hostname: string): boolean {
  const name = hostname.toLowerCase().replace(/\.$/, '');
  return name === 'localhost' || !name.includes('.') || PRIVATE_NAME_SUFFIXES.some((suffix) => name.endsWith(suffix));
}

function refuseAddress(address: string, policy: EgressPolicy): void {
  const parsed = parseIpAddress(address);
  if (!parsed) throw new WebhookError('address_not_allowed', `"${address}" is not an IP address.`);
  const reason = blockedAddressReason(parsed);
  // Instance-metadata endpoints hold cloud credentials: refused even where local receivers are allowed.
  if (reason && (reason === 'metadata' || !policy.allowPrivateTargets)) {
    throw new WebhookError('address_not_allowed', `Webhook targets may not be ${reason.replaceAll('_', ' ')} addresses.`, {
      reason,
    });
  }
}

/**
 * Static checks, no network: scheme, credentials, port, literal addresses and private host names. Use it when
 * an endpoint is created or updated, so a bad URL is a 422 at once rather than a failed delivery later.
 */
export function checkWebhookUrl(rawUrl: string, policy: EgressPolicy): URL {
  if (rawUrl.length > MAX_URL_LENGTH) throw new WebhookError('invalid_url', `Webhook URLs are at most ${MAX_URL_LENGTH} characters.`);
  let url: URL;
  try {
    url = new URL(rawUrl);
  } catch {
    throw new WebhookError('invalid_url', 'The webhook URL is not an absolute URL.');
  }
  const httpsOnly = !policy.allowHttp;
  if (url.protocol !== 'https:' && !(url.protocol === 'http:' && !httpsOnly)) {
    throw new WebhookError('scheme_not_allowed', httpsOnly ? 'Webhook URLs must use https.' : 'Webhook URLs must use http or https.');
  }
  if (url.username || url.password) {
    throw new WebhookError('credentials_in_url', 'Webhook URLs may not carry a user name or password.');
  }
  const port = webhookPort(url);
  if (policy.allowedPorts !== 'any' && !policy.allowedPorts.includes(port)) {
    throw new WebhookError('port_not_allowed', `Webhook URLs may use port ${policy.allowedPorts.join(' or ')} only.`, { port });
  }
  const hostname = bareHostname(url);
  if (parseIpAddress(hostname)) {
    refuseAddress(hostname, policy);
  } else if (!policy.allowPrivateTargets && isPrivateHostName(hostname)) {
    throw new WebhookError('host_not_allowed', `Webhook targets may not be local or internal host names ("${hostname}").`);
  }
  return url;
}

function webhookPort(url: URL): number {
  if (url.port) return Number(url.port);
  return url.protocol === 'https:' ? 443 : 80;
}

function bareHostname(url: URL): string {
  return url.hostname.replace(/^\[(.*)\]$/, '$1');
}

/**
 * Static checks, then DNS. Refuses the target when ANY resolved address is non-public: a name answering both a
 * public and a private address would otherwise be one lucky connection away from the internal network.
 */
export async function resolveWebhookTarget(
  rawUrl: string,
  policy: EgressPolicy,
  resolveHost: HostResolver = systemHostResolver,
): Promise<ResolvedWebhookTarget> {
  const url = checkWebhookUrl(rawUrl, policy);
  const hostname = bareHostname(url);
  const port = webhookPort(url);
  const literal = parseIpAddress(hostname);
  if (literal) return { url, hostname, port, addresses: [{ address: hostname, family: literal.family }] };

  let addresses: ResolvedAddress[];
  try {
    addresses = await resolveHost(hostname);
  } catch (error) {
    const code = (error as { code?: string }).code ?? 'unknown';
    throw new WebhookError('dns_resolution_failed', `The webhook host "${hostname}" did not resolve (${code}).`, { dnsCode: code });
  }
  if (addresses.length === 0) {
    throw new WebhookError('dns_resolution_failed', `The webhook host "${hostname}" has no addresses.`);
  }
  for (const { address } of addresses) refuseAddress(address, policy);
  return { url, hostname, port, addresses };
}

export type LookupCallback = (error: NodeJS.ErrnoException | null, address: string | LookupAddress[], family?: number) => void;
export type PinnedLookup = (hostname: string, options: { all?: boolean }, callback: LookupCallback) => void;

/**
 * A `lookup` for net/tls.connect that answers only the target's host name, and only with its checked
 * addresses (all of them when asked for all, as Node's happy-eyeballs connect does).
 */
export function createPinnedLookup(target: ResolvedWebhookTarget): PinnedLookup {
  return (hostname, options, callback) => {
    if (hostname.replace(/^\[(.*)\]$/, '$1').toLowerCase() !== target.hostname.toLowerCase()) {
      const error: NodeJS.ErrnoException = new Error(`Connection to "${hostname}" is outside the pinned target.`);
      error.code = 'ERR_EGRESS_NOT_PINNED';
      callback(error, '');
      return;
    }
    if (options.all) callback(null, target.addresses.map(({ address, family }) => ({ address, family })));
    else callback(null, target.addresses[0].address, target.addresses[0].family);
  };
}

/**
 * An undici Agent whose every connection goes to the target's checked addresses. The URL keeps its host name,
 * so the Host header, TLS SNI and certificate check still use the name; only the address lookup is replaced.
 */
export function createPinnedDispatcher(target: ResolvedWebhookTarget, options: { connectTimeoutMs?: number } = {}): Agent {
  return new Agent({
    connect: { lookup: createPinnedLookup(target) as never, ...(options.connectTimeoutMs ? { timeout: options.connectTimeoutMs } : {}) },
    // One delivery, one connection: nothing pooled outlives the checked answer.
    pipelining: 0,
    connections: 1,
  });
}
