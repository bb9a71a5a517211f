import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { bearer, createApiKey, signUp, type SignedUp } from '../support/actors';
import { createTestContext, type TestContext } from '../support/test-app';

let context: TestContext;
let owner: SignedUp;
let cookie: string;

beforeAll(async () => {
  context = await createTestContext();
  owner = await signUp(context);
  const signIn = await request(context.app).post('/v1/auth/sign-in').send({ email: owner.email, password: owner.password });
  cookie = ([] as string[]).concat(signIn.headers['set-cookie']).find((value) => value.startsWith('swl_session='))!.split(';')[0];
});
afterAll(async () => {
  await context?.close();
});

const createKeyBody = { name: 'CSRF probe', scopes: ['analyses:read'] };

describe('CSRF defence on cookie-authenticated writes', () => {
  it('refuses a write whose Origin is another site', async () => {
    const response = await request(context.app).post('/v1/api-keys').set('Cookie', cookie).set('Origin', 'https://evil.example').send(createKeyBody);
    expect(response.status).toBe(403);
    expect(response.body.code).toBe('csrf_origin_mismatch');
  });

  it('refuses a write with a cookie but neither Origin nor Referer', async () => {
    const response = await request(context.app).post('/v1/api-keys').set('Cookie', cookie).send(createKeyBody);
    expect(response.status).toBe(403);
    expect(response.body.code).toBe('csrf_origin_mismatch');
  });

  it('judges by Referer when Origin is absent', async () => {
    const foreign = await request(context.app).delete('/v1/members/mem_x').set('Cookie', cookie).set('Referer', 'https://evil.example/page');
    expect(foreign.body.code).toBe('csrf_origin_mismatch');
    const own = await request(context.app).post('/v1/api-keys').set('Cookie', cookie).set('Referer', `${context.origin}/api-keys`).send(createKeyBody);
    expect(own.status).toBe(201);
  });

  it('accepts the public origin and the origin the request was addressed to', async () => {
    const publicOrigin = await request(context.app).post('/v1/api-keys').set('Cookie', cookie).set('Origin', context.origin).send(createKeyBody);
    expect(publicOrigin.status).toBe(201);
    const served = await request(context.app)
      .post('/v1/api-keys')
      .set('Cookie', cookie)
      .set('Host', 'localhost:4620')
      .set('Origin', 'http://localhost:4620')
      .send(createKeyBody);
    expect(served.status).toBe(201);
  });

  it('refuses a foreign-origin sign-in (login CSRF) but lets scripts without a cookie sign in', async () => {
    const foreign = await request(context.app).post('/v1/auth/sign-in').set('Origin', 'https://evil.example').send({ email: owner.email, password: owner.password });
    expect(foreign.status).toBe(403);
    expect(foreign.body.code).toBe('csrf_origin_mismatch');
    const script = await request(context.app).post('/v1/auth/sign-in').send({ email: owner.email, password: owner.password });
    expect(script.status).toBe(200);
  });

  it('leaves reads alone and exempts bearer-key requests', async () => {
    const read = await request(context.app).get('/v1/api-keys').set('Cookie', cookie).set('Origin', 'https://evil.example');
    expect(read.status).toBe(200);
    const { secret } = await createApiKey(owner.agent, ['keys:manage']);
    const keyWrite = await request(context.app).post('/v1/api-keys').set(bearer(secret)).set('Origin', 'https://evil.example').send(createKeyBody);
    expect(keyWrite.status).toBe(403); // past the CSRF check; refused because the key lacks analyses:read
    expect(keyWrite.body.code).toBe('scope_not_held');
  });
});
