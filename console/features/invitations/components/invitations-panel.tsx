import { Panel } from '@console/components/ui/panel';
import { INVITATION_LIFETIME_DAYS } from '@shared/schemas/invitations';
import { useNotify } from '@console/components/ui/notifications';
import { InvitationsTable } from './invitations-table';
import { InviteForm } from './invite-form';
import { deliveryNotice } from './delivery-notice';

/** Invite by e-mail and the open invitations, for owners and admins on the Members screen. */
export function InvitationsPanel({ viewerIsOwner, className }: { viewerIsOwner: boolean; className?: string }) {
  const notify = useNotify();
  return (
    <Panel
      title="Invitations"
      description={`The link in the e-mail works once, for ${INVITATION_LIFETIME_DAYS} days. Resending mails a new link; the old one stops working.`}
      flush
      id="invitations"
      className={className}
    >
      <div className="border-b border-ink-100 px-5 py-5">
        <div className="max-w-3xl">
          <InviteForm
            viewerIsOwner={viewerIsOwner}
            onInvited={(invitation) => notify(deliveryNotice(invitation, 'sent'), invitation.emailDelivery.status === 'sent' ? 'success' : 'info')}
          />
        </div>
      </div>
      <InvitationsTable viewerIsOwner={viewerIsOwner} />
    </Panel>
  );
}
