import { env } from '@console/config/env';
import { ApiProblem, networkProblem, toProblemBody } from './api-problem';

type Query = Record<string, string | number | boolean | undefined | null>;

type RequestOptions = {
  query?: Query;
  body?: unknown;
  headers?: Record<string, string>;
  signal?: AbortSignal;
  /** Non-2xx statuses whose body is a regular answer, not a problem (health answers 503 with its report). */
  acceptStatuses?: number[];
};

export function buildApiUrl(path: string, query?: Query): string {
  const search = new URLSearchParams();
  for (const [name, value] of Object.entries(query ?? {})) {
    if (value !== undefined && value !== null && value !== '') search.set(name, String(value));
  }
  const suffix = search.size > 0 ? `?${search.toString()}` : '';
  return `${env.apiBasePath}${path}${suffix}`;
}

async function request<T>(method: string, path: string, options: RequestOptions = {}): Promise<T> {
  const headers: Record<string, string> = { Accept: 'application/json, application/problem+json', ...options.headers };
  if (options.body !== undefined) headers['Content-Type'] = 'application/json';

  let response: Response;
  try {
    // The session cookie rides along; same-origin fetch writes carry the Origin header the CSRF check wants.
    response = await fetch(buildApiUrl(path, options.query), {
      method,
      headers,
      body: options.body === undefined ? undefined : JSON.stringify(options.body),
      credentials: 'same-origin',
      signal: options.signal,
    });
  } catch (error) {
    if (error instanceof DOMException && error.name === 'AbortError') throw error;
    throw networkProblem();
  }

  if (response.status === 204) return undefined as T;
  const body: unknown = await response.json().catch(() => undefined);
  const isAnswer = response.ok || options.acceptStatuses?.includes(response.status);
  if (!isAnswer) throw new ApiProblem(toProblemBody(response.status, response.statusText, body));
  return body as T;
}

export const apiClient = {
  get: <T>(path: string, options?: RequestOptions) => request<T>('GET', path, options),
  post: <T>(path: string, body?: unknown, options?: RequestOptions) => request<T>('POST', path, { ...options, body }),
  patch: <T>(path: string, body?: unknown, options?: RequestOptions) => request<T>('PATCH', path, { ...options, body }),
  delete: <T>(path: string, options?: RequestOptions) => request<T>('DELETE', path, options),
};
