import nodemailer from 'nodemailer';
import { EmailError } from './email-error';
import type { MailerConfig } from './mailer-config';

export interface OutgoingEmail {
  to: string | readonly string[];
  subject: string;
  text: string;
  html?: string;
  replyTo?: string;
}

export interface SentEmail {
  messageId: string;
  accepted: string[];
  rejected: string[];
}

export interface Mailer {
  sendMail(email: OutgoingEmail): Promise<SentEmail>;
  /** Checks that the relay answers and accepts our login; for a start-up health line. */
  verify(): Promise<void>;
  close(): void;
}

const CONNECTION_TIMEOUT_MS = 10_000;
const SOCKET_TIMEOUT_MS = 30_000;

export function createMailer(config: MailerConfig): Mailer {
  const transport = nodemailer.createTransport({
    host: config.host,
    port: config.port,
    secure: config.secure,
    auth: config.auth,
    requireTLS: config.requireTls ?? false,
    connectionTimeout: CONNECTION_TIMEOUT_MS,
    greetingTimeout: CONNECTION_TIMEOUT_MS,
    socketTimeout: SOCKET_TIMEOUT_MS,
    // Our messages are built from templates only; never let a field pull in a local file or a URL.
    disableFileAccess: true,
    disableUrlAccess: true,
  });

  return {
    async sendMail(email) {
      const recipients = typeof email.to === 'string' ? [email.to] : [...email.to];
      if (recipients.length === 0 || recipients.some((address) => address.trim() === '')) {
        throw new EmailError('missing_recipient', 'An e-mail needs at least one non-empty recipient.');
      }
      if (email.subject.trim() === '') {
        throw new EmailError('missing_subject', 'An e-mail needs a subject.');
      }
      try {
        const info = await transport.sendMail({
          from: config.fromAddress,
          to: recipients,
          replyTo: email.replyTo,
          subject: email.subject,
          text: email.text,
          html: email.html,
        });
        return {
          messageId: info.messageId,
          accepted: info.accepted.map(addressText),
          rejected: info.rejected.map(addressText),
        };
      } catch (cause) {
        throw new EmailError('smtp_send_failed', `The SMTP relay at ${config.host}:${config.port} did not take the message: ${messageOf(cause)}`, { cause });
      }
    },
    async verify() {
      try {
        await transport.verify();
      } catch (cause) {
        throw new EmailError('smtp_unreachable', `The SMTP relay at ${config.host}:${config.port} cannot be used: ${messageOf(cause)}`, { cause });
      }
    },
    close() {
      transport.close();
    },
  };
}

function addressText(address: string | { address: string }): string {
  return typeof address === 'string' ? address : address.address;
}

function messageOf(error: unknown): string {
  return error instanceof Error ? error.message : String(error);
}
