import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { manualClock } from '@server/lib/clock';
import { createApiKey, signUp, type SignedUp } from '../support/actors';
import { createTestContext, type TestContext } from '../support/test-app';

const clock = manualClock(new Date(Math.ceil(Date.now() / 60_000) * 60_000));
let context: TestContext;
let owner: SignedUp;
const createdIds: string[] = [];
beforeAll(async () => {
  context = await createTestContext({ clock });
  owner = await signUp(context);
  // 25 keys; pairs share a millisecond so the (createdAt, id) tie-break is exercised.
  for (let n = 0; n < 25; n += 1) {
    if (n % 2 === 0) clock.advanceSeconds(1);
    createdIds.push((await createApiKey(owner.agent, ['members:read'], { name: `rig ${n}` })).apiKey.id);
  }
});
afterAll(async () => {
  await context?.close();
});

async function collect(path: string, query: Record<string, string | number>) {
  const pages: Array<{ data: Array<{ id: string; createdAt: string }>; hasMore: boolean; nextCursor?: string }> = [];
  let cursor: string | undefined;
  do {
    const response = await owner.agent.get(path).query({ ...query, ...(cursor ? { cursor } : {}) });
    expect(response.status, JSON.stringify(response.body)).toBe(200);
    pages.push(response.body);
    cursor = response.body.nextCursor;
  } while (cursor);
  return pages;
}

describe('cursor pagination', () => {
  it('defaults to 20 items, newest first', async () => {
    const first = await owner.agent.get('/v1/api-keys');
    expect(first.body.data).toHaveLength(20);
    expect(first.body.hasMore).toBe(true);
    expect(typeof first.body.nextCursor).toBe('string');
  });

  it('walks every item exactly once in (createdAt, id) descending order, omitting nextCursor at the end', async () => {
    const pages = await collect('/v1/api-keys', { limit: 7 });
    expect(pages.map((page) => page.data.length)).toEqual([7, 7, 7, 4]);
    const last = pages.at(-1)!;
    expect(last.hasMore).toBe(false);
    expect('nextCursor' in last).toBe(false);
    const items = pages.flatMap((page) => page.data);
    expect(items.map((item) => item.id).sort()).toEqual([...createdIds].sort());
    const sorted = [...items].sort((a, b) => (a.createdAt === b.createdAt ? (a.id < b.id ? 1 : -1) : a.createdAt < b.createdAt ? 1 : -1));
    expect(items.map((item) => item.id)).toEqual(sorted.map((item) => item.id));
  });

  it('binds the cursor to the filters it was made with', async () => {
    const page = await owner.agent.get('/v1/audit-events').query({ limit: 2, action: 'api_key.created' });
    expect(page.body.data.every((event: { action: string }) => event.action === 'api_key.created')).toBe(true);
    const sameFilter = await owner.agent.get('/v1/audit-events').query({ limit: 2, action: 'api_key.created', cursor: page.body.nextCursor });
    expect(sameFilter.status).toBe(200);
    const otherFilter = await owner.agent.get('/v1/audit-events').query({ limit: 2, action: 'member.removed', cursor: page.body.nextCursor });
    expect(otherFilter.status).toBe(400);
    expect(otherFilter.body.code).toBe('invalid_cursor');
    const otherList = await owner.agent.get('/v1/api-keys').query({ cursor: page.body.nextCursor });
    expect(otherList.body.code).toBe('invalid_cursor');
  });

  it('lowers limits above 100 to 100', async () => {
    const response = await owner.agent.get('/v1/audit-events').query({ limit: 5000 });
    expect(response.status).toBe(200);
    expect(response.body.data.length).toBeLessThanOrEqual(100);
    expect(response.body.data.length).toBe(26); // organisation.created + 25 api_key.created
  });
});
