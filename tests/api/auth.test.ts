import jwt from 'jsonwebtoken';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { PERMISSIONS } from '@shared/schemas/permissions';
import { sessionSchema } from '@shared/schemas/auth';
import { findUserByEmail } from '@server/modules/auth/users.repo';
import { SESSION_COOKIE } from '@server/modules/auth/session-token';
import { browserAgent, signUp, uniqueEmail } from '../support/actors';
import { createTestContext, type TestContext } from '../support/test-app';

let context: TestContext;
beforeAll(async () => {
  context = await createTestContext();
});
afterAll(async () => {
  await context?.close();
});

function sessionCookieOf(response: request.Response): string | undefined {
  const cookies = ([] as string[]).concat(response.headers['set-cookie'] ?? []);
  return cookies.find((cookie) => cookie.startsWith(`${SESSION_COOKIE}=`));
}

describe('sign-up', () => {
  it('creates the user, an organisation with the user as owner, and a session cookie', async () => {
    const agent = browserAgent(context);
    const email = uniqueEmail('founder');
    const response = await agent
      .post('/v1/auth/sign-up')
      .send({ email: email.toUpperCase(), password: 'kb-t25-tweeter-pass', displayName: 'Ada Okafor', organisationName: 'Kestrel Bay Acoustics' });

    expect(response.status).toBe(201);
    const session = sessionSchema.parse(response.body);
    expect(session.user.email).toBe(email);
    expect(session.activeOrganisation).toMatchObject({ name: 'Kestrel Bay Acoustics', role: 'owner' });
    expect(session.memberships).toHaveLength(1);
    expect(session.permissions.sort()).toEqual([...PERMISSIONS].sort());

    const cookie = sessionCookieOf(response)!;
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(cookie).not.toMatch(/Secure/i); // served over http://127.0.0.1 in tests
    // Bounded lifetime: 12 hours from now (± a minute).
    const expires = Date.parse(/Expires=([^;]+)/i.exec(cookie)![1]);
    expect(Math.abs(expires - (Date.now() + 12 * 3600_000))).toBeLessThan(60_000);

    const me = await agent.get('/v1/auth/session');
    expect(me.status).toBe(200);
    expect(me.body.user.id).toBe(session.user.id);
  });

  it('stores an argon2id hash, never the password', async () => {
    const { email, password } = await signUp(context);
    const user = await findUserByEmail(context.deps.db, email);
    expect(user?.passwordHash).toMatch(/^\$argon2id\$v=19\$m=19456,t=2,p=1\$/);
    expect(user?.passwordHash).not.toContain(password);
  });

  it('refuses a second account with the same e-mail address (any letter case)', async () => {
    const { email } = await signUp(context);
    const response = await browserAgent(context)
      .post('/v1/auth/sign-up')
      .send({ email: email.toUpperCase(), password: 'another-long-password', displayName: 'B', organisationName: 'Other' });
    expect(response.status).toBe(409);
    expect(response.body.code).toBe('email_already_registered');
  });

  it('refuses passwords shorter than 12 characters', async () => {
    const response = await browserAgent(context)
      .post('/v1/auth/sign-up')
      .send({ email: uniqueEmail('short'), password: 'elevenchars', displayName: 'C', organisationName: 'O' });
    expect(response.status).toBe(400);
    expect(response.body.errors).toEqual([expect.objectContaining({ in: 'body', pointer: '#/password' })]);
  });
});

describe('sign-in and sign-out', () => {
  it('signs in with the right password and out again', async () => {
    const { email, password, session } = await signUp(context);
    const agent = browserAgent(context);
    const signedIn = await agent.post('/v1/auth/sign-in').send({ email, password });
    expect(signedIn.status).toBe(200);
    expect(signedIn.body.user.id).toBe(session.user.id);
    expect(sessionCookieOf(signedIn)).toBeDefined();
    expect((await agent.get('/v1/members')).status).toBe(200);

    const signedOut = await agent.post('/v1/auth/sign-out');
    expect(signedOut.status).toBe(204);
    expect(sessionCookieOf(signedOut)).toMatch(/Expires=Thu, 01 Jan 1970/);
    const after = await agent.get('/v1/auth/session');
    expect(after.status).toBe(401);
    expect(after.body.code).toBe('not_authenticated');
  });

  it('refuses a copy of the cookie after sign-out, on the same session and after it was re-issued by use', async () => {
    const { email, password } = await signUp(context);
    const agent = browserAgent(context);
    const signedIn = await agent.post('/v1/auth/sign-in').send({ email, password });
    const copied = sessionCookieOf(signedIn)!.split(';')[0];
    // Another client holding a copy of the cookie (a stolen cookie, or a second tab).
    const withCopy = () => request(context.app).get('/v1/auth/session').set('Cookie', copied);
    expect((await withCopy()).status).toBe(200);

    // Switching organisation re-issues the token; it stays the same sign-in, so signing out ends both tokens.
    const other = await signUp(context);
    expect(other.session.user.id).not.toBe(signedIn.body.user.id);
    expect((await agent.post('/v1/auth/sign-out')).status).toBe(204);
    const refused = await withCopy();
    expect(refused.status).toBe(401);
    expect(refused.body.code).toBe('not_authenticated');
    expect(refused.body.detail).toMatch(/signed out/);
    // A new sign-in is a new session and works.
    expect((await agent.post('/v1/auth/sign-in').send({ email, password })).status).toBe(200);
    expect((await agent.get('/v1/auth/session')).status).toBe(200);
  });

  it('keeps the session id when the token is re-issued, so sign-out also ends the older copies', async () => {
    const { email, password, session } = await signUp(context);
    const agent = browserAgent(context);
    const signedIn = await agent.post('/v1/auth/sign-in').send({ email, password });
    const first = sessionCookieOf(signedIn)!.split(';')[0];
    // Tokens carry whole seconds: wait for the next one so the re-issued token differs from the first.
    await new Promise((resolve) => setTimeout(resolve, 1100));
    const switched = await agent.post('/v1/auth/active-organisation').send({ organisationId: session.activeOrganisation.id });
    expect(switched.status).toBe(200);
    const second = sessionCookieOf(switched)!.split(';')[0];
    expect(second).not.toBe(first);
    const sessionIdOf = (cookie: string) => (jwt.decode(decodeURIComponent(cookie.split('=')[1])) as { sid: string }).sid;
    expect(sessionIdOf(second)).toBe(sessionIdOf(first));
    expect((await agent.post('/v1/auth/sign-out')).status).toBe(204);
    for (const cookie of [first, second]) {
      expect((await request(context.app).get('/v1/auth/session').set('Cookie', cookie)).status).toBe(401);
    }
  });

  it('signs out cleanly without a cookie or with a forged one', async () => {
    const forged = `${SESSION_COOKIE}=not.a.token`;
    expect((await browserAgent(context).post('/v1/auth/sign-out')).status).toBe(204);
    expect((await browserAgent(context).post('/v1/auth/sign-out').set('Cookie', forged)).status).toBe(204);
  });

  it('answers a wrong password and an unknown e-mail identically', async () => {
    const { email } = await signUp(context);
    const wrongPassword = await browserAgent(context).post('/v1/auth/sign-in').send({ email, password: 'not-the-password' });
    const unknownEmail = await browserAgent(context).post('/v1/auth/sign-in').send({ email: uniqueEmail('nobody'), password: 'not-the-password' });
    for (const response of [wrongPassword, unknownEmail]) {
      expect(response.status).toBe(401);
      expect(response.headers['content-type']).toMatch(/^application\/problem\+json/);
      expect(sessionCookieOf(response)).toBeUndefined();
    }
    const strip = (body: Record<string, unknown>) => ({ ...body, instance: undefined, requestId: undefined });
    expect(strip(wrongPassword.body)).toEqual(strip(unknownEmail.body));
    expect(wrongPassword.body.code).toBe('invalid_credentials');
  });

  it('takes similar time for an unknown e-mail as for a wrong password (both hash once)', async () => {
    const { email } = await signUp(context);
    const time = async (address: string) => {
      const started = performance.now();
      await browserAgent(context).post('/v1/auth/sign-in').send({ email: address, password: 'wrong-password-x' });
      return performance.now() - started;
    };
    await time(email); // warm-up: the dummy hash is computed lazily
    await time(uniqueEmail('warmup'));
    const known = [await time(email), await time(email)];
    const unknown = [await time(uniqueEmail('u1')), await time(uniqueEmail('u2'))];
    const median = (values: number[]) => values.sort((a, b) => a - b)[Math.floor(values.length / 2)];
    // An argon2id verification costs tens of milliseconds; skipping it for unknown accounts would show as a
    // large ratio. The bound is loose because the test machine is shared.
    expect(median(unknown) / median(known)).toBeGreaterThan(0.4);
  });

  it('reports no session without a cookie and rejects a forged cookie', async () => {
    const none = await request(context.app).get('/v1/auth/session');
    expect(none.status).toBe(401);
    expect(none.body.code).toBe('not_authenticated');

    const forged = await request(context.app).get('/v1/auth/session').set('Cookie', `${SESSION_COOKIE}=eyJhbGciOiJub25lIn0.e30.`);
    expect(forged.status).toBe(401);
    expect(forged.body.code).toBe('not_authenticated');
  });
});

describe('organisations of one user', () => {
  it('switches the active organisation among the user\'s own and refuses others with 404', async () => {
    const first = await signUp(context, { organisationName: 'Kestrel Bay Acoustics' });
    const second = await signUp(context, { organisationName: 'Kestrel Bay Service Lab' });
    const stranger = await signUp(context, { organisationName: 'Unrelated Lab' });
    const { joinOrganisation } = await import('../support/actors');
    const joined = await joinOrganisation(context, first, second.organisationId, 'analyst');
    expect(joined.session.activeOrganisation).toMatchObject({ id: second.organisationId, role: 'analyst' });
    expect(joined.session.memberships.map((membership) => membership.organisationId).sort()).toEqual(
      [first.organisationId, second.organisationId].sort(),
    );
    expect(joined.session.permissions).not.toContain('keys:manage');

    const back = await first.agent.post('/v1/auth/active-organisation').send({ organisationId: first.organisationId });
    expect(back.status).toBe(200);
    expect(back.body.activeOrganisation.role).toBe('owner');

    const foreign = await first.agent.post('/v1/auth/active-organisation').send({ organisationId: stranger.organisationId });
    expect(foreign.status).toBe(404);
    expect(foreign.body.code).toBe('not_found');
  });
});
