import { and, desc, eq, lt, or, type SQL } from 'drizzle-orm';
import type { MySqlColumn } from 'drizzle-orm/mysql-core';

/** Rows after `position` in (createdAt DESC, id DESC) order; pair with `newestFirst` and a matching index. */
export function olderThan(createdAt: MySqlColumn, id: MySqlColumn, position: { createdAt: Date; id: string } | undefined): SQL | undefined {
  if (!position) return undefined;
  return or(lt(createdAt, position.createdAt), and(eq(createdAt, position.createdAt), lt(id, position.id)));
}

export function newestFirst(createdAt: MySqlColumn, id: MySqlColumn): SQL[] {
  return [desc(createdAt), desc(id)];
}
