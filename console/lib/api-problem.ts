// The console's view of an RFC 9457 problem answer. Every failed request becomes an ApiProblem, including
// network failures and non-problem bodies, so screens have one shape to show.
export type ProblemFieldError = { pointer: string; detail: string };

export type ProblemBody = {
  type?: string;
  title: string;
  status: number;
  detail?: string;
  instance?: string;
  code: string;
  requestId?: string;
  errors?: ProblemFieldError[];
  /** Sent with sign_in_throttled: seconds until another attempt is accepted. */
  retryAfterSeconds?: number;
};

export class ApiProblem extends Error {
  readonly status: number;
  readonly code: string;
  readonly title: string;
  readonly detail?: string;
  readonly requestId?: string;
  readonly fieldErrors: ProblemFieldError[];
  readonly retryAfterSeconds?: number;

  constructor(body: ProblemBody) {
    super(body.detail ?? body.title);
    this.name = 'ApiProblem';
    this.status = body.status;
    this.code = body.code;
    this.title = body.title;
    this.detail = body.detail;
    this.requestId = body.requestId;
    this.fieldErrors = body.errors ?? [];
    this.retryAfterSeconds = body.retryAfterSeconds;
  }
}

export function isApiProblem(value: unknown): value is ApiProblem {
  return value instanceof ApiProblem;
}

/** Reads whatever came back into a ProblemBody; a body that is not a problem still yields a usable one. */
export function toProblemBody(status: number, statusText: string, body: unknown): ProblemBody {
  if (body && typeof body === 'object' && typeof (body as { code?: unknown }).code === 'string') {
    const candidate = body as Partial<ProblemBody>;
    return {
      type: candidate.type,
      title: typeof candidate.title === 'string' ? candidate.title : statusText || 'Request failed',
      status: typeof candidate.status === 'number' ? candidate.status : status,
      detail: typeof candidate.detail === 'string' ? candidate.detail : undefined,
      instance: candidate.instance,
      code: candidate.code as string,
      requestId: typeof candidate.requestId === 'string' ? candidate.requestId : undefined,
      errors: Array.isArray(candidate.errors) ? candidate.errors.filter(isFieldError) : undefined,
      retryAfterSeconds: typeof candidate.retryAfterSeconds === 'number' ? candidate.retryAfterSeconds : undefined,
    };
  }
  return { title: statusText || 'Request failed', status, code: status >= 500 ? 'server_error' : 'unexpected_response' };
}

function isFieldError(value: unknown): value is ProblemFieldError {
  return (
    !!value &&
    typeof (value as ProblemFieldError).pointer === 'string' &&
    typeof (value as ProblemFieldError).detail === 'string'
  );
}

export const networkProblem = (): ApiProblem =>
  new ApiProblem({
    title: 'Sweepline could not be reached',
    status: 0,
    code: 'network_error',
    detail: 'Check that the service is running and try again.',
  });
