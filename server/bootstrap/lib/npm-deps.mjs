import { createHash } from 'node:crypto';
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import { fromRoot } from './paths.mjs';
import { BootstrapError, say } from './log.mjs';

const MARKER = fromRoot('node_modules', '.sweepline-lock-hash');

function lockHash() {
  return createHash('sha256').update(fs.readFileSync(fromRoot('package-lock.json'))).digest('hex');
}

/**
 * True when node_modules holds exactly what package-lock.json asks for, judged from npm's own record of the
 * install (node_modules/.package-lock.json). Lets a tree installed by hand be adopted without a reinstall.
 */
function installMatchesLock() {
  const installedPath = fromRoot('node_modules', '.package-lock.json');
  if (!fs.existsSync(installedPath)) return false;
  const wanted = JSON.parse(fs.readFileSync(fromRoot('package-lock.json'), 'utf8')).packages ?? {};
  const installed = JSON.parse(fs.readFileSync(installedPath, 'utf8')).packages ?? {};
  for (const [location, entry] of Object.entries(wanted)) {
    if (location === '' || entry.optional || entry.link) continue;
    if (installed[location]?.version !== entry.version) return false;
    if (!fs.existsSync(fromRoot(location, 'package.json'))) return false;
  }
  return true;
}

/** Runs `npm ci` when node_modules is missing or package-lock.json changed since the last install. */
export function ensureNpmDependencies() {
  const hash = lockHash();
  if (fs.existsSync(MARKER) && fs.readFileSync(MARKER, 'utf8').trim() === hash) return;
  if (fs.existsSync(fromRoot('node_modules')) && installMatchesLock()) {
    fs.writeFileSync(MARKER, `${hash}\n`);
    return;
  }
  say('Installing npm dependencies (npm ci)…');
  const npm = process.platform === 'win32' ? 'npm.cmd' : 'npm';
  const result = spawnSync(npm, ['ci', '--include=dev', '--no-audit', '--no-fund'], { cwd: fromRoot(), stdio: 'inherit' });
  if (result.status !== 0) throw new BootstrapError('npm ci failed (see above). Check the network to the npm registry and try again.');
  fs.writeFileSync(MARKER, `${hash}\n`);
}
