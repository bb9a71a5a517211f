import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { problemSchema } from '@shared/schemas/problem';
import { PROBLEMS } from '@shared/problems';
import { createDatabase } from '@server/db/client';
import { createApp } from '@server/app';
import { bearer, createApiKey, signUp, type SignedUp } from '../support/actors';
import { createTestContext, type TestContext } from '../support/test-app';

let context: TestContext;
let owner: SignedUp;
let secret: string;
beforeAll(async () => {
  context = await createTestContext({ config: { jsonBodyLimitBytes: 4096 } });
  owner = await signUp(context);
  secret = (await createApiKey(owner.agent, ['keys:manage', 'members:read', 'members:manage'])).secret;
});
afterAll(async () => {
  await context?.close();
});

/** Every error is RFC 9457 problem+json whose status matches the HTTP status and the code's table row. */
function expectProblem(response: request.Response, status: number, code: string) {
  expect(response.status, JSON.stringify(response.body)).toBe(status);
  expect(response.headers['content-type']).toMatch(/^application\/problem\+json/);
  const problem = problemSchema.parse(response.body);
  expect(problem).toMatchObject({ status, code, type: `https://sweepline.example/problems/${code}`, title: PROBLEMS[problem.code].title });
  expect(problem.instance).toBe(`/v1/requests/${problem.requestId}`);
  expect(response.headers['x-request-id']).toBe(problem.requestId);
  return problem;
}

const keyPost = (path: string) => request(context.app).post(path).set(bearer(secret));

describe('bad input is a 4xx problem, never a 5xx', () => {
  it('malformed JSON → 400 malformed_json', async () => {
    const response = await keyPost('/v1/api-keys').set('Content-Type', 'application/json').send('{"name": "rig", "scopes": [');
    expectProblem(response, 400, 'malformed_json');
  });

  it('a JSON body that is not an object → 400', async () => {
    const scalar = await keyPost('/v1/api-keys').set('Content-Type', 'application/json').send('"just a string"');
    expectProblem(scalar, 400, 'malformed_json');
    const array = await keyPost('/v1/api-keys').set('Content-Type', 'application/json').send('[1,2]');
    const problem = expectProblem(array, 400, 'validation_failed');
    expect(problem.errors?.[0].pointer).toBe('#');
  });

  it('unknown fields → 400 validation_failed naming each one', async () => {
    const response = await keyPost('/v1/api-keys').send({ name: 'rig', scopes: ['members:read'], admin: true, orgId: 'org_other' });
    const problem = expectProblem(response, 400, 'validation_failed');
    expect(problem.errors?.map((error) => error.pointer).sort()).toEqual(['#/admin', '#/orgId']);
  });

  it('wrong types → 400 with a pointer per field', async () => {
    const response = await keyPost('/v1/api-keys').send({ name: 42, scopes: 'members:read', expiresAt: 'tomorrow' });
    const problem = expectProblem(response, 400, 'validation_failed');
    expect(problem.errors?.map((error) => error.pointer).sort()).toEqual(['#/expiresAt', '#/name', '#/scopes']);
    expect(problem.errors?.every((error) => error.in === 'body' && error.detail.length > 0)).toBe(true);
  });

  it('a missing body → 400 naming the required fields', async () => {
    const problem = expectProblem(await keyPost('/v1/api-keys'), 400, 'validation_failed');
    expect(problem.errors?.map((error) => error.pointer).sort()).toEqual(['#/name', '#/scopes']);
  });

  it('an oversized body → 413 payload_too_large', async () => {
    const response = await keyPost('/v1/api-keys').send({ name: 'x'.repeat(10_000), scopes: ['members:read'] });
    expectProblem(response, 413, 'payload_too_large');
  });

  it('a non-JSON body → 415 unsupported_media_type', async () => {
    const form = await keyPost('/v1/api-keys').type('form').send('name=rig&scopes=members:read');
    expectProblem(form, 415, 'unsupported_media_type');
    const text = await keyPost('/v1/api-keys').set('Content-Type', 'text/plain').send('hello');
    expectProblem(text, 415, 'unsupported_media_type');
  });

  it('bad query parameters → 400 with in: query', async () => {
    for (const query of [{ limit: '0' }, { limit: 'ten' }, { limit: '-5' }, { unknown: '1' }]) {
      const problem = expectProblem(await request(context.app).get('/v1/api-keys').set(bearer(secret)).query(query), 400, 'validation_failed');
      expect(problem.errors?.[0].in).toBe('query');
    }
    const capped = await request(context.app).get('/v1/api-keys').set(bearer(secret)).query({ limit: '1000' });
    expect(capped.status).toBe(200);
  });

  it('a garbled cursor → 400 invalid_cursor', async () => {
    const response = await request(context.app).get('/v1/api-keys').set(bearer(secret)).query({ cursor: 'eyJub3QiOiJzaWduZWQifQ.AAAA' });
    expectProblem(response, 400, 'invalid_cursor');
  });

  it('missing, garbled and expired credentials → 401 with distinct codes', async () => {
    expectProblem(await request(context.app).get('/v1/members'), 401, 'not_authenticated');
    expectProblem(await request(context.app).get('/v1/members').set(bearer('swl_live_%%%')), 401, 'invalid_api_key');
    expectProblem(await request(context.app).get('/v1/members').set('Authorization', 'Token abc'), 401, 'invalid_api_key');
    expectProblem(await request(context.app).get('/v1/members').set('Cookie', 'swl_session=not.a.jwt'), 401, 'not_authenticated');
  });

  it('an unknown route → 404 route_not_found, also outside /v1', async () => {
    expectProblem(await request(context.app).get('/v1/nothing-here'), 404, 'route_not_found');
    expectProblem(await request(context.app).post('/v2/api-keys'), 404, 'route_not_found');
    expectProblem(await request(context.app).get('/favicon-missing.ico').set('Accept', 'image/*'), 404, 'route_not_found');
  });

  it('a known path with the wrong method → 405 with Allow', async () => {
    const response = await request(context.app).put('/v1/members').set(bearer(secret));
    expectProblem(response, 405, 'method_not_allowed');
    expect(response.headers.allow).toBe('GET, HEAD');
    const withParam = await request(context.app).post('/v1/members/mem_abc').set(bearer(secret));
    expect(withParam.headers.allow).toBe('DELETE, PATCH');
  });

  it('a malformed URL escape → 400, not 500', async () => {
    const response = await request(context.app).patch('/v1/members/%E0%A4%A').set(bearer(secret)).send({ role: 'viewer' });
    expect(response.status).toBeGreaterThanOrEqual(400);
    expect(response.status).toBeLessThan(500);
  });

  it('over-long strings are refused by validation before they reach a column', async () => {
    const bigContext = await createTestContext();
    try {
      const response = await request(bigContext.app)
        .post('/v1/auth/sign-up')
        .send({ email: `${'a'.repeat(250)}@kestrelbay.example`, password: 'long-enough-password', displayName: 'x'.repeat(101), organisationName: 'y' });
      const problem = expectProblem(response, 400, 'validation_failed');
      expect(problem.errors?.map((error) => error.pointer).sort()).toEqual(['#/displayName', '#/email']);
    } finally {
      await bigContext.close();
    }
  });
});

describe('unhandled failures', () => {
  it('answer 500 internal_error without stack, SQL or driver messages, and health says degraded', async () => {
    // A database that is gone: every query fails inside the driver.
    const broken = createDatabase(`${context.database.url}_missing`, { connectionLimit: 1 });
    const app = createApp({ ...context.deps, db: broken.db }, { consoleDir: null });
    try {
      const response = await request(app).get('/v1/members').set(bearer(secret));
      const problem = expectProblem(response, 500, 'internal_error');
      const text = JSON.stringify(response.body);
      expect(text).not.toMatch(/select|from `|ER_|Unknown database|at .*\.ts/i);
      expect(problem.detail).toMatch(/request id/i);

      const health = await request(app).get('/v1/health');
      expect(health.status).toBe(503);
      expect(health.body).toMatchObject({ status: 'degraded', database: { status: 'unavailable', latencyMs: null } });
    } finally {
      await broken.close();
    }
  });
});
