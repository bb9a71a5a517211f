import type { BillingAccount, Invoice, Plan, PlanCatalogue } from '@shared/schemas/billing';
import { FREE_PLAN_ID, isPaidPlanId, PLAN_IDS, PLANS, type PlanId } from '@server/billing/plans';
import type { InvoiceSummary } from '@server/billing/invoices';
import type { AppDeps } from '@server/deps';
import { invalidField } from '@server/http/api-problem';
import type { Principal } from '@server/http/principal';
import { findUserById } from '@server/modules/auth/users.repo';
import { findOrganisation } from '@server/modules/organisations/organisations.repo';
import { getOrganisationPlan, setOrganisationPlan } from '@server/modules/usage/organisation-plan.service';
import { findOrganisationPlan } from '@server/modules/usage/organisation-plans.repo';
import { ApiProblem } from '@server/http/api-problem';
import { asProblem, requireBilling } from './billing-problem';

/** Where the provider's hosted pages send the browser back: the console's usage page. */
export const CONSOLE_USAGE_PATH = '/usage';

function presentPlan(planId: PlanId): Plan {
  const { id, name, summary, monthlyPriceMinor, currency, limits } = PLANS[planId];
  return { id, name, summary, monthlyPriceMinor, currency, limits: { ...limits } };
}

export async function planCatalogue(deps: AppDeps, organisationId: string): Promise<PlanCatalogue> {
  const plan = await getOrganisationPlan(deps, organisationId);
  return { data: PLAN_IDS.map(presentPlan), currentPlanId: plan.planId, billingAvailable: deps.billing !== undefined };
}

export async function billingAccount(deps: AppDeps, organisationId: string): Promise<BillingAccount> {
  const [plan, row] = await Promise.all([getOrganisationPlan(deps, organisationId), findOrganisationPlan(deps.db, organisationId)]);
  return {
    planId: plan.planId,
    subscriptionStatus: row?.subscriptionStatus ?? null,
    currentPeriodEndsAt: row?.currentPeriodEndsAt?.toISOString() ?? null,
    hasBillingAccount: Boolean(row?.providerCustomerId),
    hasSubscription: Boolean(row?.providerSubscriptionId),
    billingAvailable: deps.billing !== undefined,
  };
}

function usageUrl(deps: AppDeps, search = ''): string {
  return `${deps.config.publicOrigin}${CONSOLE_USAGE_PATH}${search}`;
}

/**
 * A hosted checkout for a paid plan. The return addresses are always the console's own usage page (never taken
 * from the request, so the endpoint cannot be used to send someone elsewhere). A customer created on the way is
 * stored at once, so the provider's events can be matched to the organisation even without our metadata.
 */
export async function startCheckoutFor(deps: AppDeps, principal: Principal, planId: string): Promise<{ url: string }> {
  if (!isPaidPlanId(planId)) {
    if ((PLAN_IDS as readonly string[]).includes(planId)) {
      throw new ApiProblem('plan_not_purchasable', `The ${PLANS[planId as PlanId].name} plan is free and needs no checkout.`);
    }
    throw invalidField('#/planId', `Unknown plan "${planId}"; choose one of ${PLAN_IDS.filter(isPaidPlanId).join(', ')}.`);
  }
  const billing = requireBilling(deps);
  const { organisationId } = principal;
  const [organisation, row, user] = await Promise.all([
    findOrganisation(deps.db, organisationId),
    findOrganisationPlan(deps.db, organisationId),
    principal.actor.type === 'user' ? findUserById(deps.db, principal.actor.id) : undefined,
  ]);
  const checkout = await asProblem(() =>
    billing.startCheckout({
      organisationId,
      customerId: row?.providerCustomerId ?? null,
      organisationName: organisation?.name,
      billingEmail: user?.email,
      planId,
      successUrl: usageUrl(deps, '?checkout={CHECKOUT_SESSION_ID}'),
      cancelUrl: usageUrl(deps, '?checkout=canceled'),
    }),
  );
  if (checkout.customerId !== row?.providerCustomerId) {
    const current = row ? (await getOrganisationPlan(deps, organisationId)).planId : FREE_PLAN_ID;
    await setOrganisationPlan(deps, organisationId, { planId: current, providerCustomerId: checkout.customerId });
  }
  return { url: checkout.url };
}

async function customerIdOf(deps: AppDeps, organisationId: string): Promise<string | null> {
  return (await findOrganisationPlan(deps.db, organisationId))?.providerCustomerId ?? null;
}

export async function openPortalFor(deps: AppDeps, organisationId: string): Promise<{ url: string }> {
  const billing = requireBilling(deps);
  const customerId = await customerIdOf(deps, organisationId);
  if (!customerId) {
    throw new ApiProblem('billing_account_missing', 'The organisation has not subscribed to a paid plan yet; choose a plan to check out first.');
  }
  return asProblem(() => billing.openPortal({ customerId, returnUrl: usageUrl(deps) }));
}

function presentInvoice(invoice: InvoiceSummary): Invoice {
  return {
    ...invoice,
    periodStart: invoice.periodStart.toISOString(),
    periodEnd: invoice.periodEnd.toISOString(),
    createdAt: invoice.createdAt.toISOString(),
  };
}

export async function listInvoicesFor(deps: AppDeps, organisationId: string): Promise<Invoice[]> {
  const billing = requireBilling(deps);
  const customerId = await customerIdOf(deps, organisationId);
  if (!customerId) return [];
  return (await asProblem(() => billing.listInvoices(customerId))).map(presentInvoice);
}
