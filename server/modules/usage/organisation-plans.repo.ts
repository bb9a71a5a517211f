import { eq } from 'drizzle-orm';
import type { Executor } from '@server/db/client';
import { organisationPlans } from '@server/db/tables';

export type OrganisationPlanRow = typeof organisationPlans.$inferSelect;

export async function findOrganisationPlan(db: Executor, organisationId: string): Promise<OrganisationPlanRow | undefined> {
  const [row] = await db.select().from(organisationPlans).where(eq(organisationPlans.organisationId, organisationId)).limit(1);
  return row;
}

/** Inserts the organisation's plan row or overwrites it with the given members. */
export async function upsertOrganisationPlan(
  db: Executor,
  organisationId: string,
  row: Omit<typeof organisationPlans.$inferInsert, 'organisationId'>,
): Promise<void> {
  await db
    .insert(organisationPlans)
    .values({ ...row, organisationId })
    .onDuplicateKeyUpdate({ set: row });
}

/** Not scoped by organisation: a payment-provider event names the customer, and this is how we find whose it is. */
export async function findOrganisationIdByCustomer(db: Executor, customerId: string): Promise<string | null> {
  const [row] = await db
    .select({ organisationId: organisationPlans.organisationId })
    .from(organisationPlans)
    .where(eq(organisationPlans.providerCustomerId, customerId))
    .limit(1);
  return row?.organisationId ?? null;
}
