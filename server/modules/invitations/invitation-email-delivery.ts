import type { AppDeps } from '@server/deps';
import { isEmailError } from '@server/email/email-error';
import { invitationEmail } from '@server/email/templates/invitation-email';
import { findOrganisation } from '@server/modules/organisations/organisations.repo';
import { acceptUrlOf } from './invitation-token';
import { updateInvitation, type InvitationRow } from './invitations.repo';

export const NO_MAILER_DETAIL = 'No mail relay is configured on this server (set SMTP_URL), so no e-mail was sent.';

type Delivery = Pick<InvitationRow, 'emailStatus' | 'emailError'>;

/**
 * Sends the invitation e-mail after the invitation is stored, and records the outcome on it. A relay that is
 * down or refuses the message never fails the request: the invitation stays, says why, and can be resent.
 */
export async function deliverInvitationEmail(deps: AppDeps, row: InvitationRow, token: string): Promise<Delivery> {
  const delivery = await attemptDelivery(deps, row, token);
  await updateInvitation(deps.db, row.organisationId, row.id, delivery);
  return delivery;
}

async function attemptDelivery(deps: AppDeps, row: InvitationRow, token: string): Promise<Delivery> {
  if (!deps.mailer) return { emailStatus: 'not_sent', emailError: NO_MAILER_DETAIL };
  try {
    const organisation = await findOrganisation(deps.db, row.organisationId);
    const content = invitationEmail({
      organisationName: organisation?.name ?? 'your organisation',
      inviterName: row.invitedByLabel,
      role: row.role,
      acceptUrl: acceptUrlOf(deps.config.publicOrigin, token),
      expiresAt: row.expiresAt,
    });
    await deps.mailer.sendMail({ to: row.email, ...content });
    return { emailStatus: 'sent', emailError: null };
  } catch (error) {
    deps.logger.warn({ err: error, invitationId: row.id }, 'invitation e-mail not sent');
    const reason = isEmailError(error) ? error.message : 'The e-mail could not be handed to the mail relay.';
    return { emailStatus: 'failed', emailError: reason.slice(0, 500) };
  }
}
