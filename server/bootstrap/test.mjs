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
  // A JSON report beside the usual output, so the run can close with one plain "N passed, N failed" line.
  const reportPath = fromRoot('.data', 'vitest-report.json');
  fs.rmSync(reportPath, { force: true });
  const reporters = ['--reporter=default', '--reporter=json', `--outputFile.json=${reportPath}`];
  const vitest = spawn(process.execPath, [fromRoot('node_modules', 'vitest', 'vitest.mjs'), 'run', ...reporters, ...process.argv.slice(2)], {
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
  printClosingLine(reportPath);
  process.exit(code ?? (signal ? 1 : 0));
}

function printClosingLine(reportPath) {
  if (!fs.existsSync(reportPath)) return;
  try {
    const report = JSON.parse(fs.readFileSync(reportPath, 'utf8'));
    const skipped = (report.numPendingTests ?? 0) + (report.numTodoTests ?? 0);
    process.stdout.write(`\nSummary: ${report.numPassedTests} passed, ${report.numFailedTests} failed, ${skipped} skipped\n`);
  } catch {
    // The report is a convenience; vitest's own exit code decides the run.
  }
}

main().catch(exitOnBootstrapError);
