import { once } from 'node:events';
import type { AddressInfo } from 'node:net';
import { createApp } from '@server/app';
import { loadConfig } from '@server/config/env';
import { createDatabase, databaseOptionsFor } from '@server/db/client';
import type { AppDeps } from '@server/deps';
import { startJobRunner } from '@server/jobs/job-runner';
import { startLoopDelayReport } from '@server/jobs/loop-delay-report';
import { systemClock } from '@server/lib/clock';
import { createLogger } from '@server/lib/logger';
import { installQueryCounter } from './api-bench/query-counter';

/**
 * The server under benchmark: API + job runner with the production defaults (pool sizes, poll interval, engine
 * threads from the environment), no console. Event-loop delay, memory, CPU, engine use and SQL statement counts
 * are reported on stderr every BENCH_REPORT_MS (10 s); SIGUSR2 reports the memory in use after a full GC (started
 * with --expose-gc).
 */
async function main() {
  const queries = installQueryCounter();
  const config = loadConfig();
  const logger = createLogger(config.logLevel);
  const database = createDatabase(config.databaseUrl, databaseOptionsFor(config));
  const deps: AppDeps = { config, db: database.db, clock: systemClock, logger };
  const runner = startJobRunner(deps);
  const stopReport = startLoopDelayReport(logger, Number(process.env.BENCH_REPORT_MS ?? 10_000), () => ({ engine: runner.engineStats(), queries: queries.total, queryKinds: queries.byKeyword }));
  const server = createApp(deps, { consoleDir: null }).listen(config.port, '127.0.0.1');
  await once(server, 'listening');
  process.stdout.write(
    `listening ${(server.address() as AddressInfo).port} threads=${runner.threads} concurrency=${runner.concurrency} connections=${config.databaseConnections} validateResponses=${config.validateResponses} nodeEnv=${config.nodeEnv}\n`,
  );
  // SIGUSR2 (from the benchmark): a full garbage collection, then the memory still in use. Comparing such settled
  // figures from the start and the end of a run shows growth; raw samples mostly show where the GC sawtooth was.
  process.on('SIGUSR2', () => {
    (globalThis as { gc?: () => void }).gc?.();
    const memory = process.memoryUsage();
    process.stderr.write(`memory-settled ${JSON.stringify({ rssBytes: memory.rss, heapUsedBytes: memory.heapUsed, externalBytes: memory.external, arrayBuffersBytes: memory.arrayBuffers })}\n`);
  });
  process.on('SIGTERM', () => {
    stopReport();
    server.closeAllConnections();
    server.close();
    void runner.stop().then(() => database.close()).finally(() => process.exit(0));
  });
}

void main();
