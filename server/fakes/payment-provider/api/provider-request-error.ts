import type { Response } from 'express';

/** An error in the provider's own shape: `{ error: { type, code, message, param } }` with its HTTP status. */
export class ProviderRequestError extends Error {
  constructor(
    readonly status: number,
    readonly type: 'invalid_request_error' | 'idempotency_error' | 'api_error',
    message: string,
    readonly code?: string,
    readonly param?: string,
  ) {
    super(message);
    this.name = 'ProviderRequestError';
  }
}

export function sendProviderError(response: Response, error: ProviderRequestError): void {
  response.status(error.status).json({
    error: { type: error.type, message: error.message, ...(error.code ? { code: error.code } : {}), ...(error.param ? { param: error.param } : {}) },
  });
}

export function missingObject(kind: string, id: string, param = 'id'): ProviderRequestError {
  return new ProviderRequestError(404, 'invalid_request_error', `No such ${kind}: '${id}'`, 'resource_missing', param);
}
