import { PROBLEMS, type ProblemCode } from '@shared/problems';
import type { ProblemFieldError } from '@shared/schemas/problem';

export interface ApiProblemOptions {
  /** Extra members of the problem body (e.g. requiredPermission). */
  extensions?: Record<string, unknown>;
  /** Response headers that belong to this problem (e.g. Retry-After, Allow). */
  headers?: Record<string, string>;
  errors?: ProblemFieldError[];
  cause?: unknown;
}

/**
 * A problem a service or middleware throws; the error middleware renders it as application/problem+json.
 * Status and title come from the code's row in shared/problems.ts.
 */
export class ApiProblem extends Error {
  readonly code: ProblemCode;
  readonly status: number;
  readonly detail: string;
  readonly extensions: Record<string, unknown>;
  readonly headers: Record<string, string>;
  readonly errors?: ProblemFieldError[];

  constructor(code: ProblemCode, detail: string, options: ApiProblemOptions = {}) {
    super(detail, { cause: options.cause });
    this.name = 'ApiProblem';
    this.code = code;
    this.status = PROBLEMS[code].status;
    this.detail = detail;
    this.extensions = options.extensions ?? {};
    this.headers = options.headers ?? {};
    this.errors = options.errors;
  }
}

/** The usual "no such thing in your organisation" answer, also for other organisations' objects. */
export function notFound(what: string): ApiProblem {
  return new ApiProblem('not_found', `No ${what} with this id exists in the active organisation.`);
}

/** A validation problem about one body field, for rules a schema cannot express (e.g. "in the future"). */
export function invalidField(pointer: string, detail: string): ApiProblem {
  return new ApiProblem('validation_failed', detail, { errors: [{ in: 'body', pointer, detail }] });
}
