import { describe, expect, it } from 'vitest';
import { ApiProblem, toProblemBody } from './api-problem';
import { describeProblem, fieldErrorsFromProblem, fieldNameFromPointer } from './problem-message';

describe('fieldNameFromPointer', () => {
  // RFC 6901 §3 (escapes ~1 and ~0), §5 examples "/a~1b" and "/m~0n", §6 URI-fragment form "#/c%25d".
  it('reads the first reference token of a JSON Pointer', () => {
    expect(fieldNameFromPointer('/password')).toBe('password');
    expect(fieldNameFromPointer('#/scopes/0')).toBe('scopes');
    expect(fieldNameFromPointer('/a~1b')).toBe('a/b');
    expect(fieldNameFromPointer('/m~0n')).toBe('m~n');
    expect(fieldNameFromPointer('#/c%25d')).toBe('c%d');
  });

  it('has no field for the whole-document pointer', () => {
    // RFC 6901 §5: "" and "#" point at the whole document.
    expect(fieldNameFromPointer('')).toBeUndefined();
    expect(fieldNameFromPointer('#')).toBeUndefined();
  });
});

describe('problem answers', () => {
  // RFC 9457 §3: type, title, status, detail, instance, plus extension members (code, requestId, errors).
  const body = {
    type: 'https://sweepline.example/problems/validation-error',
    title: 'Your request is not valid',
    status: 400,
    detail: 'Two fields need attention.',
    instance: '/v1/requests/req_123',
    code: 'validation_error',
    requestId: 'req_123',
    errors: [
      { pointer: '#/password', detail: 'Use at least 12 characters.' },
      { pointer: '#/password', detail: 'A second message for the same field.' },
      { pointer: '#/email', detail: 'Enter a valid e-mail address.' },
    ],
  };

  it('keeps the first message per field', () => {
    const problem = new ApiProblem(toProblemBody(400, 'Bad Request', body));
    expect(fieldErrorsFromProblem(problem)).toEqual({
      password: 'Use at least 12 characters.',
      email: 'Enter a valid e-mail address.',
    });
  });

  it('shows the server detail and request id', () => {
    const message = describeProblem(new ApiProblem(toProblemBody(400, 'Bad Request', body)));
    expect(message).toMatchObject({ title: body.title, detail: body.detail, requestId: 'req_123' });
  });

  it('adds a next step where the console knows who can help', () => {
    const problem = new ApiProblem({
      title: 'Only an owner can change or grant the owner role',
      status: 403,
      code: 'owner_role_required',
      detail: 'Admins cannot make someone an owner.',
    });
    expect(describeProblem(problem).hint).toBe('Ask an owner of this organisation to make this change.');
  });

  it('does not repeat a detail that only restates the title', () => {
    const problem = new ApiProblem({
      title: 'The e-mail address or password is wrong',
      status: 401,
      code: 'invalid_credentials',
      detail: 'The e-mail address or password is wrong.',
    });
    expect(describeProblem(problem).detail).toBeUndefined();
  });

  it('still yields a problem from a body that is not problem+json', () => {
    // RFC 9457 §4.2: with no problem details, the HTTP status is all the client knows.
    const problem = toProblemBody(502, 'Bad Gateway', '<html>upstream</html>');
    expect(problem).toMatchObject({ status: 502, title: 'Bad Gateway', code: 'server_error' });
  });
});

describe('throttling hint', () => {
  // RFC 6585 §4 (429 Too Many Requests) with the wait the server states; rounding up is common practice, no source.
  it('tells how long to wait', () => {
    const problem = (seconds: number) =>
      new ApiProblem({ title: 'Throttled', status: 429, code: 'sign_in_throttled', retryAfterSeconds: seconds });
    expect(describeProblem(problem(45)).hint).toBe('Try again in 45 seconds.');
    expect(describeProblem(problem(60)).hint).toBe('Try again in 1 minute.');
    expect(describeProblem(problem(61)).hint).toBe('Try again in 2 minutes.');
  });
});
