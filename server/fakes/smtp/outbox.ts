import type { ParsedEmail } from './mime/parse-message';

/** One message the local SMTP fake accepted. */
export interface CaughtEmail extends ParsedEmail {
  /** Sequential id within this outbox ("1", "2", …), stable until `clear()`. */
  id: string;
  receivedAt: Date;
  /** SMTP envelope: who the client said it was sending for and to (may differ from the headers, e.g. Bcc). */
  envelope: { mailFrom: string | null; rcptTo: string[] };
  sizeBytes: number;
  /** The message as received, for a "view source" link. */
  raw: string;
}

export type EmailPredicate = (email: CaughtEmail) => boolean;
export type EmailListener = (email: CaughtEmail) => void;

export interface Outbox {
  /** Messages in arrival order (oldest first). */
  list(): CaughtEmail[];
  get(id: string): CaughtEmail | undefined;
  clear(): void;
  /** Called for every new message; returns the function that stops listening. */
  onMessage(listener: EmailListener): () => void;
  /** The first message, already caught or still to come, that matches; rejects after `timeoutMs`. */
  waitFor(predicate: EmailPredicate, timeoutMs?: number): Promise<CaughtEmail>;
  /** Used by the SMTP fake only. */
  add(email: Omit<CaughtEmail, 'id'>): CaughtEmail;
}

const DEFAULT_WAIT_MS = 5_000;

/** In-memory, bounded: the oldest messages go first once `maxMessages` is reached. */
export function createOutbox(maxMessages = 200): Outbox {
  let messages: CaughtEmail[] = [];
  let nextId = 1;
  const listeners = new Set<EmailListener>();

  const onMessage = (listener: EmailListener) => {
    listeners.add(listener);
    return () => {
      listeners.delete(listener);
    };
  };

  return {
    list: () => [...messages],
    get: (id) => messages.find((email) => email.id === id),
    clear() {
      messages = [];
      nextId = 1;
    },
    onMessage,
    waitFor(predicate, timeoutMs = DEFAULT_WAIT_MS) {
      const already = messages.find(predicate);
      if (already) return Promise.resolve(already);
      return new Promise((resolve, reject) => {
        const timer = setTimeout(() => {
          stop();
          reject(new Error(`No matching e-mail reached the local outbox within ${timeoutMs} ms (${messages.length} caught).`));
        }, timeoutMs);
        const stop = onMessage((email) => {
          if (!predicate(email)) return;
          clearTimeout(timer);
          stop();
          resolve(email);
        });
      });
    },
    add(email) {
      const caught: CaughtEmail = { ...email, id: String(nextId++) };
      messages.push(caught);
      if (messages.length > maxMessages) messages = messages.slice(messages.length - maxMessages);
      for (const listener of [...listeners]) {
        try {
          listener(caught);
        } catch {
          // A faulty listener (a test helper, the console page) must not break delivery to the others.
        }
      }
      return caught;
    },
  };
}
