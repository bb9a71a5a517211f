import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import express, { type NextFunction, type Request, type Response } from 'express';
import { LOCAL_FAKE_SECRET_KEY } from '@server/billing/billing-config';
import { apiRouter } from './api/api-router';
import { catalogueFromPlans, type CatalogueEntry } from './objects/catalogue';
import { pagesRouter } from './pages/pages-router';
import { createProviderState, type ProviderState } from './state';
import { loadStateFile, saveStateFile } from './state-file';
import { deliverEvent, type WebhookDelivery } from './webhooks/events';

export interface PaymentProviderFakeOptions {
  /** Where signed events are POSTed; may be set later with `setWebhookUrl` (e.g. once our server listens). */
  webhookUrl?: string | null;
  webhookSecret: string;
  /** 0 (default) picks a free port. */
  port?: number;
  host?: string;
  /** The only API key accepted; defaults to the key the billing client uses without a real key. */
  apiKey?: string;
  /** Products and prices present from the start; defaults to our plans. */
  catalogue?: readonly CatalogueEntry[];
  /**
   * JSON file that keeps the fake's objects across restarts (development: under the ignored data folder).
   * Without it everything is in memory and starts fresh. Use a fixed `port` with it, since stored URLs name it.
   */
  statePath?: string;
}

export interface PaymentProviderFake {
  /** e.g. http://127.0.0.1:41234 — PAYMENTS_API_BASE for the billing client. */
  baseUrl: string;
  port: number;
  state: ProviderState;
  setWebhookUrl(url: string | null): void;
  /** Sends a recorded event again (one attempt), e.g. after the endpoint was down. */
  resendEvent(eventId: string): Promise<WebhookDelivery>;
  stop(): Promise<void>;
}

const LOOPBACK_HOSTS = new Set(['127.0.0.1', 'localhost', '[::1]', '::1']);

function requireLoopbackWebhookUrl(url: string | null): string | null {
  if (url === null) return null;
  const parsed = new URL(url);
  if (!LOOPBACK_HOSTS.has(parsed.hostname)) {
    throw new Error(`The local payment fake delivers webhooks to loopback addresses only, not ${parsed.hostname}.`);
  }
  return url;
}

/**
 * A local stand-in for the payment provider: its REST API subset (form-encoded requests, JSON objects in the
 * provider's shapes) for the official SDK, hosted checkout and portal pages, and signed webhooks.
 */
export async function startPaymentProviderFake(options: PaymentProviderFakeOptions): Promise<PaymentProviderFake> {
  const host = options.host ?? '127.0.0.1';
  if (!LOOPBACK_HOSTS.has(host)) throw new Error(`The local payment fake binds to a loopback address only, not ${host}.`);
  const state = createProviderState({
    apiKey: options.apiKey ?? LOCAL_FAKE_SECRET_KEY,
    webhookUrl: requireLoopbackWebhookUrl(options.webhookUrl ?? null),
    webhookSecret: options.webhookSecret,
    catalogue: options.catalogue ?? catalogueFromPlans(),
  });

  const statePath = options.statePath;
  if (statePath && !loadStateFile(statePath, state)) saveStateFile(statePath, state);

  const app = express();
  app.disable('x-powered-by');
  app.set('query parser', 'extended');
  if (statePath) {
    app.use((request, response, next) => {
      if (request.method !== 'GET') response.on('finish', () => saveStateFile(statePath, state));
      next();
    });
  }
  app.use(apiRouter(state));
  app.use(pagesRouter(state));
  app.use((_request: Request, response: Response) => {
    response.status(404).type('text').send('Not found on the local payment provider.');
  });
  app.use((error: unknown, _request: Request, response: Response, _next: NextFunction) => {
    response.status(500).type('text').send(`Local payment provider fault: ${error instanceof Error ? error.message : String(error)}`);
  });

  const server = await new Promise<Server>((resolve, reject) => {
    const listening = app.listen(options.port ?? 0, host, (error?: Error) => (error ? reject(error) : resolve(listening)));
  });
  const port = (server.address() as AddressInfo).port;
  state.baseUrl = `http://${host.includes(':') && !host.startsWith('[') ? `[${host}]` : host}:${port}`;

  return {
    baseUrl: state.baseUrl,
    port,
    state,
    setWebhookUrl(url) {
      state.webhook.url = requireLoopbackWebhookUrl(url);
    },
    async resendEvent(eventId) {
      const event = state.events.find((candidate) => candidate.id === eventId);
      if (!event) throw new Error(`No event ${eventId} was recorded.`);
      return deliverEvent(state, event);
    },
    stop: () =>
      new Promise<void>((resolve, reject) => {
        server.close((error) => (error ? reject(error) : resolve()));
        // The SDK keeps connections alive; close them so stopping does not wait for their idle timeout.
        server.closeAllConnections();
      }),
  };
}
