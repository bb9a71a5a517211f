import type { AppDeps } from '@server/deps';
import { constantTimeEqual, deriveKey, hmacSha256Base64Url } from '@server/lib/crypto';
import type { Page } from '@shared/schemas/pagination';
import { ApiProblem } from './api-problem';

/** Where a page ended, in the list's order (createdAt DESC, id DESC). */
export interface CursorPosition {
  createdAt: Date;
  id: string;
}

/** What a cursor is only valid for: the list, the organisation and every filter of the query. */
export type CursorBinding = Record<string, string | number | boolean | null | undefined>;

const keys = new Map<string, Buffer>();
function cursorKey(secret: string): Buffer {
  let key = keys.get(secret);
  if (!key) {
    key = deriveKey(secret, 'pagination-cursor');
    keys.set(secret, key);
  }
  return key;
}

function canonical(binding: CursorBinding): string {
  return JSON.stringify(Object.keys(binding).sort().map((name) => [name, binding[name] ?? null]));
}

function mac(deps: AppDeps, payload: string, binding: CursorBinding): string {
  return hmacSha256Base64Url(cursorKey(deps.config.sessionSecret), `${payload}\n${canonical(binding)}`);
}

/**
 * Cursor = base64url(position) + "." + HMAC over position and binding. The MAC makes it unforgeable and ties
 * it to the query it came from; it is never authorisation (every query is scoped by organisation anyway).
 */
export function encodeCursor(deps: AppDeps, binding: CursorBinding, position: CursorPosition): string {
  const payload = Buffer.from(JSON.stringify([position.createdAt.toISOString(), position.id]), 'utf8').toString('base64url');
  return `${payload}.${mac(deps, payload, binding)}`;
}

export function decodeCursor(deps: AppDeps, binding: CursorBinding, cursor: string | undefined): CursorPosition | undefined {
  if (cursor === undefined) return undefined;
  const invalid = () =>
    new ApiProblem('invalid_cursor', 'The cursor was not issued for this list with these filters. Start again without a cursor.', {
      errors: [{ in: 'query', pointer: '#/cursor', detail: 'Use nextCursor from the previous page of the same query.' }],
    });
  const [payload, signature, extra] = cursor.split('.');
  if (!payload || !signature || extra !== undefined) throw invalid();
  if (!constantTimeEqual(signature, mac(deps, payload, binding))) throw invalid();
  try {
    const [createdAt, id] = JSON.parse(Buffer.from(payload, 'base64url').toString('utf8')) as [string, string];
    const date = new Date(createdAt);
    if (Number.isNaN(date.getTime()) || typeof id !== 'string') throw new Error('bad position');
    return { createdAt: date, id };
  } catch {
    throw invalid();
  }
}

/**
 * A cursor carrying any JSON values (e.g. a sort key and the id tiebreak), sealed like encodeCursor: a list
 * ordered by something other than (createdAt, id) uses these and checks the decoded shape itself.
 */
export function encodeValuesCursor(deps: AppDeps, binding: CursorBinding, values: unknown[]): string {
  const payload = Buffer.from(JSON.stringify(values), 'utf8').toString('base64url');
  return `${payload}.${mac(deps, payload, binding)}`;
}

/** The values of a cursor from encodeValuesCursor with the same binding; invalid_cursor otherwise. */
export function decodeValuesCursor(deps: AppDeps, binding: CursorBinding, cursor: string): unknown[] {
  const [payload, signature, extra] = cursor.split('.');
  if (!payload || !signature || extra !== undefined || !constantTimeEqual(signature, mac(deps, payload, binding))) throw invalidCursor();
  try {
    const values: unknown = JSON.parse(Buffer.from(payload, 'base64url').toString('utf8'));
    if (!Array.isArray(values)) throw new Error('not a list');
    return values;
  } catch {
    throw invalidCursor();
  }
}

export function invalidCursor(): ApiProblem {
  return new ApiProblem('invalid_cursor', 'The cursor was not issued for this list with these filters and this sort. Start again without a cursor.', {
    errors: [{ in: 'query', pointer: '#/cursor', detail: 'Use nextCursor from the previous page of the same query.' }],
  });
}

/** Turns limit+1 fetched rows into a page; the extra row only tells whether another page exists. */
export function toPage<Row, Item>(
  deps: AppDeps,
  binding: CursorBinding,
  rows: Row[],
  limit: number,
  positionOf: (row: Row) => CursorPosition,
  present: (row: Row) => Item,
): Page<Item> {
  const hasMore = rows.length > limit;
  const pageRows = hasMore ? rows.slice(0, limit) : rows;
  const last = pageRows.at(-1);
  return {
    data: pageRows.map(present),
    hasMore,
    ...(hasMore && last ? { nextCursor: encodeCursor(deps, binding, positionOf(last)) } : {}),
  };
}
