/**
 * Every failure of the e-mail layer: a bad SMTP setting, an address the relay refused, a relay that is down.
 * `code` is stable snake_case so callers can decide (retry later, show a problem) without reading messages.
 */
export class EmailError extends Error {
  readonly code: string;

  constructor(code: string, message: string, options: { cause?: unknown } = {}) {
    super(message, { cause: options.cause });
    this.name = 'EmailError';
    this.code = code;
  }
}

export function isEmailError(value: unknown): value is EmailError {
  return value instanceof EmailError;
}
