import type { Invitation } from '@shared/schemas/invitations';

/** The confirmation after sending: it must say plainly when the e-mail did not go out. */
export function deliveryNotice(invitation: Invitation, verb: 'sent' | 'resent'): string {
  switch (invitation.emailDelivery.status) {
    case 'sent':
      return `Invitation ${verb} to ${invitation.email}.`;
    case 'failed':
      return `The invitation to ${invitation.email} is saved, but the e-mail failed. Resend it later.`;
    case 'not_sent':
      return `The invitation to ${invitation.email} is saved, but this server sends no e-mail.`;
  }
}
