import type { AddressInfo } from 'node:net';
import { SMTPServer, type SMTPServerDataStream, type SMTPServerSession } from 'smtp-server';
import { isLoopbackAddress } from './loopback';
import { parseEmail } from './mime/parse-message';
import { createOutbox, type Outbox } from './outbox';

export interface SmtpFakeOptions {
  /** 0 (default) picks a free port. */
  port?: number;
  /** Loopback only; anything else is refused. */
  host?: string;
  /** Larger messages are refused with 552; default 1 MiB (our messages are a few kB). */
  maxMessageBytes?: number;
  /** Outbox capacity; the oldest messages are dropped first. */
  maxStoredMessages?: number;
}

export interface SmtpFake {
  host: string;
  port: number;
  /** `smtp://127.0.0.1:<port>`, ready for SMTP_URL. */
  url: string;
  outbox: Outbox;
  stop(): Promise<void>;
}

const DEFAULT_MAX_MESSAGE_BYTES = 1024 * 1024;
const CLOSE_TIMEOUT_MS = 1_000;
const MAX_CLIENTS = 20;

/**
 * An SMTP server inside this process that accepts every message from loopback clients and keeps it in an
 * in-memory outbox, so development and tests can read what the product sends without a mailbox.
 */
export async function startSmtpFake(options: SmtpFakeOptions = {}): Promise<SmtpFake> {
  const host = options.host ?? '127.0.0.1';
  if (!isLoopbackAddress(host)) {
    throw new Error(`The local SMTP fake binds to a loopback address only, not ${host}.`);
  }
  const maxMessageBytes = options.maxMessageBytes ?? DEFAULT_MAX_MESSAGE_BYTES;
  const outbox = createOutbox(options.maxStoredMessages);

  const server = new SMTPServer({
    secure: false,
    // No login and no TLS: a loopback catcher has nothing to protect, and a self-signed STARTTLS would only
    // make clients fail certificate checks.
    authOptional: true,
    disabledCommands: ['AUTH', 'STARTTLS'],
    size: maxMessageBytes,
    rejectOversized: true,
    maxClients: MAX_CLIENTS,
    closeTimeout: CLOSE_TIMEOUT_MS,
    banner: 'Sweepline local mail catcher',
    logger: false,
    onConnect(session, callback) {
      if (!isLoopbackAddress(session.remoteAddress)) {
        const refusal = Object.assign(new Error('Only loopback clients may use this mail catcher.'), { responseCode: 554 });
        callback(refusal);
        return;
      }
      callback();
    },
    onData(stream, session, callback) {
      receiveMessage(stream, session, maxMessageBytes, outbox)
        .then(() => callback())
        .catch((error: Error) => callback(error));
    },
  });

  await new Promise<void>((resolve, reject) => {
    const onError = (error: Error) => reject(error);
    server.once('error', onError);
    server.listen(options.port ?? 0, host, () => {
      server.off('error', onError);
      resolve();
    });
  });
  // Later socket errors (a client hanging up mid-command) are per connection; never crash the process.
  server.on('error', () => undefined);

  const port = (server.server.address() as AddressInfo).port;
  return {
    host,
    port,
    url: `smtp://${host}:${port}`,
    outbox,
    stop: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}

async function receiveMessage(
  stream: SMTPServerDataStream,
  session: SMTPServerSession,
  maxMessageBytes: number,
  outbox: Outbox,
): Promise<void> {
  const chunks: Buffer[] = [];
  let sizeBytes = 0;
  for await (const chunk of stream as AsyncIterable<Buffer>) {
    sizeBytes += chunk.length;
    // Keep draining an oversized stream (the server answers 552 itself) but stop holding its bytes.
    if (sizeBytes <= maxMessageBytes) chunks.push(chunk);
  }
  if (stream.sizeExceeded || sizeBytes > maxMessageBytes) {
    throw Object.assign(new Error(`Message exceeds the ${maxMessageBytes} byte limit of the local mail catcher.`), { responseCode: 552 });
  }
  const raw = Buffer.concat(chunks);
  outbox.add({
    ...parseEmail(raw),
    receivedAt: new Date(),
    envelope: {
      mailFrom: session.envelope.mailFrom ? session.envelope.mailFrom.address : null,
      rcptTo: session.envelope.rcptTo.map((recipient) => recipient.address),
    },
    sizeBytes,
    raw: raw.toString('utf8'),
  });
}
