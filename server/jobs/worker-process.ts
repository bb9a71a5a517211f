import { loadConfig } from '@server/config/env';
import { createDatabase, databaseOptionsFor } from '@server/db/client';
import type { AppDeps } from '@server/deps';
import { systemClock } from '@server/lib/clock';
import { createLogger } from '@server/lib/logger';
import { startJobRunner } from './job-runner';

/**
 * A process that only works the analysis queue (no HTTP): `node --import tsx server/jobs/worker-process.ts` with
 * the same DATABASE_URL and SWEEPLINE_BLOB_DIR as the API. Prints "ready <owner>" and "done <id> <outcome>" lines.
 */
async function main() {
  const config = loadConfig();
  const logger = createLogger(config.logLevel);
  const database = createDatabase(config.databaseUrl, databaseOptionsFor(config));
  const deps: AppDeps = { config, db: database.db, clock: systemClock, logger };
  const runner = startJobRunner(deps, {
    pollMs: 100,
    onJobDone: (id, outcome) => process.stdout.write(`done ${id} ${outcome}\n`),
  });
  process.stdout.write(`ready ${runner.owner}\n`);
  const stop = () => {
    void runner.stop().then(() => database.close()).finally(() => process.exit(0));
  };
  process.on('SIGTERM', stop);
  process.on('SIGINT', stop);
}

void main();
