import type { PlanLimits } from '@server/billing/plans';
import type { Executor } from '@server/db/client';
import type { AppDeps } from '@server/deps';
import { usagePeriodAt, type UsagePeriod } from './billing-period';
import { getOrganisationPlan, getPlanLimits } from './organisation-plan.service';
import { quotaExceeded } from './quota-problem';
import { announceThresholds, noticeThresholds, type QuotaThresholdNotice } from './quota-thresholds';
import {
  addStorageBytes,
  decrementCounter,
  deleteCharge,
  ensureCounterRow,
  ensureStorageRow,
  findCharge,
  findCounter,
  findCounterLatest,
  findStorageBytes,
  incrementWithinLimits,
  insertCharge,
} from './usage.repo';

export { getPlanLimits };

export interface ReserveAnalysisInput {
  /** Audio the analysis reads (capture duration; 0 for a spectrum input), seconds. */
  audioSeconds: number;
  analysisId: string;
}

export interface UsageReservation {
  period: UsagePeriod;
  analysesUsed: number;
  audioSecondsUsed: number;
  /** False when this analysis had been charged before (the call changed nothing). */
  charged: boolean;
}

/** Runs `work` in the caller's transaction when given, else in a transaction of its own. */
function inTransaction<T>(deps: AppDeps, tx: Executor | undefined, work: (db: Executor) => Promise<T>): Promise<T> {
  return tx ? work(tx) : deps.db.transaction((own) => work(own));
}

/**
 * `work` in its transaction (the caller's, or its own), then the threshold notices it recorded are announced: after
 * the commit when the transaction is its own, so an e-mail never tells of a charge that was rolled back.
 */
async function chargeInTransaction<T>(deps: AppDeps, tx: Executor | undefined, work: (db: Executor, notices: QuotaThresholdNotice[]) => Promise<T>): Promise<T> {
  const notices: QuotaThresholdNotice[] = [];
  const result = await inTransaction(deps, tx, (db) => work(db, notices));
  await announceThresholds(deps, notices);
  return result;
}

/**
 * Charges one analysis and its audio seconds to the organisation's current monthly period, atomically against
 * the plan's limits: one conditional UPDATE (`used + 1 <= limit`), so 50 concurrent requests against a quota
 * of 20 give exactly 20 reservations. Over a limit → 429 quota_exceeded with the limit and `resetsAt`.
 * Charging the same analysis twice is a no-op. Pass `tx` to make the charge part of the caller's transaction
 * (it then rolls back with it). Crossing 80 % / 100 % writes one quota.threshold event per period.
 */
export async function reserveAnalysis(deps: AppDeps, orgId: string, input: ReserveAnalysisInput, tx?: Executor): Promise<UsageReservation> {
  const audioSeconds = Math.max(0, input.audioSeconds);
  const now = deps.clock.now();
  // Everything on the caller's connection when given: taking a second pool connection while holding a
  // transaction's would starve the pool under load (every holder waiting for another).
  return chargeInTransaction(deps, tx, async (db, notices) => {
    const plan = await getOrganisationPlan(deps, orgId, db);
    const period = usagePeriodAt(plan.periodAnchor, now);
    const maxAnalyses = plan.limits.analysesPerMonth;
    const maxAudioSeconds = plan.limits.audioMinutesPerMonth * 60;
    await ensureCounterRow(db, orgId, period);
    if (!(await insertCharge(db, orgId, { analysisId: input.analysisId, periodStart: period.start, audioSeconds, createdAt: now }))) {
      const counter = await findCounterLatest(db, orgId, period.start);
      return { period, analysesUsed: counter?.analysesCount ?? 0, audioSecondsUsed: counter?.audioSeconds ?? 0, charged: false };
    }
    const added = await incrementWithinLimits(db, orgId, period.start, { audioSeconds, maxAnalyses, maxAudioSeconds });
    const counter = await findCounterLatest(db, orgId, period.start);
    const analysesUsed = counter?.analysesCount ?? 0;
    const audioSecondsUsed = counter?.audioSeconds ?? 0;
    if (!added) {
      await deleteCharge(db, orgId, input.analysisId);
      if (analysesUsed + 1 > maxAnalyses) {
        throw quotaExceeded({ quota: 'analyses', limit: maxAnalyses, used: analysesUsed, requested: 1, unit: 'analyses per month', resetsAt: period.end, now });
      }
      throw quotaExceeded({
        quota: 'audio_minutes',
        limit: plan.limits.audioMinutesPerMonth,
        used: roundMinutes(audioSecondsUsed),
        requested: roundMinutes(audioSeconds),
        unit: 'audio minutes per month',
        resetsAt: period.end,
        now,
      });
    }
    notices.push(...(await noticeThresholds(deps, db, orgId, { quota: 'analyses', used: analysesUsed, limit: maxAnalyses, periodStart: period.start, periodEndsAt: period.end })));
    notices.push(
      ...(await noticeThresholds(deps, db, orgId, {
        quota: 'audio_minutes',
        used: roundMinutes(audioSecondsUsed),
        limit: plan.limits.audioMinutesPerMonth,
        periodStart: period.start,
        periodEndsAt: period.end,
      })),
    );
    return { period, analysesUsed, audioSecondsUsed, charged: true };
  });
}

function roundMinutes(seconds: number): number {
  return Math.round((seconds / 60) * 1000) / 1000;
}

/**
 * Refunds an analysis's charge (refused or canceled before the engine ran). Returns whether anything was
 * refunded; releasing twice, or an analysis never charged, changes nothing.
 */
export async function releaseAnalysis(deps: AppDeps, orgId: string, analysisId: string, tx?: Executor): Promise<boolean> {
  return inTransaction(deps, tx, async (db) => {
    const charge = await findCharge(db, orgId, analysisId);
    if (!charge || !(await deleteCharge(db, orgId, analysisId))) return false;
    await decrementCounter(db, orgId, charge.periodStart, charge.audioSeconds);
    return true;
  });
}

/**
 * Adds (positive) or frees (negative) stored bytes. A positive delta that would pass the plan's storage limit
 * is refused with 429 quota_exceeded and nothing is added; call it before keeping the new bytes.
 */
export async function recordStorageBytes(deps: AppDeps, orgId: string, deltaBytes: number, tx?: Executor): Promise<{ storageBytes: number }> {
  if (!Number.isFinite(deltaBytes)) throw new RangeError('deltaBytes must be a finite number of bytes');
  const delta = Math.round(deltaBytes);
  return chargeInTransaction(deps, tx, async (db, notices) => {
    const plan = await getOrganisationPlan(deps, orgId, db);
    await ensureStorageRow(db, orgId);
    const added = await addStorageBytes(db, orgId, delta, plan.limits.storageBytes);
    const storageBytes = await findStorageBytes(db, orgId, { latest: true });
    if (delta > 0 && !added) {
      throw quotaExceeded({ quota: 'storage_bytes', limit: plan.limits.storageBytes, used: storageBytes, requested: delta, unit: 'bytes of storage', resetsAt: null });
    }
    if (delta > 0) {
      const period = usagePeriodAt(plan.periodAnchor, deps.clock.now());
      notices.push(...(await noticeThresholds(deps, db, orgId, { quota: 'storage_bytes', used: storageBytes, limit: plan.limits.storageBytes, periodStart: period.start, periodEndsAt: period.end })));
    }
    return { storageBytes };
  });
}

export interface UsageSummary {
  planId: string;
  period: UsagePeriod;
  analysesUsed: number;
  audioSecondsUsed: number;
  storageBytes: number;
  limits: PlanLimits;
}

/** Usage of the current period against the plan's limits (GET /v1/usage). */
export async function getUsageSummary(deps: AppDeps, orgId: string): Promise<UsageSummary> {
  const plan = await getOrganisationPlan(deps, orgId);
  const period = usagePeriodAt(plan.periodAnchor, deps.clock.now());
  const [counter, storageBytes] = await Promise.all([findCounter(deps.db, orgId, period.start), findStorageBytes(deps.db, orgId)]);
  return {
    planId: plan.planId,
    period,
    analysesUsed: counter?.analysesCount ?? 0,
    audioSecondsUsed: counter?.audioSeconds ?? 0,
    storageBytes,
    limits: plan.limits,
  };
}
