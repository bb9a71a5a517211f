import type { AppDeps } from '@server/deps';
import type { Executor } from '@server/db/client';
import { emitEvent } from '@server/modules/webhook-endpoints/webhooks.service';
import type { QuotaName } from './quota-problem';
import { scheduleThresholdEmail } from './threshold-emails';
import { insertThresholdNotice } from './usage.repo';

/** Thresholds that raise a quota.threshold event, once per period each. */
export const QUOTA_THRESHOLD_PERCENTS = [80, 100] as const;

export interface QuotaThresholdNotice {
  organisationId: string;
  quota: QuotaName;
  thresholdPercent: number;
  used: number;
  limit: number;
  periodStart: Date;
  periodEndsAt: Date;
}

export type QuotaThresholdListener = (notice: QuotaThresholdNotice) => void | Promise<void>;
const listeners = new Set<QuotaThresholdListener>();

/**
 * Hook for further channels (the e-mail to owners and admins is sent by threshold-emails.ts): called once per threshold and period, after
 * the charge and its webhook event committed (when the charge runs inside a caller's transaction: once its own work is done, before
 * the caller commits).
 * Returns an unsubscribe function.
 */
export function onQuotaThreshold(listener: QuotaThresholdListener): () => void {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

/**
 * Records every threshold the new total reached for the first time this period, with its quota.threshold webhook
 * event, in `db`'s transaction. Returns the new notices: announce them with `announceThresholds` once that
 * transaction has committed, so no e-mail tells of a charge that was rolled back.
 */
export async function noticeThresholds(
  deps: AppDeps,
  db: Executor,
  organisationId: string,
  usage: { quota: QuotaName; used: number; limit: number; periodStart: Date; periodEndsAt: Date },
): Promise<QuotaThresholdNotice[]> {
  const notices: QuotaThresholdNotice[] = [];
  if (!(usage.limit > 0)) return notices;
  for (const thresholdPercent of QUOTA_THRESHOLD_PERCENTS) {
    if (usage.used * 100 < thresholdPercent * usage.limit) continue;
    const first = await insertThresholdNotice(db, organisationId, {
      periodStart: usage.periodStart,
      quota: usage.quota,
      thresholdPercent,
      createdAt: deps.clock.now(),
    });
    if (!first) continue;
    await emitEvent(
      deps,
      organisationId,
      'quota.threshold',
      { quota: usage.quota, thresholdPercent, used: usage.used, limit: usage.limit, periodEndsAt: usage.periodEndsAt.toISOString() },
      db,
    );
    notices.push({ organisationId, thresholdPercent, ...usage });
  }
  return notices;
}

/** The e-mail to owners and admins (in the background) and the listeners, for notices whose charge committed. */
export async function announceThresholds(deps: AppDeps, notices: QuotaThresholdNotice[]): Promise<void> {
  for (const notice of notices) {
    // Bound to this app's mailer through deps (not the process-wide listeners), so apps sharing a process stay apart.
    scheduleThresholdEmail(deps, notice);
    for (const listener of listeners) {
      try {
        await listener(notice);
      } catch (error) {
        deps.logger.error({ err: error, organisationId: notice.organisationId }, 'quota threshold listener failed');
      }
    }
  }
}
