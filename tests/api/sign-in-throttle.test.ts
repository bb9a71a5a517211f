import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { manualClock } from '@server/lib/clock';
import { signUp, uniqueEmail } from '../support/actors';
import { createTestContext, type TestContext } from '../support/test-app';

const clock = manualClock(new Date(Math.ceil(Date.now() / 60_000) * 60_000));
let context: TestContext;
beforeAll(async () => {
  context = await createTestContext({ clock });
});
afterAll(async () => {
  await context?.close();
});

const signIn = (email: string, password: string, address = '198.51.100.7') =>
  request(context.app).post('/v1/auth/sign-in').set('X-Forwarded-For', address).send({ email, password });

describe('sign-in throttling', () => {
  it('locks an account for 15 minutes after 5 failures, even for the right password', async () => {
    const { email, password } = await signUp(context);
    for (let attempt = 1; attempt <= 5; attempt += 1) {
      const response = await signIn(email, 'wrong-password-guess');
      expect(response.status, `attempt ${attempt}`).toBe(401);
      clock.advanceSeconds(10);
    }
    const locked = await signIn(email, password);
    expect(locked.status).toBe(429);
    expect(locked.body.code).toBe('sign_in_throttled');
    // The first failure was 50 s ago: it leaves the 15-minute window in 850 s.
    expect(locked.headers['retry-after']).toBe('850');
    expect(locked.body.retryAfterSeconds).toBe(850);

    clock.advanceSeconds(849);
    expect((await signIn(email, password)).status).toBe(429);
    clock.advanceSeconds(2);
    expect((await signIn(email, password)).status).toBe(200);
  });

  it('forgets an account\'s failures after a successful sign-in', async () => {
    const { email, password } = await signUp(context);
    for (let attempt = 0; attempt < 4; attempt += 1) await signIn(email, 'wrong-password-guess');
    expect((await signIn(email, password)).status).toBe(200);
    for (let attempt = 0; attempt < 4; attempt += 1) expect((await signIn(email, 'wrong-password-guess')).status).toBe(401);
    expect((await signIn(email, password)).status).toBe(200);
  });

  it('throttles unknown e-mail addresses the same way (no hint that the account is missing)', async () => {
    const email = uniqueEmail('ghost');
    for (let attempt = 0; attempt < 5; attempt += 1) expect((await signIn(email, 'anything-at-all')).status).toBe(401);
    expect((await signIn(email, 'anything-at-all')).status).toBe(429);
  });
});

describe('sign-in throttling per address', () => {
  let addressContext: TestContext;
  beforeAll(async () => {
    // Behind a proxy the client address comes from X-Forwarded-For; trust it here to simulate many clients.
    addressContext = await createTestContext({ clock, config: { trustProxy: true } });
  });
  afterAll(async () => {
    await addressContext?.close();
  });

  it('refuses an address after 20 failures across accounts, while other addresses still sign in', async () => {
    const victim = await signUp(addressContext);
    const attempt = (email: string, password: string, address: string) =>
      request(addressContext.app).post('/v1/auth/sign-in').set('X-Forwarded-For', address).send({ email, password });
    for (let n = 0; n < 20; n += 1) {
      expect((await attempt(uniqueEmail(`spray${n}`), 'password-spray-1', '203.0.113.9')).status).toBe(401);
    }
    const fromAttacker = await attempt(victim.email, victim.password, '203.0.113.9');
    expect(fromAttacker.status).toBe(429);
    expect(Number(fromAttacker.headers['retry-after'])).toBeGreaterThan(0);
    expect((await attempt(victim.email, victim.password, '203.0.113.10')).status).toBe(200);
  });
});
