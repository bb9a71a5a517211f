import { once } from 'node:events';
import type { AddressInfo } from 'node:net';
import { createApp } from '@server/app';
import { loadConfig } from '@server/config/env';
import { createDatabase } from '@server/db/client';
import type { AppDeps } from '@server/deps';
import { startJobRunner } from '@server/jobs/job-runner';
import { startLoopDelayReport } from '@server/jobs/loop-delay-report';
import { systemClock } from '@server/lib/clock';
import { createLogger } from '@server/lib/logger';

/** The server under benchmark: API + job runner, no console, event-loop delay reported on stderr. */
async function main() {
  const config = loadConfig();
  const logger = createLogger(config.logLevel);
  const database = createDatabase(config.databaseUrl, { connectionLimit: 20 });
  const deps: AppDeps = { config, db: database.db, clock: systemClock, logger };
  const runner = startJobRunner(deps, { pollMs: 50 });
  const stopReport = startLoopDelayReport(logger, 5000);
  const server = createApp(deps, { consoleDir: null }).listen(config.port, '127.0.0.1');
  await once(server, 'listening');
  process.stdout.write(`listening ${(server.address() as AddressInfo).port} threads=${runner.threads}\n`);
  process.on('SIGTERM', () => {
    stopReport();
    server.closeAllConnections();
    server.close();
    void runner.stop().then(() => database.close()).finally(() => process.exit(0));
  });
}

void main();
