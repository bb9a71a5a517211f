import type { AppConfig } from './config/env';
import type { Database } from './db/client';
import type { Clock } from './lib/clock';
import type { Logger } from './lib/logger';
import type { BillingService } from './billing/billing-service';
import type { Mailer } from './email/mailer';
import type { Outbox } from './fakes/smtp/outbox';

/** Everything a request handler or service may use; built once by main.ts (or a test) and passed down. */
export interface AppDeps {
  config: AppConfig;
  db: Database;
  clock: Clock;
  logger: Logger;
  /** Absent when no SMTP relay is configured (and no local catcher stands in). */
  mailer?: Mailer;
  /** Absent when no payment provider is configured (and no local fake stands in). */
  billing?: BillingService;
  /** The local SMTP catcher's messages (development and tests only). */
  devOutbox?: Outbox;
}
