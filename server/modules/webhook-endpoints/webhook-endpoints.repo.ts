import { and, eq } from 'drizzle-orm';
import type { Executor } from '@server/db/client';
import { newestFirst, olderThan } from '@server/db/keyset';
import { webhookEndpoints } from '@server/db/tables';
import type { CursorPosition } from '@server/http/pagination';

export type WebhookEndpointRow = typeof webhookEndpoints.$inferSelect;

export async function insertEndpoint(db: Executor, organisationId: string, row: Omit<typeof webhookEndpoints.$inferInsert, 'organisationId'>) {
  await db.insert(webhookEndpoints).values({ ...row, organisationId });
}

export async function findEndpoint(db: Executor, organisationId: string, endpointId: string): Promise<WebhookEndpointRow | undefined> {
  const [row] = await db
    .select()
    .from(webhookEndpoints)
    .where(and(eq(webhookEndpoints.organisationId, organisationId), eq(webhookEndpoints.id, endpointId)))
    .limit(1);
  return row;
}

export async function listEndpoints(db: Executor, organisationId: string, page: { limit: number; after?: CursorPosition }) {
  return db
    .select()
    .from(webhookEndpoints)
    .where(and(eq(webhookEndpoints.organisationId, organisationId), olderThan(webhookEndpoints.createdAt, webhookEndpoints.id, page.after)))
    .orderBy(...newestFirst(webhookEndpoints.createdAt, webhookEndpoints.id))
    .limit(page.limit + 1);
}

/** Every enabled endpoint of the organisation (the caller filters by event type, which is a JSON list). */
export async function listEnabledEndpoints(db: Executor, organisationId: string): Promise<WebhookEndpointRow[]> {
  return db
    .select()
    .from(webhookEndpoints)
    .where(and(eq(webhookEndpoints.organisationId, organisationId), eq(webhookEndpoints.enabled, true)));
}

export async function updateEndpoint(
  db: Executor,
  organisationId: string,
  endpointId: string,
  changes: Partial<Omit<typeof webhookEndpoints.$inferInsert, 'id' | 'organisationId'>>,
): Promise<void> {
  await db
    .update(webhookEndpoints)
    .set(changes)
    .where(and(eq(webhookEndpoints.organisationId, organisationId), eq(webhookEndpoints.id, endpointId)));
}

export async function deleteEndpoint(db: Executor, organisationId: string, endpointId: string): Promise<void> {
  await db.delete(webhookEndpoints).where(and(eq(webhookEndpoints.organisationId, organisationId), eq(webhookEndpoints.id, endpointId)));
}
