import { and, eq } from 'drizzle-orm';
import type { Executor } from '@server/db/client';
import { newestFirst, olderThan } from '@server/db/keyset';
import { auditEvents } from '@server/db/tables';
import type { CursorPosition } from '@server/http/pagination';

export type AuditEventRow = typeof auditEvents.$inferSelect;

export async function insertAuditEvent(db: Executor, organisationId: string, row: Omit<typeof auditEvents.$inferInsert, 'organisationId'>) {
  await db.insert(auditEvents).values({ ...row, organisationId });
}

export async function listAuditEvents(
  db: Executor,
  organisationId: string,
  query: { limit: number; after?: CursorPosition; action?: string; objectId?: string },
): Promise<AuditEventRow[]> {
  return db
    .select()
    .from(auditEvents)
    .where(
      and(
        eq(auditEvents.organisationId, organisationId),
        query.action ? eq(auditEvents.action, query.action) : undefined,
        query.objectId ? eq(auditEvents.objectId, query.objectId) : undefined,
        olderThan(auditEvents.createdAt, auditEvents.id, query.after),
      ),
    )
    .orderBy(...newestFirst(auditEvents.createdAt, auditEvents.id))
    .limit(query.limit + 1);
}
