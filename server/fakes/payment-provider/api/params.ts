import { ProviderRequestError } from './provider-request-error';

/** Form-decoded (qs) request parameters, as the SDK sends them: strings, nested objects and arrays. */
export type Params = Record<string, unknown>;

function invalid(param: string, message: string, code = 'parameter_invalid_string'): ProviderRequestError {
  return new ProviderRequestError(400, 'invalid_request_error', message, code, param);
}

/** Like the provider, refuse parameters it does not know rather than silently ignoring a typo. */
export function onlyParams(params: Params, allowed: readonly string[]): void {
  for (const name of Object.keys(params)) {
    if (name !== 'expand' && !allowed.includes(name)) {
      throw invalid(name, `Received unknown parameter: ${name}`, 'parameter_unknown');
    }
  }
}

export function optionalString(params: Params, name: string): string | undefined {
  const value = params[name];
  if (value === undefined) return undefined;
  if (typeof value !== 'string') throw invalid(name, `Invalid string: ${name}`);
  return value;
}

export function requiredString(params: Params, name: string): string {
  const value = optionalString(params, name);
  if (value === undefined || value === '') {
    throw invalid(name, `Missing required param: ${name}.`, 'parameter_missing');
  }
  return value;
}

export function optionalInteger(params: Params, name: string, range: { min: number; max: number }): number | undefined {
  const text = optionalString(params, name);
  if (text === undefined) return undefined;
  const value = Number(text);
  if (!Number.isInteger(value) || value < range.min || value > range.max) {
    throw invalid(name, `Invalid integer: ${name} must be between ${range.min} and ${range.max}.`, 'parameter_invalid_integer');
  }
  return value;
}

export function optionalBoolean(params: Params, name: string): boolean | undefined {
  const text = optionalString(params, name);
  if (text === undefined) return undefined;
  if (text !== 'true' && text !== 'false') throw invalid(name, `Invalid boolean: ${name}`);
  return text === 'true';
}

/** qs turns `a[0]=x` into an array but very long lists into an object keyed by index; accept both. */
export function optionalArray(params: Params, name: string): unknown[] | undefined {
  const value = params[name];
  if (value === undefined) return undefined;
  if (Array.isArray(value)) return value;
  if (value !== null && typeof value === 'object') return Object.values(value);
  throw invalid(name, `Invalid array: ${name}`);
}

export function optionalObject(params: Params, name: string): Params | undefined {
  const value = params[name];
  if (value === undefined) return undefined;
  if (value === null || typeof value !== 'object' || Array.isArray(value)) throw invalid(name, `Invalid object: ${name}`);
  return value as Params;
}

/** Metadata: at most 50 string keys of ≤ 40 characters with values of ≤ 500 characters, as the provider allows. */
export function optionalMetadata(params: Params, name: string): Record<string, string> | undefined {
  const value = optionalObject(params, name);
  if (value === undefined) return undefined;
  const entries = Object.entries(value);
  if (entries.length > 50) throw invalid(name, 'Metadata can have at most 50 keys.');
  for (const [key, entry] of entries) {
    if (typeof entry !== 'string' || key.length > 40 || entry.length > 500) {
      throw invalid(`${name}[${key}]`, 'Metadata keys are at most 40 and values at most 500 characters.');
    }
  }
  return Object.fromEntries(entries) as Record<string, string>;
}

export function listOptions(params: Params): { limit?: number; startingAfter?: string } {
  return { limit: optionalInteger(params, 'limit', { min: 1, max: 100 }), startingAfter: optionalString(params, 'starting_after') };
}

/** Only http(s) addresses end up as links on the hosted pages. `{CHECKOUT_SESSION_ID}` may appear in them. */
export function requireHttpUrl(value: string, param: string): string {
  try {
    const url = new URL(value.replace('{CHECKOUT_SESSION_ID}', 'placeholder'));
    if (url.protocol === 'http:' || url.protocol === 'https:') return value;
  } catch {
    // refused below
  }
  throw invalid(param, `Not a valid URL: ${param}`, 'url_invalid');
}
