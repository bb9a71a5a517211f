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
