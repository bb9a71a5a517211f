import type { z } from 'zod';
import type { ProblemFieldError } from '@shared/schemas/problem';
import { ApiProblem } from './api-problem';

export type RequestPart = ProblemFieldError['in'];

/** JSON Pointer (RFC 6901) written as a URI fragment, e.g. ["scopes", 0] → "#/scopes/0". */
export function jsonPointer(path: ReadonlyArray<PropertyKey>): string {
  const segments = path.map((segment) => encodeURIComponent(String(segment).replace(/~/g, '~0').replace(/\//g, '~1')));
  return `#${segments.map((segment) => `/${segment}`).join('')}`;
}

export function fieldErrorsFromIssues(issues: z.core.$ZodIssue[], part: RequestPart): ProblemFieldError[] {
  const errors: ProblemFieldError[] = [];
  for (const issue of issues) {
    if (issue.code === 'unrecognized_keys') {
      for (const key of issue.keys) {
        errors.push({ in: part, pointer: jsonPointer([...issue.path, key]), detail: `Unknown field "${key}"; remove it.` });
      }
    } else {
      errors.push({ in: part, pointer: jsonPointer(issue.path), detail: issue.message });
    }
  }
  return errors;
}

const PART_NAMES: Record<RequestPart, string> = {
  body: 'body',
  query: 'query string',
  path: 'URL path',
  header: 'headers',
};

/** Parses one part of the request or throws a validation_failed problem listing every invalid field. */
export function parseRequestPart<T extends z.ZodType>(schema: T, value: unknown, part: RequestPart): z.output<T> {
  const result = schema.safeParse(value);
  if (result.success) return result.data;
  const errors = fieldErrorsFromIssues(result.error.issues, part);
  const summary = errors.map((error) => `${error.pointer}: ${error.detail}`).join('; ');
  throw new ApiProblem('validation_failed', `The ${PART_NAMES[part]} has ${errors.length} invalid field(s): ${summary}`, { errors });
}
