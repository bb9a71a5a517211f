/**
 * The only error type the engine throws. Every bad input (a malformed WAV, an impossible stimulus, a curve
 * with descending frequencies...) becomes an EngineError with a stable `code` that the API maps to a 4xx
 * problem, and an optional `field` naming the offending parameter (a dotted path, e.g. "stimulus.stopHz").
 */
export class EngineError extends Error {
  readonly code: string;
  readonly field?: string;
  readonly details?: Record<string, unknown>;

  constructor(code: string, message: string, options: { field?: string; details?: Record<string, unknown> } = {}) {
    super(message);
    this.name = 'EngineError';
    this.code = code;
    this.field = options.field;
    this.details = options.details;
  }
}

export function isEngineError(value: unknown): value is EngineError {
  return value instanceof EngineError;
}

/** Throw an EngineError with `code` unless `condition` holds. */
export function requireThat(
  condition: boolean,
  code: string,
  message: string,
  options: { field?: string; details?: Record<string, unknown> } = {},
): asserts condition {
  if (!condition) throw new EngineError(code, message, options);
}
