import { and, eq, sql } from 'drizzle-orm';
import type { Executor } from '@server/db/client';
import { usageCharges } from '@server/db/tables';

export interface DailyChargeRow {
  /** YYYY-MM-DD of the UTC day (the connection works in UTC). */
  day: string;
  analyses: number;
  audioSeconds: number;
}

/** The period's charges summed per UTC day; refunded analyses have no charge row left. */
export async function sumChargesPerDay(db: Executor, organisationId: string, periodStart: Date): Promise<DailyChargeRow[]> {
  const day = sql<string>`DATE_FORMAT(${usageCharges.createdAt}, '%Y-%m-%d')`;
  const rows = await db
    .select({ day, analyses: sql<number>`COUNT(*)`, audioSeconds: sql<number>`COALESCE(SUM(${usageCharges.audioSeconds}), 0)` })
    .from(usageCharges)
    .where(and(eq(usageCharges.organisationId, organisationId), eq(usageCharges.periodStart, periodStart)))
    .groupBy(day)
    .orderBy(day);
  return rows.map((row) => ({ day: String(row.day), analyses: Number(row.analyses), audioSeconds: Number(row.audioSeconds) }));
}
