/**
 * Every failure of the billing layer, with a stable snake_case `code` and the HTTP status the API should
 * answer with, so a route can turn it into a problem without knowing the provider.
 */
export class BillingError extends Error {
  readonly code: string;
  readonly status: number;

  constructor(code: string, message: string, options: { status?: number; cause?: unknown } = {}) {
    super(message, { cause: options.cause });
    this.name = 'BillingError';
    this.code = code;
    this.status = options.status ?? 400;
  }
}

export function isBillingError(value: unknown): value is BillingError {
  return value instanceof BillingError;
}
