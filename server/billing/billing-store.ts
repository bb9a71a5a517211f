import type { PlanId } from './plans';

/** The organisation's plan as the provider's latest subscription state says it should be. */
export interface PlanChange {
  organisationId: string;
  customerId: string;
  /** null when the organisation has no subscription left (back on the free plan). */
  subscriptionId: string | null;
  planId: PlanId;
  /** The provider's status word (active, past_due, canceled, …), kept for display and support. */
  subscriptionStatus: string | null;
  /** When the paid period ends; null on the free plan. */
  currentPeriodEndsAt: Date | null;
  /** The provider event that led to this change. */
  providerEventId: string;
}

/**
 * What billing needs from our storage; the database layer implements it. Changes are whole states (not
 * deltas) fetched fresh from the provider, so applying the same or an older event twice is harmless.
 */
export interface BillingStore {
  /** Fallback when a subscription carries no organisation id (e.g. created by hand at the provider). */
  findOrganisationIdByCustomerId(customerId: string): Promise<string | null>;
  applyPlanChange(change: PlanChange): Promise<void>;
}
