import { INVITATION_EMAILS_PER_HOUR } from '@shared/schemas/invitations';
import type { AppDeps } from '@server/deps';
import { ApiProblem } from '@server/http/api-problem';
import { nthRecentInvitationEmailAt } from './invitations.repo';

const WINDOW_SECONDS = 3600;

/**
 * Invitation e-mails per organisation over a rolling hour, counted from the audit log (every send and resend
 * writes one event), so all server processes share the count without a counter of their own. This keeps a
 * compromised or careless admin account from turning the service into a mail cannon. Concurrent requests may
 * overshoot by the number in flight.
 */
export async function assertInvitationEmailAllowed(deps: AppDeps, organisationId: string): Promise<void> {
  const now = deps.clock.now();
  const since = new Date(now.getTime() - WINDOW_SECONDS * 1000);
  const limitHitAt = await nthRecentInvitationEmailAt(deps.db, organisationId, since, INVITATION_EMAILS_PER_HOUR);
  if (!limitHitAt) return;
  const retryAfterSeconds = Math.max(1, Math.ceil((limitHitAt.getTime() + WINDOW_SECONDS * 1000 - now.getTime()) / 1000));
  throw new ApiProblem(
    'invitations_throttled',
    `This organisation has sent ${INVITATION_EMAILS_PER_HOUR} invitation e-mails in the last hour. Try again in ${Math.ceil(retryAfterSeconds / 60)} minute(s).`,
    { headers: { 'Retry-After': String(retryAfterSeconds) }, extensions: { retryAfterSeconds, limit: INVITATION_EMAILS_PER_HOUR, windowSeconds: WINDOW_SECONDS } },
  );
}
