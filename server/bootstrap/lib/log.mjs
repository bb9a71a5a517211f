/** Bootstrap output: one recognisable prefix so it stands apart from the server's own log. */
export function say(message) {
  process.stdout.write(`[sweepline] ${message}\n`);
}

export function warn(message) {
  process.stderr.write(`[sweepline] ${message}\n`);
}

/** A failure the person at the terminal can act on; printed without a stack trace. */
export class BootstrapError extends Error {
  constructor(message) {
    super(message);
    this.name = 'BootstrapError';
  }
}

export function exitOnBootstrapError(error) {
  if (error instanceof BootstrapError) {
    warn(error.message);
  } else {
    warn(`Start-up failed: ${error?.stack ?? error}`);
  }
  process.exit(1);
}

/**
 * `kill <pid of npm>` ends npm but not the script it ran; notice that our parent went away (we were
 * re-parented) and shut down as if signalled, so no server or database is left behind.
 */
export function stopWhenOrphaned(stop) {
  const parent = process.ppid;
  const timer = setInterval(() => {
    if (process.ppid !== parent) {
      clearInterval(timer);
      stop();
    }
  }, 1000);
  timer.unref();
}
