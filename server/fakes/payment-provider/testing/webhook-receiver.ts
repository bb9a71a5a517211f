import { createServer } from 'node:http';
import type { AddressInfo } from 'node:net';

export interface ReceivedWebhook {
  /** The exact bytes received, as the signature covers them. */
  rawBody: string;
  signature: string | undefined;
}

export interface WebhookReceiver {
  url: string;
  received: ReceivedWebhook[];
  stop(): Promise<void>;
}

/** A loopback endpoint that answers 200 and keeps every delivery; stands in for our API's webhook route. */
export async function startWebhookReceiver(path = '/provider-webhooks'): Promise<WebhookReceiver> {
  const received: ReceivedWebhook[] = [];
  const server = createServer((request, response) => {
    const chunks: Buffer[] = [];
    request.on('data', (chunk: Buffer) => chunks.push(chunk));
    request.on('end', () => {
      const signature = request.headers['stripe-signature'];
      received.push({ rawBody: Buffer.concat(chunks).toString('utf8'), signature: typeof signature === 'string' ? signature : undefined });
      response.writeHead(200).end();
    });
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as AddressInfo;
  return {
    url: `http://127.0.0.1:${port}${path}`,
    received,
    stop: () =>
      new Promise<void>((resolve) => {
        server.close(() => resolve());
        server.closeAllConnections();
      }),
  };
}
