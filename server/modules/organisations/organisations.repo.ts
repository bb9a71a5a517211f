import { eq } from 'drizzle-orm';
import type { Executor } from '@server/db/client';
import { organisations } from '@server/db/tables';

export type OrganisationRow = typeof organisations.$inferSelect;

export async function insertOrganisation(db: Executor, row: typeof organisations.$inferInsert): Promise<void> {
  await db.insert(organisations).values(row);
}

/** The organisation itself; callers pass the organisation they are acting for. */
export async function findOrganisation(db: Executor, organisationId: string): Promise<OrganisationRow | undefined> {
  const [row] = await db.select().from(organisations).where(eq(organisations.id, organisationId)).limit(1);
  return row;
}
