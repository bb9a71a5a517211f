import type { CaughtEmail } from './outbox';

/** A caught message as a dev-only outbox page shows it (JSON-safe, no raw source). */
export interface OutboxEntry {
  id: string;
  receivedAt: string;
  from: string[];
  to: string[];
  subject: string;
  text: string | null;
  html: string | null;
  /** Every http(s) link in the text part, in order, e.g. an invitation's accept link. */
  links: string[];
}

export function linksIn(email: Pick<CaughtEmail, 'text'>): string[] {
  return email.text?.match(/https?:\/\/[^\s<>"]+/g) ?? [];
}

export function toOutboxEntry(email: CaughtEmail): OutboxEntry {
  const format = (address: { name: string; address: string }) => (address.name ? `${address.name} <${address.address}>` : address.address);
  return {
    id: email.id,
    receivedAt: email.receivedAt.toISOString(),
    from: email.from.map(format),
    // The envelope is what was really delivered; Bcc recipients appear only there.
    to: email.envelope.rcptTo,
    subject: email.subject,
    text: email.text,
    html: email.html,
    links: linksIn(email),
  };
}
