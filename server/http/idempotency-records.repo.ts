import { and, eq, lte, sql } from 'drizzle-orm';
import type { Executor } from '@server/db/client';
import { idempotencyRecords } from '@server/db/tables';

export type IdempotencyRecordRow = typeof idempotencyRecords.$inferSelect;

export interface IdempotencyScope {
  organisationId: string;
  method: string;
  routeTemplate: string;
  idempotencyKey: string;
}

const inScope = (scope: IdempotencyScope) =>
  and(
    eq(idempotencyRecords.organisationId, scope.organisationId),
    eq(idempotencyRecords.method, scope.method),
    eq(idempotencyRecords.routeTemplate, scope.routeTemplate),
    eq(idempotencyRecords.idempotencyKey, scope.idempotencyKey),
  );

function affected(result: unknown): number {
  return (result as [{ affectedRows: number }])[0].affectedRows;
}

/** Inserts the in_progress row; false when a row for the scope exists (the unique index decided). */
export async function insertInProgress(
  db: Executor,
  scope: IdempotencyScope,
  row: { fingerprint: string; createdAt: Date; expiresAt: Date },
): Promise<boolean> {
  const result = await db
    .insert(idempotencyRecords)
    .ignore()
    .values({ ...scope, ...row, state: 'in_progress' });
  return affected(result) === 1;
}

export async function findRecord(db: Executor, scope: IdempotencyScope): Promise<IdempotencyRecordRow | undefined> {
  const [row] = await db.select().from(idempotencyRecords).where(inScope(scope)).limit(1);
  return row;
}

/** Deletes the row only if it is still the one that was read (same creation time), so a fresh claim survives. */
export async function deleteRecordIfUnchanged(db: Executor, scope: IdempotencyScope, createdAt: Date): Promise<void> {
  await db.delete(idempotencyRecords).where(and(inScope(scope), eq(idempotencyRecords.createdAt, createdAt)));
}

export async function completeRecord(
  db: Executor,
  scope: IdempotencyScope,
  fingerprint: string,
  response: { status: number; headers: Record<string, string>; body: string | null },
): Promise<void> {
  await db
    .update(idempotencyRecords)
    .set({ state: 'completed', responseStatus: response.status, responseHeaders: response.headers, responseBody: response.body })
    .where(and(inScope(scope), eq(idempotencyRecords.fingerprint, fingerprint), eq(idempotencyRecords.state, 'in_progress')));
}

export async function deleteInProgress(db: Executor, scope: IdempotencyScope, fingerprint: string): Promise<void> {
  await db
    .delete(idempotencyRecords)
    .where(and(inScope(scope), eq(idempotencyRecords.fingerprint, fingerprint), eq(idempotencyRecords.state, 'in_progress')));
}

/** Removes records past their lifetime, a batch at a time; returns how many went. Serves every organisation. */
export async function deleteExpiredRecords(db: Executor, now: Date, batchSize: number): Promise<number> {
  const result = await db.execute(sql`DELETE FROM ${idempotencyRecords} WHERE ${lte(idempotencyRecords.expiresAt, now)} LIMIT ${batchSize}`);
  return affected(result);
}
