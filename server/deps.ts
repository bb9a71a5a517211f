import type { AppConfig } from './config/env';
import type { Database } from './db/client';
import type { Clock } from './lib/clock';
import type { Logger } from './lib/logger';

/** Everything a request handler or service may use; built once by main.ts (or a test) and passed down. */
export interface AppDeps {
  config: AppConfig;
  db: Database;
  clock: Clock;
  logger: Logger;
}
