import type { Invitation } from '@shared/schemas/invitations';
import type { InvitationRow } from './invitations.repo';

/** A pending invitation past its expiry reads as expired; the stored row changes only when someone acts on it. */
export function effectiveStatus(row: InvitationRow, now: Date): Invitation['status'] {
  if (row.status === 'pending' && row.expiresAt.getTime() <= now.getTime()) return 'expired';
  return row.status;
}

export function presentInvitation(row: InvitationRow, now: Date): Invitation {
  return {
    id: row.id,
    email: row.email,
    role: row.role,
    status: effectiveStatus(row, now),
    expiresAt: row.expiresAt.toISOString(),
    invitedBy: row.invitedByLabel,
    createdAt: row.createdAt.toISOString(),
    emailDelivery: {
      status: row.emailStatus,
      detail: row.emailError,
      lastAttemptAt: row.lastSentAt.toISOString(),
      attempts: row.sendCount,
    },
  };
}
