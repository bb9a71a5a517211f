import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { manualClock } from '@server/lib/clock';
import { SESSION_COOKIE } from '@server/modules/auth/session-token';
import { signUp } from '../support/actors';
import { createTestContext, type TestContext } from '../support/test-app';

// The clock starts at the real time: the test client's cookie jar drops cookies whose Expires lies in the
// real past, so server time may only run ahead of it.
const HOUR_MS = 3600_000;
const start = () => new Date(Math.ceil(Date.now() / HOUR_MS) * HOUR_MS);
const at = (base: Date, hours: number) => new Date(base.getTime() + hours * HOUR_MS);
const clock = manualClock(start());

let context: TestContext;
beforeAll(async () => {
  context = await createTestContext({ clock });
});
afterAll(async () => {
  await context?.close();
});

function refreshedCookie(headers: Record<string, unknown>): string | undefined {
  return ([] as string[]).concat((headers['set-cookie'] as string[] | undefined) ?? []).find((cookie) => cookie.startsWith(`${SESSION_COOKIE}=`));
}

describe('session lifetime (12 hours, refreshed by use, at most 7 days)', () => {
  it('expires 12 hours after sign-in when unused', async () => {
    const base = start();
    clock.set(base);
    const { agent, session } = await signUp(context);
    expect(session.expiresAt).toBe(at(base, 12).toISOString());

    clock.set(at(base, 5)); // more than half left: used, but not re-issued
    const used = await agent.get('/v1/members');
    expect(used.status).toBe(200);
    expect(refreshedCookie(used.headers)).toBeUndefined();

    clock.set(new Date(at(base, 12).getTime() + 1000));
    const expired = await agent.get('/v1/members');
    expect(expired.status).toBe(401);
    expect(expired.body.code).toBe('session_expired');
  });

  it('is re-issued when used after half its lifetime, keeping the console signed in', async () => {
    const base = start();
    clock.set(base);
    const { agent } = await signUp(context);

    clock.set(at(base, 2));
    const early = await agent.get('/v1/auth/session');
    expect(refreshedCookie(early.headers)).toBeUndefined();
    expect(early.body.expiresAt).toBe(at(base, 12).toISOString());

    clock.set(at(base, 7)); // less than half of the 12 hours left
    const later = await agent.get('/v1/auth/session');
    expect(refreshedCookie(later.headers)).toBeDefined();
    expect(later.body.expiresAt).toBe(at(base, 19).toISOString());

    clock.set(at(base, 13)); // past the first token's expiry, within the refreshed one
    expect((await agent.get('/v1/members')).status).toBe(200);
  });

  it('ends 7 days after the password sign-in however often it is refreshed', async () => {
    const base = start();
    clock.set(base);
    const { agent } = await signUp(context);
    for (let hours = 5; hours < 7 * 24; hours += 5) {
      clock.set(at(base, hours));
      const response = await agent.get('/v1/auth/session');
      expect(response.status).toBe(200);
      expect(Date.parse(response.body.expiresAt)).toBeLessThanOrEqual(at(base, 7 * 24).getTime());
    }
    clock.set(new Date(at(base, 7 * 24).getTime() + 1000));
    const response = await agent.get('/v1/auth/session');
    expect(response.status).toBe(401);
    expect(response.body.code).toBe('session_expired');
  });
});
