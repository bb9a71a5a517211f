import { once } from 'node:events';
import type { AddressInfo } from 'node:net';
import { createApp } from './app';
import { startBanner } from './banner';
import { ConfigError, loadConfig } from './config/env';
import { createDatabase, databaseOptionsFor } from './db/client';
import { applyMigrations } from './db/migrate';
import { seedDemo } from './db/seed/seed';
import type { AppDeps } from './deps';
import { systemClock } from './lib/clock';
import { createLogger } from './lib/logger';
import { ensureConsoleBuilt } from './web/console-build';
import { startIdempotencyPruner } from './http/idempotency';
import { startRateLimitPruner } from './http/rate-limit';
import { startWebhookDispatcher } from './webhooks/dispatcher';
import { startJobRunner } from './jobs/job-runner';
import { startLoopDelayReport } from './jobs/loop-delay-report';
import { startHostedServices } from './hosted/hosted-services';
import { thresholdEmailsSettled } from './modules/usage/threshold-emails';

const redactUrl = (url: string) => url.replace(/\/\/([^:/@]+):[^@]*@/, '//$1:***@');

/** The only place that listens: config → database → migrations → demo seed → console build → HTTP. */
async function main() {
  const config = loadConfig();
  const logger = createLogger(config.logLevel);

  try {
    await applyMigrations(config.databaseUrl);
  } catch (error) {
    throw new Error(`Cannot prepare the database at ${redactUrl(config.databaseUrl)}: ${(error as Error).message}`);
  }
  const database = createDatabase(config.databaseUrl, databaseOptionsFor(config));
  // E-mail and payments: the configured services, or (development) local fakes that catch everything.
  const hosted = await startHostedServices(
    { config, db: database.db, clock: systemClock },
    // The fake's customers and subscriptions survive restarts next to the private database, as the plan rows do.
    { paymentsStatePath: '.data/payments-fake.json' },
  );
  const deps: AppDeps = { config, db: database.db, clock: systemClock, logger, mailer: hosted.mailer, billing: hosted.billing, devOutbox: hosted.devOutbox };
  const seed = config.seedDemo ? await seedDemo(deps) : null;
  const consoleBuild = await ensureConsoleBuilt(logger);

  const server = createApp(deps, { consoleDir: consoleBuild.dir }).listen(config.port, config.host);
  // Webhook deliveries and the expiry of idempotency records / rate-limit windows (any number of processes may run these).
  const webhookDispatcher = startWebhookDispatcher(deps);
  const stopPruners = [startIdempotencyPruner(deps), startRateLimitPruner(deps)];
  // Analysis jobs: every process may work the shared queue (SWEEPLINE_RUN_JOBS=false for API-only processes).
  const jobRunner = config.jobs.runWorkers ? startJobRunner(deps) : null;
  const stopLoopReport = startLoopDelayReport(logger);
  await once(server, 'listening');
  const { port } = server.address() as AddressInfo;
  hosted.announceBaseUrl(`http://${config.host}:${port}`);
  process.stdout.write(
    startBanner({ baseUrl: `http://${config.host}:${port}`, version: config.version, consoleBuilt: consoleBuild.dir !== null, seed, hostedSummary: hosted.summary }),
  );

  let stopping = false;
  const stop = (signal: string) => {
    if (stopping) return;
    stopping = true;
    logger.info({ signal }, 'stopping');
    // Give open requests a moment, then drop idle keep-alive connections so close() can finish.
    const force = setTimeout(() => server.closeAllConnections(), 5000);
    force.unref();
    server.closeIdleConnections();
    stopPruners.forEach((stopPruner) => stopPruner());
    stopLoopReport();
    // Running analyses finish or are released (re-queued) while the server drains.
    const jobsStopped = jobRunner ? jobRunner.stop() : Promise.resolve();
    server.close(() => {
      void jobsStopped
        .then(() => webhookDispatcher.stop())
        // Quota e-mails still being sent go out before the relay connection closes.
        .then(() => thresholdEmailsSettled())
        .then(() => hosted.stop())
        .then(() => database.close())
        .finally(() => process.exit(0));
    });
  };
  process.on('SIGINT', () => stop('SIGINT'));
  process.on('SIGTERM', () => stop('SIGTERM'));
}

main().catch((error: unknown) => {
  if (error instanceof ConfigError) {
    process.stderr.write(`${error.message}\nSee the README's table of environment variables.\n`);
  } else if (error instanceof Error && 'code' in error && error.code === 'EADDRINUSE') {
    process.stderr.write(`The port is already in use (${error.message}). Stop the other server or set SWEEPLINE_PORT.\n`);
  } else {
    process.stderr.write(`Sweepline could not start: ${error instanceof Error ? error.message : String(error)}\n`);
  }
  process.exit(1);
});
