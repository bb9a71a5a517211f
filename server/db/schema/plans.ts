import { json, mysqlTable, varchar } from 'drizzle-orm/mysql-core';
import type { PlanLimits } from '../../billing/plans';
import { idReference, utcDatetime } from './columns.helpers';
import { organisations } from './identity';

/**
 * The plan an organisation is on. No row means the free plan with calendar-month (UTC) periods. Monthly usage
 * periods start at `periodAnchor` and every whole month after it.
 */
export const organisationPlans = mysqlTable('organisation_plans', {
  organisationId: idReference('organisation_id')
    .primaryKey()
    .references(() => organisations.id, { onDelete: 'cascade' }),
  /** One of server/billing/plans.ts PLAN_IDS. */
  planId: varchar('plan_id', { length: 16 }).notNull(),
  periodAnchor: utcDatetime('period_anchor').notNull(),
  /** Individual contract terms that replace the plan's own limits (or test settings). */
  limitOverrides: json('limit_overrides').$type<Partial<PlanLimits>>(),
  providerCustomerId: varchar('provider_customer_id', { length: 255 }),
  providerSubscriptionId: varchar('provider_subscription_id', { length: 255 }),
  subscriptionStatus: varchar('subscription_status', { length: 32 }),
  currentPeriodEndsAt: utcDatetime('current_period_ends_at'),
  /** Organisation setting: whether an expired calibration refuses an analysis ('refuse') or only warns ('warn'). */
  expiredCalibrationPolicy: varchar('expired_calibration_policy', { length: 8 }).$type<'warn' | 'refuse'>().notNull().default('warn'),
  updatedAt: utcDatetime('updated_at').notNull(),
});
