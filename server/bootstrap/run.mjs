#!/usr/bin/env node
// `node server/bootstrap/run.mjs <file.ts> [args…]`: ensures npm dependencies, then runs the TypeScript file
// with tsx, passing the arguments and the exit code through. Used by `npm run analyze`, `stimulus`, `bench:*`.
import { spawn } from 'node:child_process';
import { ensureNpmDependencies } from './lib/npm-deps.mjs';
import { exitOnBootstrapError, warn } from './lib/log.mjs';

function main() {
  const [file, ...args] = process.argv.slice(2);
  if (!file) {
    warn('usage: node server/bootstrap/run.mjs <file.ts> [arguments…]');
    process.exit(2);
  }
  ensureNpmDependencies();
  const child = spawn(process.execPath, ['--import', 'tsx', file, ...args], { cwd: process.cwd(), stdio: 'inherit' });
  const forward = (signal) => {
    if (child.exitCode === null) child.kill(signal);
  };
  process.on('SIGINT', forward);
  process.on('SIGTERM', forward);
  child.on('exit', (code, signal) => process.exit(code ?? (signal ? 1 : 0)));
}

try {
  main();
} catch (error) {
  exitOnBootstrapError(error);
}
