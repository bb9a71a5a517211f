import { FREE_PLAN_ID, isPlanId, PLANS, type PlanId, type PlanLimits } from '@server/billing/plans';
import type { AppDeps } from '@server/deps';
import type { Executor } from '@server/db/client';
import { CALENDAR_MONTH_ANCHOR, usagePeriodAt, type UsagePeriod } from './billing-period';
import { findOrganisationPlan, upsertOrganisationPlan } from './organisation-plans.repo';

export type ExpiredCalibrationPolicy = 'warn' | 'refuse';

export interface OrganisationPlan {
  planId: PlanId;
  /** The plan's limits with any individual overrides applied. */
  limits: PlanLimits;
  periodAnchor: Date;
  expiredCalibrationPolicy: ExpiredCalibrationPolicy;
}

/** The organisation's plan; the free plan on calendar months when it never chose one. */
export async function getOrganisationPlan(deps: Pick<AppDeps, 'db'>, organisationId: string, db: Executor = deps.db): Promise<OrganisationPlan> {
  const row = await findOrganisationPlan(db, organisationId);
  const planId = row && isPlanId(row.planId) ? row.planId : FREE_PLAN_ID;
  return {
    planId,
    limits: { ...PLANS[planId].limits, ...(row?.limitOverrides ?? {}) },
    periodAnchor: row?.periodAnchor ?? CALENDAR_MONTH_ANCHOR,
    expiredCalibrationPolicy: row?.expiredCalibrationPolicy === 'refuse' ? 'refuse' : 'warn',
  };
}

/** The limits that apply to the organisation now (upload limits, quotas, request rate). */
export async function getPlanLimits(deps: Pick<AppDeps, 'db'>, organisationId: string): Promise<PlanLimits> {
  return (await getOrganisationPlan(deps, organisationId)).limits;
}

const PLAN_CACHE_MS = 10_000;
const planLimitsCache = new Map<string, { limits: PlanLimits; untilMs: number }>();

/**
 * The limits, cached in this process for up to 10 s (for per-request checks such as the rate limit). A plan
 * change made in this process is seen at once; other processes see it within the cache time.
 */
export async function cachedPlanLimits(deps: Pick<AppDeps, 'db'>, organisationId: string): Promise<PlanLimits> {
  const cached = planLimitsCache.get(organisationId);
  if (cached && cached.untilMs > Date.now()) return cached.limits;
  const limits = await getPlanLimits(deps, organisationId);
  planLimitsCache.set(organisationId, { limits, untilMs: Date.now() + PLAN_CACHE_MS });
  return limits;
}

export async function currentUsagePeriod(deps: Pick<AppDeps, 'db' | 'clock'>, organisationId: string): Promise<UsagePeriod> {
  const plan = await getOrganisationPlan(deps, organisationId);
  return usagePeriodAt(plan.periodAnchor, deps.clock.now());
}

export interface SetOrganisationPlanInput {
  planId: PlanId;
  /** Individual limits replacing the plan's (custom contracts; tests). */
  limitOverrides?: Partial<PlanLimits> | null;
  /** Start of the first period; kept from an existing row when omitted, else calendar months. */
  periodAnchor?: Date;
  expiredCalibrationPolicy?: ExpiredCalibrationPolicy;
  providerCustomerId?: string | null;
  providerSubscriptionId?: string | null;
  subscriptionStatus?: string | null;
  currentPeriodEndsAt?: Date | null;
}

/** Puts the organisation on a plan (billing, support tools, tests). Settings not given keep their value. */
export async function setOrganisationPlan(deps: Pick<AppDeps, 'db' | 'clock'>, organisationId: string, input: SetOrganisationPlanInput): Promise<void> {
  const existing = await findOrganisationPlan(deps.db, organisationId);
  await upsertOrganisationPlan(deps.db, organisationId, {
    planId: input.planId,
    periodAnchor: input.periodAnchor ?? existing?.periodAnchor ?? CALENDAR_MONTH_ANCHOR,
    limitOverrides: input.limitOverrides === undefined ? (existing?.limitOverrides ?? null) : input.limitOverrides,
    expiredCalibrationPolicy: input.expiredCalibrationPolicy ?? existing?.expiredCalibrationPolicy ?? 'warn',
    providerCustomerId: input.providerCustomerId === undefined ? (existing?.providerCustomerId ?? null) : input.providerCustomerId,
    providerSubscriptionId: input.providerSubscriptionId === undefined ? (existing?.providerSubscriptionId ?? null) : input.providerSubscriptionId,
    subscriptionStatus: input.subscriptionStatus === undefined ? (existing?.subscriptionStatus ?? null) : input.subscriptionStatus,
    currentPeriodEndsAt: input.currentPeriodEndsAt === undefined ? (existing?.currentPeriodEndsAt ?? null) : input.currentPeriodEndsAt,
    updatedAt: deps.clock.now(),
  });
  planLimitsCache.delete(organisationId);
}

/** Organisation setting: whether an expired calibration refuses an analysis or only warns. Keeps the plan. */
export async function setExpiredCalibrationPolicy(deps: Pick<AppDeps, 'db' | 'clock'>, organisationId: string, policy: ExpiredCalibrationPolicy): Promise<void> {
  const existing = await findOrganisationPlan(deps.db, organisationId);
  const planId = existing && isPlanId(existing.planId) ? existing.planId : FREE_PLAN_ID;
  await setOrganisationPlan(deps, organisationId, { planId, expiredCalibrationPolicy: policy });
}
