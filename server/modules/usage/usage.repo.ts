import { and, eq, sql } from 'drizzle-orm';
import type { Executor } from '@server/db/client';
import { storageUsage, usageCharges, usageCounters, usageThresholdNotices } from '@server/db/tables';
import type { UsagePeriod } from './billing-period';

export type UsageCounterRow = typeof usageCounters.$inferSelect;

function affected(result: unknown): number {
  return (result as [{ affectedRows: number }])[0].affectedRows;
}

/**
 * Creates the period's counter row at zero if missing. ON DUPLICATE KEY UPDATE (a no-op here) takes an exclusive
 * lock on an existing row where INSERT IGNORE would take a shared one, so concurrent transactions queue on the
 * row instead of deadlocking when they next update it (MariaDB/InnoDB locking of INSERT … ON DUPLICATE KEY UPDATE).
 */
export async function ensureCounterRow(db: Executor, organisationId: string, period: UsagePeriod): Promise<void> {
  await db
    .insert(usageCounters)
    .values({ organisationId, periodStart: period.start, periodEnd: period.end, analysesCount: 0, audioSeconds: 0 })
    .onDuplicateKeyUpdate({ set: { analysesCount: sql`${usageCounters.analysesCount}` } });
}

export async function findCounter(db: Executor, organisationId: string, periodStart: Date): Promise<UsageCounterRow | undefined> {
  const [row] = await db
    .select()
    .from(usageCounters)
    .where(and(eq(usageCounters.organisationId, organisationId), eq(usageCounters.periodStart, periodStart)))
    .limit(1);
  return row;
}

/**
 * The counter as committed now (a locking read): inside a transaction a plain SELECT would show the snapshot
 * taken at the transaction's first read, not the increments other transactions committed since.
 */
export async function findCounterLatest(db: Executor, organisationId: string, periodStart: Date): Promise<UsageCounterRow | undefined> {
  const [row] = await db
    .select()
    .from(usageCounters)
    .where(and(eq(usageCounters.organisationId, organisationId), eq(usageCounters.periodStart, periodStart)))
    .limit(1)
    .for('update');
  return row;
}

/**
 * Adds one analysis and its audio seconds only if both stay within their limits, in one statement: the row
 * lock makes concurrent callers queue, and each sees the others' increments. Returns whether it was added.
 */
export async function incrementWithinLimits(
  db: Executor,
  organisationId: string,
  periodStart: Date,
  charge: { audioSeconds: number; maxAnalyses: number; maxAudioSeconds: number },
): Promise<boolean> {
  const result = await db
    .update(usageCounters)
    .set({
      analysesCount: sql`${usageCounters.analysesCount} + 1`,
      audioSeconds: sql`${usageCounters.audioSeconds} + ${charge.audioSeconds}`,
    })
    .where(
      and(
        eq(usageCounters.organisationId, organisationId),
        eq(usageCounters.periodStart, periodStart),
        sql`${usageCounters.analysesCount} + 1 <= ${charge.maxAnalyses}`,
        sql`${usageCounters.audioSeconds} + ${charge.audioSeconds} <= ${charge.maxAudioSeconds}`,
      ),
    );
  return affected(result) === 1;
}

export async function decrementCounter(db: Executor, organisationId: string, periodStart: Date, audioSeconds: number): Promise<void> {
  await db
    .update(usageCounters)
    .set({
      analysesCount: sql`GREATEST(${usageCounters.analysesCount} - 1, 0)`,
      audioSeconds: sql`GREATEST(${usageCounters.audioSeconds} - ${audioSeconds}, 0)`,
    })
    .where(and(eq(usageCounters.organisationId, organisationId), eq(usageCounters.periodStart, periodStart)));
}

/** Returns false when the analysis was already charged (a repeated reserve charges nothing more). */
export async function insertCharge(
  db: Executor,
  organisationId: string,
  charge: { analysisId: string; periodStart: Date; audioSeconds: number; createdAt: Date },
): Promise<boolean> {
  const result = await db.insert(usageCharges).ignore().values({ organisationId, ...charge });
  return affected(result) === 1;
}

export async function findCharge(db: Executor, organisationId: string, analysisId: string) {
  const [row] = await db
    .select()
    .from(usageCharges)
    .where(and(eq(usageCharges.organisationId, organisationId), eq(usageCharges.analysisId, analysisId)))
    .limit(1);
  return row;
}

export async function deleteCharge(db: Executor, organisationId: string, analysisId: string): Promise<boolean> {
  const result = await db
    .delete(usageCharges)
    .where(and(eq(usageCharges.organisationId, organisationId), eq(usageCharges.analysisId, analysisId)));
  return affected(result) === 1;
}

export async function ensureStorageRow(db: Executor, organisationId: string): Promise<void> {
  await db
    .insert(storageUsage)
    .values({ organisationId, storageBytes: 0 })
    .onDuplicateKeyUpdate({ set: { storageBytes: sql`${storageUsage.storageBytes}` } });
}

/** `latest`: a locking read, for use inside a transaction (see findCounterLatest). */
export async function findStorageBytes(db: Executor, organisationId: string, options: { latest?: boolean } = {}): Promise<number> {
  const query = db.select().from(storageUsage).where(eq(storageUsage.organisationId, organisationId)).limit(1);
  const [row] = options.latest ? await query.for('update') : await query;
  return Number(row?.storageBytes ?? 0);
}

/** Adds bytes only while the total stays within `maxBytes`; a negative delta always applies (floored at 0). */
export async function addStorageBytes(db: Executor, organisationId: string, deltaBytes: number, maxBytes: number | null): Promise<boolean> {
  const conditions = [eq(storageUsage.organisationId, organisationId)];
  if (maxBytes !== null && deltaBytes > 0) conditions.push(sql`${storageUsage.storageBytes} + ${deltaBytes} <= ${maxBytes}`);
  const result = await db
    .update(storageUsage)
    .set({ storageBytes: sql`GREATEST(${storageUsage.storageBytes} + ${deltaBytes}, 0)` })
    .where(and(...conditions));
  return affected(result) === 1 || deltaBytes === 0;
}

/** Records that a threshold was crossed in the period; false when it already was (so the notice goes once). */
export async function insertThresholdNotice(
  db: Executor,
  organisationId: string,
  notice: { periodStart: Date; quota: 'analyses' | 'audio_minutes' | 'storage_bytes'; thresholdPercent: number; createdAt: Date },
): Promise<boolean> {
  const result = await db.insert(usageThresholdNotices).ignore().values({ organisationId, ...notice });
  return affected(result) === 1;
}
