import { and, asc, eq, inArray, isNull, lte, lt, or, sql } from 'drizzle-orm';
import type { Executor } from '@server/db/client';
import { newestFirst, olderThan } from '@server/db/keyset';
import { webhookDeliveries, webhookDeliveryAttempts, webhookEndpoints, webhookEvents } from '@server/db/tables';
import type { CursorPosition } from '@server/http/pagination';

export type WebhookDeliveryRow = typeof webhookDeliveries.$inferSelect;
export type WebhookEventRow = typeof webhookEvents.$inferSelect;
export type WebhookAttemptRow = typeof webhookDeliveryAttempts.$inferSelect;

export async function insertEvent(db: Executor, organisationId: string, row: Omit<typeof webhookEvents.$inferInsert, 'organisationId'>) {
  await db.insert(webhookEvents).values({ ...row, organisationId });
}

export async function insertDeliveries(db: Executor, organisationId: string, rows: Omit<typeof webhookDeliveries.$inferInsert, 'organisationId'>[]) {
  if (rows.length === 0) return;
  await db.insert(webhookDeliveries).values(rows.map((row) => ({ ...row, organisationId })));
}

export async function findDelivery(db: Executor, organisationId: string, endpointId: string, deliveryId: string) {
  const [row] = await db
    .select({ delivery: webhookDeliveries, event: webhookEvents })
    .from(webhookDeliveries)
    .innerJoin(webhookEvents, eq(webhookEvents.id, webhookDeliveries.eventId))
    .where(
      and(
        eq(webhookDeliveries.organisationId, organisationId),
        eq(webhookDeliveries.endpointId, endpointId),
        eq(webhookDeliveries.id, deliveryId),
      ),
    )
    .limit(1);
  return row;
}

export async function listDeliveries(db: Executor, organisationId: string, endpointId: string, page: { limit: number; after?: CursorPosition }) {
  return db
    .select({ delivery: webhookDeliveries, eventType: webhookEvents.type })
    .from(webhookDeliveries)
    .innerJoin(webhookEvents, eq(webhookEvents.id, webhookDeliveries.eventId))
    .where(
      and(
        eq(webhookDeliveries.organisationId, organisationId),
        eq(webhookDeliveries.endpointId, endpointId),
        olderThan(webhookDeliveries.createdAt, webhookDeliveries.id, page.after),
      ),
    )
    .orderBy(...newestFirst(webhookDeliveries.createdAt, webhookDeliveries.id))
    .limit(page.limit + 1);
}

export async function listAttempts(db: Executor, organisationId: string, deliveryIds: string[]): Promise<WebhookAttemptRow[]> {
  if (deliveryIds.length === 0) return [];
  return db
    .select()
    .from(webhookDeliveryAttempts)
    .where(and(eq(webhookDeliveryAttempts.organisationId, organisationId), inArray(webhookDeliveryAttempts.deliveryId, deliveryIds)))
    .orderBy(asc(webhookDeliveryAttempts.attemptNumber));
}

/**
 * Takes up to `limit` due deliveries for this dispatcher: rows locked by another dispatcher's claim are skipped
 * (FOR UPDATE SKIP LOCKED), and each taken row gets a lease so no one else sends it until the lease ends.
 * Not scoped by organisation: the dispatcher serves every organisation.
 */
export async function claimDueDeliveries(db: Executor, now: Date, leaseUntil: Date, limit: number): Promise<string[]> {
  return db.transaction(async (tx) => {
    const rows = await tx
      .select({ id: webhookDeliveries.id })
      .from(webhookDeliveries)
      .where(
        and(
          eq(webhookDeliveries.status, 'pending'),
          lte(webhookDeliveries.nextAttemptAt, now),
          or(isNull(webhookDeliveries.lockedUntil), lt(webhookDeliveries.lockedUntil, now)),
        ),
      )
      .orderBy(asc(webhookDeliveries.nextAttemptAt))
      .limit(limit)
      .for('update', { skipLocked: true });
    const ids = rows.map((row) => row.id);
    if (ids.length > 0) await tx.update(webhookDeliveries).set({ lockedUntil: leaseUntil }).where(inArray(webhookDeliveries.id, ids));
    return ids;
  });
}

/** A claimed delivery with what sending it needs. Not scoped by organisation (dispatcher); the row carries it. */
export async function loadClaimedDelivery(db: Executor, deliveryId: string) {
  const [row] = await db
    .select({ delivery: webhookDeliveries, event: webhookEvents, endpoint: webhookEndpoints })
    .from(webhookDeliveries)
    .innerJoin(webhookEvents, eq(webhookEvents.id, webhookDeliveries.eventId))
    .innerJoin(webhookEndpoints, eq(webhookEndpoints.id, webhookDeliveries.endpointId))
    .where(eq(webhookDeliveries.id, deliveryId))
    .limit(1);
  return row;
}

export async function updateDelivery(
  db: Executor,
  organisationId: string,
  deliveryId: string,
  changes: Partial<Omit<typeof webhookDeliveries.$inferInsert, 'id' | 'organisationId'>>,
) {
  await db
    .update(webhookDeliveries)
    .set(changes)
    .where(and(eq(webhookDeliveries.organisationId, organisationId), eq(webhookDeliveries.id, deliveryId)));
}

export async function insertAttempt(db: Executor, organisationId: string, row: Omit<typeof webhookDeliveryAttempts.$inferInsert, 'organisationId'>) {
  await db.insert(webhookDeliveryAttempts).values({ ...row, organisationId });
}

export async function countAttempts(db: Executor, organisationId: string, deliveryId: string): Promise<number> {
  const [row] = await db
    .select({ count: sql<number>`count(*)` })
    .from(webhookDeliveryAttempts)
    .where(and(eq(webhookDeliveryAttempts.organisationId, organisationId), eq(webhookDeliveryAttempts.deliveryId, deliveryId)));
  return Number(row?.count ?? 0);
}

/** Brings an endpoint's waiting deliveries forward (after it is re-enabled). */
export async function wakePendingDeliveries(db: Executor, organisationId: string, endpointId: string, now: Date): Promise<void> {
  await db
    .update(webhookDeliveries)
    .set({ nextAttemptAt: now })
    .where(and(eq(webhookDeliveries.organisationId, organisationId), eq(webhookDeliveries.endpointId, endpointId), eq(webhookDeliveries.status, 'pending')));
}
