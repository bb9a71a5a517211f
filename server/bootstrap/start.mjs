#!/usr/bin/env node
// `npm start`: installs what is missing, starts the private MariaDB, then runs the server until Ctrl-C.
// Plain Node with no npm dependencies, because it runs before they are installed.
import { spawn } from 'node:child_process';
import { ensureNpmDependencies } from './lib/npm-deps.mjs';
import { exitOnBootstrapError, say, stopWhenOrphaned } from './lib/log.mjs';
import { fromRoot } from './lib/paths.mjs';
import { startDevDatabase } from './lib/instances.mjs';

async function main() {
  ensureNpmDependencies();
  const env = { ...process.env };
  let database = null;
  if (env.DATABASE_URL) {
    say('DATABASE_URL is set: using that database, not the private one.');
  } else {
    database = await startDevDatabase();
    env.DATABASE_URL = database.url;
    say(`Private MariaDB on 127.0.0.1:${database.instance.port} (data in .data/mariadb/)${database.instance.startedHere ? '' : ', already running'}.`);
  }

  const server = spawn(process.execPath, ['--import', 'tsx', fromRoot('server', 'main.ts')], { cwd: fromRoot(), env, stdio: 'inherit' });

  // Ctrl-C reaches the server directly (same process group); forwarding covers `kill <pid of npm start>`.
  const forward = (signal) => {
    if (server.exitCode === null) server.kill(signal);
  };
  process.on('SIGINT', forward);
  process.on('SIGTERM', forward);
  stopWhenOrphaned(() => forward('SIGTERM'));

  const [code, signal] = await new Promise((resolve) => server.on('exit', (...args) => resolve(args)));
  // The database keeps its data in .data/; a MariaDB started by this run is stopped cleanly with the server.
  if (database?.instance.startedHere) {
    say('Stopping the private MariaDB (data stays in .data/mariadb/)…');
    await database.instance.stop();
  }
  process.exit(code ?? (signal ? 1 : 0));
}

main().catch(exitOnBootstrapError);
