/**
 * The one error type the webhook modules throw. `code` is stable snake_case (services map it to a problem or a
 * delivery-log reason); `message` is for people and never carries a secret.
 */
export type WebhookErrorCode =
  // secrets and signing
  | 'invalid_secret'
  | 'invalid_message_id'
  | 'invalid_timestamp'
  // verification (receiver side)
  | 'missing_header'
  | 'timestamp_too_old'
  | 'timestamp_too_new'
  | 'no_matching_signature'
  // events
  | 'unknown_event_type'
  | 'invalid_event_data'
  | 'payload_too_large'
  // egress (SSRF) guard
  | 'invalid_url'
  | 'scheme_not_allowed'
  | 'credentials_in_url'
  | 'port_not_allowed'
  | 'host_not_allowed'
  | 'address_not_allowed'
  | 'dns_resolution_failed';

export class WebhookError extends Error {
  readonly code: WebhookErrorCode;
  readonly details?: Record<string, string | number | boolean>;

  constructor(code: WebhookErrorCode, message: string, details?: Record<string, string | number | boolean>) {
    super(message);
    this.name = 'WebhookError';
    this.code = code;
    this.details = details;
  }
}

export function isWebhookError(value: unknown): value is WebhookError {
  return value instanceof WebhookError;
}
