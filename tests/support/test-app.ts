import type { Express } from 'express';
import { createApp, type CreateAppOptions } from '@server/app';
import { loadConfig, type AppConfig } from '@server/config/env';
import type { AppDeps } from '@server/deps';
import { systemClock, type Clock } from '@server/lib/clock';
import { createLogger } from '@server/lib/logger';
import { startHostedServices, type HostedServices } from '@server/hosted/hosted-services';
import { createTestDatabase, type TestDatabase } from './test-database';

export const TEST_SESSION_SECRET = 'sweepline-test-session-secret-0123456789abcdef';

export interface TestContext {
  app: Express;
  deps: AppDeps;
  database: TestDatabase;
  /** The origin the app treats as its own (PUBLIC_ORIGIN); browser-like requests send it as Origin. */
  origin: string;
  /** The local SMTP catcher and payment fake, when asked for with `hostedFakes: true`. */
  hosted: HostedServices | null;
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
  options: { config?: Partial<AppConfig>; clock?: Clock; app?: CreateAppOptions; hostedFakes?: boolean } = {},
): Promise<TestContext> {
  const database = await createTestDatabase();
  const config = testConfig({ databaseUrl: database.url, ...options.config });
  const clock = options.clock ?? systemClock;
  const hosted = options.hostedFakes ? await startTestHostedServices({ config, db: database.db, clock }) : null;
  const deps: AppDeps = { config, db: database.db, clock, logger: createLogger(config.logLevel), ...hostedDeps(hosted) };
  const app = createApp(deps, { consoleDir: null, ...options.app });
  return {
    app,
    deps,
    database,
    origin: config.publicOrigin,
    hosted,
    close: async () => {
      await hosted?.stop();
      await database.drop();
    },
  };
}

/** The local SMTP catcher and payment fake on free ports, in memory, for one test file. */
export function startTestHostedServices(deps: Pick<AppDeps, 'config' | 'db' | 'clock'>): Promise<HostedServices> {
  return startHostedServices(deps, { forceLocalFakes: true, smtpFakePort: 0, paymentsFakePort: 0 });
}

export function hostedDeps(hosted: HostedServices | null): Pick<AppDeps, 'mailer' | 'billing' | 'devOutbox'> {
  return hosted ? { mailer: hosted.mailer, billing: hosted.billing, devOutbox: hosted.devOutbox } : {};
}
