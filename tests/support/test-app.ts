import type { Express } from 'express';
import { createApp, type CreateAppOptions } from '@server/app';
import { loadConfig, type AppConfig } from '@server/config/env';
import type { AppDeps } from '@server/deps';
import { systemClock, type Clock } from '@server/lib/clock';
import { createLogger } from '@server/lib/logger';
import { createTestDatabase, type TestDatabase } from './test-database';

export const TEST_SESSION_SECRET = 'sweepline-test-session-secret-0123456789abcdef';

export interface TestContext {
  app: Express;
  deps: AppDeps;
  database: TestDatabase;
  /** The origin the app treats as its own (PUBLIC_ORIGIN); browser-like requests send it as Origin. */
  origin: string;
  close(): Promise<void>;
}

export function testConfig(overrides: Partial<AppConfig> = {}, env: Record<string, string> = {}): AppConfig {
  return {
    ...loadConfig({ NODE_ENV: 'test', LOG_LEVEL: process.env.SWEEPLINE_TEST_LOG_LEVEL ?? 'silent', SESSION_SECRET: TEST_SESSION_SECRET, ...env }),
    ...overrides,
  };
}

/** createApp() over its own fresh database; use in beforeAll and close in afterAll. */
export async function createTestContext(
  options: { config?: Partial<AppConfig>; clock?: Clock; app?: CreateAppOptions } = {},
): Promise<TestContext> {
  const database = await createTestDatabase();
  const config = testConfig({ databaseUrl: database.url, ...options.config });
  const deps: AppDeps = { config, db: database.db, clock: options.clock ?? systemClock, logger: createLogger(config.logLevel) };
  const app = createApp(deps, { consoleDir: null, ...options.app });
  return { app, deps, database, origin: config.publicOrigin, close: () => database.drop() };
}
