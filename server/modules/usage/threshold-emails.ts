import { PLANS } from '@server/billing/plans';
import type { AppDeps } from '@server/deps';
import { usageThresholdEmail, type UsageThresholdPercent } from '@server/email/templates/usage-threshold-email';
import { findOrganisation } from '@server/modules/organisations/organisations.repo';
import { getOrganisationPlan } from './organisation-plan.service';
import type { QuotaThresholdNotice } from './quota-thresholds';
import { claimNoticeForMail, listOwnerAndAdminEmails, releaseNoticeClaim, type NoticeKey } from './threshold-emails.repo';

/** The console page the e-mail links to. */
const USAGE_PAGE_PATH = '/usage';

const pending = new Set<Promise<void>>();

/**
 * One e-mail to the organisation's owners and admins for a threshold just crossed, once the notice is committed.
 * Returns whether it was sent (false: already mailed, rolled back, or nobody to tell).
 */
export async function sendThresholdEmail(deps: AppDeps, notice: QuotaThresholdNotice): Promise<boolean> {
  const { mailer } = deps;
  if (!mailer) return false;
  const key: NoticeKey = { periodStart: notice.periodStart, quota: notice.quota, thresholdPercent: notice.thresholdPercent };
  if (!(await claimNoticeForMail(deps.db, notice.organisationId, key, deps.clock.now()))) return false;
  try {
    const [recipients, organisation, plan] = await Promise.all([
      listOwnerAndAdminEmails(deps.db, notice.organisationId),
      findOrganisation(deps.db, notice.organisationId),
      getOrganisationPlan(deps, notice.organisationId),
    ]);
    if (recipients.length === 0 || !organisation) return false;
    const content = usageThresholdEmail({
      organisationName: organisation.name,
      planName: PLANS[plan.planId].name,
      metric: notice.quota,
      used: notice.used,
      limit: notice.limit,
      thresholdPercent: notice.thresholdPercent as UsageThresholdPercent,
      periodEndsAt: notice.periodEndsAt,
      usageUrl: `${deps.config.publicOrigin}${USAGE_PAGE_PATH}`,
    });
    await mailer.sendMail({ to: recipients, ...content });
    return true;
  } catch (error) {
    await releaseNoticeClaim(deps.db, notice.organisationId, key).catch(() => undefined);
    throw error;
  }
}

/**
 * Sends the e-mail in the background: the analysis or upload that crossed the threshold neither waits for the
 * relay nor fails with it (a failure is logged, and the notice stays marked as not mailed).
 */
export function scheduleThresholdEmail(deps: AppDeps, notice: QuotaThresholdNotice): void {
  if (!deps.mailer) return;
  const sending = sendThresholdEmail(deps, notice)
    .then(() => undefined)
    .catch((error: unknown) => {
      deps.logger.error(
        { err: error, organisationId: notice.organisationId, quota: notice.quota, thresholdPercent: notice.thresholdPercent },
        'quota threshold e-mail failed',
      );
    })
    .finally(() => pending.delete(sending));
  pending.add(sending);
}

/** Resolves once every threshold e-mail started so far has been handed to the relay or failed (tests, shutdown). */
export async function thresholdEmailsSettled(): Promise<void> {
  while (pending.size > 0) await Promise.all([...pending]);
}
