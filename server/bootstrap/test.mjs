#!/usr/bin/env node
// `npm test`: the same bootstrapping as `npm start`, into a separate test MariaDB, then every vitest project
// (unit, api, browser). Extra arguments go to vitest: `npm test -- tests/api/auth.test.ts`.
import { spawn } from 'node:child_process';
import fs from 'node:fs';
import { aptInstall } from './lib/apt.mjs';
import { ensureNpmDependencies } from './lib/npm-deps.mjs';
import { exitOnBootstrapError, say, stopWhenOrphaned } from './lib/log.mjs';
import { fromRoot } from './lib/paths.mjs';
import { acquireTestDatabaseServer } from './lib/instances.mjs';

const CHROMIUM = '/usr/bin/chromium';

async function main() {
  ensureNpmDependencies();
  if (!fs.existsSync(CHROMIUM)) aptInstall(['chromium', 'chromium-driver'], 'The browser tests');
  const database = await acquireTestDatabaseServer();
  say(`Test MariaDB on 127.0.0.1:${database.port} (data in .data/mariadb-test/).`);

  const env = { ...process.env, NODE_ENV: 'test', SWEEPLINE_TEST_DATABASE_SERVER_URL: database.url };
  const vitest = spawn(process.execPath, [fromRoot('node_modules', 'vitest', 'vitest.mjs'), 'run', ...process.argv.slice(2)], {
    cwd: fromRoot(),
    env,
    stdio: 'inherit',
  });
  const forward = (signal) => {
    if (vitest.exitCode === null) vitest.kill(signal);
  };
  process.on('SIGINT', forward);
  process.on('SIGTERM', forward);
  stopWhenOrphaned(() => forward('SIGTERM'));
  const [code, signal] = await new Promise((resolve) => vitest.on('exit', (...args) => resolve(args)));
  await database.release();
  process.exit(code ?? (signal ? 1 : 0));
}

main().catch(exitOnBootstrapError);
