import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { ApiProblem } from './api-problem';
import { jsonPointer, parseRequestPart } from './validation';

describe('jsonPointer', () => {
  // RFC 6901 §3 and §6: "~" → "~0", "/" → "~1", then URI-fragment encoding.
  it('escapes ~ and / and percent-encodes for a URI fragment', () => {
    expect(jsonPointer(['a/b', 'm~n', 0])).toBe('#/a~1b/m~0n/0');
    expect(jsonPointer(['c%d'])).toBe('#/c%25d');
    expect(jsonPointer([])).toBe('#');
  });
});

describe('parseRequestPart', () => {
  const schema = z.strictObject({ name: z.string(), scopes: z.array(z.enum(['a', 'b'])) });

  it('returns the parsed value', () => {
    expect(parseRequestPart(schema, { name: 'x', scopes: ['a'] }, 'body')).toEqual({ name: 'x', scopes: ['a'] });
  });

  it('names each invalid and unknown field with a pointer', () => {
    try {
      parseRequestPart(schema, { name: 5, scopes: ['c'], extra: true, other: 1 }, 'body');
      expect.unreachable();
    } catch (error) {
      expect(error).toBeInstanceOf(ApiProblem);
      const problem = error as ApiProblem;
      expect(problem.code).toBe('validation_failed');
      expect(problem.errors?.map((entry) => entry.pointer).sort()).toEqual(['#/extra', '#/name', '#/other', '#/scopes/0']);
      expect(problem.errors?.every((entry) => entry.in === 'body')).toBe(true);
    }
  });
});
