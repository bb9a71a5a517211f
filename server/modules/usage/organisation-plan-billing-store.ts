import type { BillingStore, PlanChange } from '@server/billing/billing-store';
import type { AppDeps } from '@server/deps';
import { findOrganisationIdByCustomer } from './organisation-plans.repo';
import { setOrganisationPlan } from './organisation-plan.service';

/**
 * Billing's storage on the organisation_plans table: a provider event's whole state replaces the row's plan and
 * subscription members (limit overrides and the period anchor are kept).
 */
export function organisationPlanBillingStore(deps: Pick<AppDeps, 'db' | 'clock'>): BillingStore {
  return {
    findOrganisationIdByCustomerId: (customerId) => findOrganisationIdByCustomer(deps.db, customerId),
    async applyPlanChange(change: PlanChange) {
      await setOrganisationPlan(deps, change.organisationId, {
        planId: change.planId,
        providerCustomerId: change.customerId,
        providerSubscriptionId: change.subscriptionId,
        subscriptionStatus: change.subscriptionStatus,
        currentPeriodEndsAt: change.currentPeriodEndsAt,
      });
    },
  };
}
