import { and, desc, eq, lte } from 'drizzle-orm';
import type { Executor } from '@server/db/client';
import { newestFirst, olderThan } from '@server/db/keyset';
import { calibrations } from '@server/db/tables';
import type { CursorPosition } from '@server/http/pagination';

export type CalibrationRow = typeof calibrations.$inferSelect;

export async function insertCalibration(db: Executor, organisationId: string, row: Omit<typeof calibrations.$inferInsert, 'organisationId'>) {
  await db.insert(calibrations).values({ ...row, organisationId });
}

export async function findCalibration(db: Executor, organisationId: string, calibrationId: string): Promise<CalibrationRow | undefined> {
  const [row] = await db
    .select()
    .from(calibrations)
    .where(and(eq(calibrations.organisationId, organisationId), eq(calibrations.id, calibrationId)))
    .limit(1);
  return row;
}

export async function listCalibrations(
  db: Executor,
  organisationId: string,
  filter: { rigId?: string; inputChannel?: number },
  page: { limit: number; after?: CursorPosition },
): Promise<CalibrationRow[]> {
  return db
    .select()
    .from(calibrations)
    .where(
      and(
        eq(calibrations.organisationId, organisationId),
        filter.rigId !== undefined ? eq(calibrations.rigId, filter.rigId) : undefined,
        filter.inputChannel !== undefined ? eq(calibrations.inputChannel, filter.inputChannel) : undefined,
        olderThan(calibrations.createdAt, calibrations.id, page.after),
      ),
    )
    .orderBy(...newestFirst(calibrations.createdAt, calibrations.id))
    .limit(page.limit + 1);
}

/** Calibrations of a rig input that had started by `at`, the latest start first (newest row on a tie). */
export async function listStartedCalibrationsOfInput(
  db: Executor,
  organisationId: string,
  input: { rigId: string; inputChannel: number },
  at: Date,
  limit: number,
): Promise<CalibrationRow[]> {
  return db
    .select()
    .from(calibrations)
    .where(
      and(
        eq(calibrations.organisationId, organisationId),
        eq(calibrations.rigId, input.rigId),
        eq(calibrations.inputChannel, input.inputChannel),
        lte(calibrations.validFrom, at),
      ),
    )
    .orderBy(desc(calibrations.validFrom), desc(calibrations.createdAt), desc(calibrations.id))
    .limit(limit);
}
