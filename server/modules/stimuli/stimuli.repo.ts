import { and, eq } from 'drizzle-orm';
import type { Executor } from '@server/db/client';
import { newestFirst, olderThan } from '@server/db/keyset';
import { stimuli } from '@server/db/tables';
import type { CursorPosition } from '@server/http/pagination';

export type StimulusRow = typeof stimuli.$inferSelect;

export async function insertStimulus(db: Executor, organisationId: string, row: Omit<typeof stimuli.$inferInsert, 'organisationId'>) {
  await db.insert(stimuli).values({ ...row, organisationId });
}

export async function findStimulus(db: Executor, organisationId: string, stimulusId: string): Promise<StimulusRow | undefined> {
  const [row] = await db
    .select()
    .from(stimuli)
    .where(and(eq(stimuli.organisationId, organisationId), eq(stimuli.id, stimulusId)))
    .limit(1);
  return row;
}

export async function listStimuli(db: Executor, organisationId: string, page: { limit: number; after?: CursorPosition }): Promise<StimulusRow[]> {
  return db
    .select()
    .from(stimuli)
    .where(and(eq(stimuli.organisationId, organisationId), olderThan(stimuli.createdAt, stimuli.id, page.after)))
    .orderBy(...newestFirst(stimuli.createdAt, stimuli.id))
    .limit(page.limit + 1);
}
