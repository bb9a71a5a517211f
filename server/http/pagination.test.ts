import { describe, expect, it } from 'vitest';
import { loadConfig } from '@server/config/env';
import type { AppDeps } from '@server/deps';
import { ApiProblem } from './api-problem';
import { decodeCursor, encodeCursor, toPage } from './pagination';

const deps = { config: loadConfig({ SESSION_SECRET: 'test-secret-for-cursor-sealing' }) } as AppDeps;
const binding = { list: 'api-keys', organisationId: 'org_a' };
const position = { createdAt: new Date('2025-02-03T04:05:06.789Z'), id: 'key_x' };

describe('cursor', () => {
  it('round-trips a position for the same binding', () => {
    expect(decodeCursor(deps, binding, encodeCursor(deps, binding, position))).toEqual(position);
  });

  it('is refused for another binding (changed filter or organisation)', () => {
    const cursor = encodeCursor(deps, binding, position);
    expect(() => decodeCursor(deps, { ...binding, organisationId: 'org_b' }, cursor)).toThrow(ApiProblem);
    expect(() => decodeCursor(deps, { ...binding, action: 'api_key.created' }, cursor)).toThrow(/not issued/);
  });

  it('is refused when the position is edited', () => {
    const [, signature] = encodeCursor(deps, binding, position).split('.');
    const forged = Buffer.from(JSON.stringify(['2030-01-01T00:00:00.000Z', 'key_x'])).toString('base64url');
    expect(() => decodeCursor(deps, binding, `${forged}.${signature}`)).toThrow(ApiProblem);
    expect(() => decodeCursor(deps, binding, 'garbage')).toThrow(ApiProblem);
  });
});

describe('toPage', () => {
  const rows = [3, 2, 1].map((n) => ({ id: `k${n}`, createdAt: new Date(n * 1000) }));
  it('uses the extra row only to tell that more follow', () => {
    const page = toPage(deps, binding, rows, 2, (row) => row, (row) => row.id);
    expect(page.data).toEqual(['k3', 'k2']);
    expect(page.hasMore).toBe(true);
    expect(decodeCursor(deps, binding, page.nextCursor)).toEqual({ id: 'k2', createdAt: new Date(2000) });
  });
  it('omits nextCursor on the last page', () => {
    const page = toPage(deps, binding, rows, 3, (row) => row, (row) => row.id);
    expect(page).toEqual({ data: ['k3', 'k2', 'k1'], hasMore: false });
  });
});
