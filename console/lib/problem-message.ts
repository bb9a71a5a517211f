import type { ProblemCode } from '@shared/problems';
import { isApiProblem } from './api-problem';

export type ProblemMessage = {
  title: string;
  /** Absent when it would only repeat the title. */
  detail?: string;
  /** What the person can do next, where the console knows better than a generic answer. */
  hint?: string;
  requestId?: string;
};

const hintsByCode: Partial<Record<ProblemCode | 'network_error', string>> = {
  network_error: 'If you run Sweepline on this machine, check that npm start is still running.',
  sign_in_throttled: 'Wait a few minutes before you try again.',
  owner_role_required: 'Ask an owner of this organisation to make this change.',
  insufficient_permission: 'Ask an owner or admin of this organisation for a role that allows it.',
  scope_not_held: 'Pick only scopes your own role holds.',
  email_already_registered: 'Sign in with that address instead, or use another one.',
  session_expired: 'Sign in again to continue.',
  not_authenticated: 'Sign in again to continue.',
  csrf_origin_mismatch: 'Reload the console and try again.',
  no_organisation: 'Ask an owner of an organisation to add you again.',
};

const normalise = (text: string) => text.trim().replace(/[.!]+$/, '').toLowerCase();

function waitHint(retryAfterSeconds: number | undefined): string | undefined {
  if (retryAfterSeconds === undefined || retryAfterSeconds <= 0) return undefined;
  if (retryAfterSeconds < 60) return `Try again in ${retryAfterSeconds} seconds.`;
  const minutes = Math.ceil(retryAfterSeconds / 60);
  return `Try again in ${minutes} minute${minutes === 1 ? '' : 's'}.`;
}

/** Turns anything a request threw into words for the screen; the server's own detail comes first. */
export function describeProblem(error: unknown): ProblemMessage {
  if (isApiProblem(error)) {
    const detail = error.detail && normalise(error.detail) !== normalise(error.title) ? error.detail : undefined;
    return {
      title: error.title,
      detail,
      hint: waitHint(error.retryAfterSeconds) ?? hintsByCode[error.code as ProblemCode],
      requestId: error.requestId,
    };
  }
  return {
    title: 'Something went wrong',
    detail: error instanceof Error && error.message ? error.message : 'The console hit an unexpected error.',
  };
}

/** RFC 6901 JSON Pointer (optionally as a URI fragment, "#/a/0") to the top-level form field it names. */
export function fieldNameFromPointer(pointer: string): string | undefined {
  const path = pointer.startsWith('#') ? pointer.slice(1) : pointer;
  if (!path.startsWith('/')) return undefined;
  const first = path.slice(1).split('/')[0];
  if (!first) return undefined;
  return decodeURIComponent(first).replace(/~1/g, '/').replace(/~0/g, '~');
}

/** The first message for each field the server rejected, keyed by field name. */
export function fieldErrorsFromProblem(error: unknown): Record<string, string> {
  if (!isApiProblem(error)) return {};
  const byField: Record<string, string> = {};
  for (const fieldError of error.fieldErrors) {
    const name = fieldNameFromPointer(fieldError.pointer);
    if (name && !(name in byField)) byField[name] = fieldError.detail;
  }
  return byField;
}
