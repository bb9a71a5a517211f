import { useState } from 'react';
import { ProblemAlert } from '@console/components/ui/alert';
import { Badge } from '@console/components/ui/badge';
import { Button } from '@console/components/ui/button';
import { ConfirmDialog } from '@console/components/ui/confirm-dialog';
import { useNotify } from '@console/components/ui/notifications';
import { EmptyState, ErrorState, LoadingState } from '@console/components/ui/states';
import { Table, Td, Th } from '@console/components/ui/table';
import { formatDateTime } from '@console/utils/format-date';
import { roleLabel } from '@console/utils/roles';
import type { Invitation } from '@shared/schemas/invitations';
import { useInvitations } from '../api/get-invitations';
import { useResendInvitation } from '../api/resend-invitation';
import { useRevokeInvitation } from '../api/revoke-invitation';
import { EmailDeliveryBadge } from './email-delivery-badge';
import { deliveryNotice } from './delivery-notice';

function ExpiryCell({ invitation }: { invitation: Invitation }) {
  if (invitation.status === 'expired') {
    return (
      <div className="space-y-0.5">
        <Badge tone="danger">Expired</Badge>
        <p className="font-mono text-xs whitespace-nowrap tabular text-ink-600">{formatDateTime(invitation.expiresAt)}</p>
      </div>
    );
  }
  return (
    <div className="space-y-0.5">
      <p className="text-sm text-ink-800">Valid until</p>
      <p className="font-mono text-xs whitespace-nowrap tabular text-ink-600">{formatDateTime(invitation.expiresAt)}</p>
    </div>
  );
}

export function InvitationsTable({ viewerIsOwner }: { viewerIsOwner: boolean }) {
  const invitations = useInvitations();
  const notify = useNotify();
  const [pendingRevoke, setPendingRevoke] = useState<Invitation | null>(null);
  const resend = useResendInvitation({ onSuccess: (invitation) => notify(deliveryNotice(invitation, 'resent'), invitation.emailDelivery.status === 'sent' ? 'success' : 'info') });
  const revoke = useRevokeInvitation();

  if (invitations.isPending) return <LoadingState label="Loading invitations…" />;
  if (invitations.isError) return <ErrorState error={invitations.error} onRetry={() => invitations.refetch()} />;
  if (invitations.data.length === 0) {
    return <EmptyState title="No open invitations">Invitations you send appear here until they are accepted or revoked.</EmptyState>;
  }

  const confirmRevoke = () => {
    if (!pendingRevoke) return;
    const revoked = pendingRevoke;
    revoke.mutate(revoked.id, {
      onSuccess: () => {
        setPendingRevoke(null);
        notify(`The invitation to ${revoked.email} was revoked.`);
      },
    });
  };

  return (
    <>
      {resend.error && (
        <div className="px-5 py-5">
          <ProblemAlert error={resend.error} />
        </div>
      )}
      <Table caption="Open invitations">
        <thead>
          <tr>
            <Th>Invited</Th>
            <Th>Role</Th>
            <Th>Link</Th>
            <Th>E-mail</Th>
            <Th className="text-right">
              <span className="sr-only">Actions</span>
            </Th>
          </tr>
        </thead>
        <tbody>
          {invitations.data.map((invitation) => {
            const locked = invitation.role === 'owner' && !viewerIsOwner;
            return (
              <tr key={invitation.id} className="hover:bg-ink-50/60">
                <Td>
                  <div className="font-semibold text-ink-900">{invitation.email}</div>
                  <div className="text-xs text-ink-600">by {invitation.invitedBy}</div>
                </Td>
                <Td>
                  <Badge tone={invitation.role === 'owner' ? 'accent' : 'neutral'}>{roleLabel(invitation.role)}</Badge>
                </Td>
                <Td>
                  <ExpiryCell invitation={invitation} />
                </Td>
                <Td>
                  <EmailDeliveryBadge delivery={invitation.emailDelivery} />
                </Td>
                <Td className="text-right whitespace-nowrap">
                  <Button
                    variant="ghost"
                    size="sm"
                    disabled={locked}
                    isPending={resend.isPending && resend.variables === invitation.id}
                    onClick={() => resend.mutate(invitation.id)}
                    aria-label={`Resend the invitation to ${invitation.email}`}
                  >
                    Resend
                  </Button>
                  <Button
                    variant="ghost-danger"
                    size="sm"
                    disabled={locked}
                    onClick={() => {
                      revoke.reset();
                      setPendingRevoke(invitation);
                    }}
                    aria-label={`Revoke the invitation to ${invitation.email}`}
                  >
                    Revoke
                  </Button>
                </Td>
              </tr>
            );
          })}
        </tbody>
      </Table>
      <ConfirmDialog
        open={pendingRevoke !== null}
        title="Revoke this invitation?"
        description={pendingRevoke && <p>The link sent to {pendingRevoke.email} stops working at once. You can invite the address again later.</p>}
        confirmLabel="Revoke invitation"
        onConfirm={confirmRevoke}
        onCancel={() => setPendingRevoke(null)}
        isPending={revoke.isPending}
        error={revoke.error}
      />
    </>
  );
}
