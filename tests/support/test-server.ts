import { once } from 'node:events';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { createApp } from '@server/app';
import { seedDemo, type DemoSeedResult } from '@server/db/seed/seed';
import type { AppDeps } from '@server/deps';
import { systemClock } from '@server/lib/clock';
import { createLogger } from '@server/lib/logger';
import { CONSOLE_DIST, ensureConsoleBuilt } from '@server/web/console-build';
import type { HostedServices } from '@server/hosted/hosted-services';
import { hostedDeps, startTestHostedServices, testConfig } from './test-app';
import { createTestDatabase, type TestDatabase } from './test-database';

export interface TestServer {
  /** e.g. http://127.0.0.1:41234 — also the server's PUBLIC_ORIGIN. */
  baseUrl: string;
  database: TestDatabase;
  deps: AppDeps;
  /** The demo organisation when started with seedDemo. */
  demo: DemoSeedResult | null;
  /** The local SMTP catcher and payment fake, when started with `hostedFakes: true`. */
  hosted: HostedServices | null;
  stop(): Promise<void>;
}

const buildLog = {
  info: (message: string) => process.stderr.write(`[test-server] ${message}\n`),
  warn: (message: string) => process.stderr.write(`[test-server] ${message}\n`),
};

/**
 * A real server listening on 127.0.0.1 (random port) over its own fresh test database, serving the API, the
 * docs and the built console (rebuilt first when older than its sources), for browser and example tests.
 */
export async function startTestServer(options: { seedDemo?: boolean; demoWorkspace?: boolean; buildConsole?: boolean; hostedFakes?: boolean } = {}): Promise<TestServer> {
  const database = await createTestDatabase();
  const server = http.createServer();
  server.listen(0, '127.0.0.1');
  await once(server, 'listening');
  const { port } = server.address() as AddressInfo;
  const baseUrl = `http://127.0.0.1:${port}`;

  const config = testConfig({ databaseUrl: database.url, publicOrigin: baseUrl, port, host: '127.0.0.1' });
  const hosted = options.hostedFakes ? await startTestHostedServices({ config, db: database.db, clock: systemClock }) : null;
  hosted?.announceBaseUrl(baseUrl);
  const deps: AppDeps = { config, db: database.db, clock: systemClock, logger: createLogger(config.logLevel), ...hostedDeps(hosted) };
  // The measured demo workspace only when asked (demoWorkspace): it takes seconds and fills every list.
  const demo = options.seedDemo ? await seedDemo(deps, [], { workspace: options.demoWorkspace ?? false }) : null;
  const consoleDir = options.buildConsole === false ? CONSOLE_DIST : (await ensureConsoleBuilt(buildLog)).dir;
  server.on('request', createApp(deps, { consoleDir }));

  return {
    baseUrl,
    database,
    deps,
    demo,
    hosted,
    async stop() {
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await hosted?.stop();
      await database.drop();
    },
  };
}
