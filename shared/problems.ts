/**
 * Every kind of problem the API answers with (RFC 9457 application/problem+json). The `code` is part of the
 * contract: clients branch on it, never on `title` or `detail`. Server and console both read this table.
 * To add a kind: add a row here (snake_case code, the HTTP status it always carries, a title that is the same
 * for every occurrence); the OpenAPI document picks it up.
 */
export const PROBLEM_TYPE_BASE = 'https://sweepline.example/problems/';

export const PROBLEMS = {
  bad_request: { status: 400, title: 'The request could not be understood' },
  malformed_json: { status: 400, title: 'The request body is not valid JSON' },
  validation_failed: { status: 400, title: 'The request has invalid fields' },
  invalid_cursor: { status: 400, title: 'The pagination cursor is not valid for this query' },
  multipart_invalid: { status: 400, title: 'The multipart upload is malformed or incomplete' },
  idempotency_key_missing: { status: 400, title: 'This request needs an Idempotency-Key header' },
  idempotency_key_invalid: { status: 400, title: 'The Idempotency-Key header is not a valid key' },
  webhook_signature_missing: { status: 400, title: 'The provider event carries no signature' },
  webhook_signature_invalid: { status: 400, title: 'The provider event signature does not verify' },
  webhook_payload_invalid: { status: 400, title: 'The provider event is not a valid event' },
  not_authenticated: { status: 401, title: 'Authentication is required' },
  session_expired: { status: 401, title: 'The session has expired' },
  invalid_credentials: { status: 401, title: 'The e-mail address or password is wrong' },
  invalid_api_key: { status: 401, title: 'The API key is not valid' },
  api_key_expired: { status: 401, title: 'The API key has expired' },
  api_key_revoked: { status: 401, title: 'The API key has been revoked' },
  insufficient_permission: { status: 403, title: 'Your role does not allow this action' },
  insufficient_scope: { status: 403, title: 'The API key lacks a scope this action needs' },
  scope_not_held: { status: 403, title: 'A key cannot be given a scope its creator does not hold' },
  owner_role_required: { status: 403, title: 'Only an owner can change or grant the owner role' },
  csrf_origin_mismatch: { status: 403, title: 'The request did not come from the Sweepline console' },
  no_organisation: { status: 403, title: 'The account belongs to no organisation' },
  invitation_email_mismatch: { status: 403, title: 'The invitation was sent to another e-mail address' },
  not_found: { status: 404, title: 'The resource does not exist' },
  route_not_found: { status: 404, title: 'No such endpoint' },
  method_not_allowed: { status: 405, title: 'The endpoint does not support this method' },
  email_already_registered: { status: 409, title: 'An account with this e-mail address already exists' },
  already_member: { status: 409, title: 'The person is already a member of the organisation' },
  invitation_pending: { status: 409, title: 'An invitation to this address is already pending' },
  invitation_closed: { status: 409, title: 'The invitation was already accepted, revoked or replaced' },
  last_owner: { status: 409, title: 'An organisation must keep at least one owner' },
  capture_in_use: { status: 409, title: 'The capture is used by analyses' },
  analysis_not_cancelable: { status: 409, title: 'The analysis has already finished' },
  analysis_not_succeeded: { status: 409, title: 'The analysis has no result yet' },
  idempotency_request_in_progress: { status: 409, title: 'A request with this Idempotency-Key is still being processed' },
  subscription_exists: { status: 409, title: 'The organisation already has a paid plan' },
  billing_account_missing: { status: 409, title: 'The organisation has no billing account yet' },
  billing_object_missing: { status: 409, title: 'The payment provider does not know this billing object' },
  invitation_expired: { status: 410, title: 'The invitation has expired' },
  invitation_revoked: { status: 410, title: 'The invitation was revoked' },
  invitation_used: { status: 410, title: 'The invitation was already accepted or replaced' },
  payload_too_large: { status: 413, title: 'The request body is too large' },
  unsupported_media_type: { status: 415, title: 'The request body has an unsupported media type' },
  invalid_wav: { status: 422, title: 'The file is not a WAV file the service can read' },
  capture_over_limit: { status: 422, title: 'The capture exceeds a limit of the plan' },
  invalid_parameters: { status: 422, title: 'The parameters cannot be used as given' },
  analysis_input_mismatch: { status: 422, title: 'The capture, stimulus and channels do not fit together' },
  source_analysis_unusable: { status: 422, title: 'The source analysis named by the request cannot be used' },
  idempotency_key_reused: { status: 422, title: 'The Idempotency-Key was already used for a different request' },
  calibration_not_found: { status: 422, title: 'The calibration named by the request does not exist' },
  calibration_expired: { status: 422, title: 'The calibration has expired' },
  calibration_invalid: { status: 422, title: 'The calibration cannot be computed from the values given' },
  mask_not_found: { status: 422, title: 'The tolerance mask named by the request does not exist' },
  mask_invalid: { status: 422, title: 'The tolerance mask is not well formed' },
  golden_analyses_unusable: { status: 422, title: 'The golden analyses cannot be used to derive a mask' },
  webhook_url_not_allowed: { status: 422, title: 'The webhook URL is not an allowed target' },
  plan_not_purchasable: { status: 422, title: 'The plan cannot be bought' },
  quota_exceeded: { status: 429, title: 'A quota or rate limit of the plan is exhausted' },
  sign_in_throttled: { status: 429, title: 'Too many failed sign-in attempts' },
  invitations_throttled: { status: 429, title: 'The organisation has sent too many invitations recently' },
  internal_error: { status: 500, title: 'Something went wrong on our side' },
  analysis_attempts_exhausted: { status: 500, title: 'The analysis ran out of attempts' },
  payment_provider_error: { status: 502, title: 'The payment provider refused the request' },
  payment_provider_unreachable: { status: 502, title: 'The payment provider could not be reached' },
  plan_price_missing: { status: 502, title: 'The payment provider has no price for the plan' },
  service_unavailable: { status: 503, title: 'The service is temporarily unavailable' },
  billing_not_configured: { status: 503, title: 'Billing is not configured on this server' },
} as const satisfies Record<string, { status: number; title: string }>;

export type ProblemCode = keyof typeof PROBLEMS;

export const PROBLEM_CODES = Object.keys(PROBLEMS) as [ProblemCode, ...ProblemCode[]];

export function problemTypeUri(code: ProblemCode): string {
  return `${PROBLEM_TYPE_BASE}${code}`;
}

export function isProblemCode(value: unknown): value is ProblemCode {
  return typeof value === 'string' && Object.hasOwn(PROBLEMS, value);
}
