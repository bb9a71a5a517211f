import { spawnSync } from 'node:child_process';
import { BootstrapError, say } from './log.mjs';

let updated = false;

function run(args) {
  const result = spawnSync('apt-get', args, {
    stdio: 'inherit',
    env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' },
  });
  return result.status === 0;
}

/** Installs Debian packages; needs root. `reason` says in the error what the packages are for. */
export function aptInstall(packages, reason) {
  const manual = `sudo apt-get update && sudo DEBIAN_FRONTEND=noninteractive apt-get install -y ${packages.join(' ')}`;
  if (typeof process.getuid === 'function' && process.getuid() !== 0) {
    throw new BootstrapError(`${reason} needs the Debian package(s) ${packages.join(', ')}, and installing them needs root.\nRun:\n  ${manual}\nthen try again.`);
  }
  say(`Installing ${packages.join(', ')} with apt-get (${reason})…`);
  if (!updated) {
    if (!run(['update'])) throw new BootstrapError(`apt-get update failed. Install by hand:\n  ${manual}`);
    updated = true;
  }
  if (!run(['install', '-y', '--no-install-recommends', ...packages])) {
    throw new BootstrapError(`apt-get install ${packages.join(' ')} failed (see above). Install by hand:\n  ${manual}`);
  }
}
