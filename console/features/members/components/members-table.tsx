import { useState } from 'react';
import { ProblemAlert } from '@console/components/ui/alert';
import { Badge } from '@console/components/ui/badge';
import { Button } from '@console/components/ui/button';
import { ConfirmDialog } from '@console/components/ui/confirm-dialog';
import { useNotify } from '@console/components/ui/notifications';
import { EmptyState, ErrorState, LoadingState } from '@console/components/ui/states';
import { Table, Td, Th } from '@console/components/ui/table';
import { formatDate } from '@console/utils/format-date';
import { roleLabel } from '@console/utils/roles';
import type { Member } from '@shared/schemas/members';
import { useMembers } from '../api/get-members';
import { useRemoveMember } from '../api/remove-member';
import { useUpdateMemberRole } from '../api/update-member-role';
import { MemberRoleSelect } from './member-role-select';

const removalTitle = (member: Member | null, currentUserId: string) =>
  !member ? 'Remove member?' : member.userId === currentUserId ? 'Leave this organisation?' : `Remove ${member.displayName}?`;

const removalConsequence = (member: Member, currentUserId: string) =>
  member.userId === currentUserId
    ? 'You lose access to this organisation at once; an owner or admin would have to add you again.'
    : `${member.email} loses access to this organisation at once.`;

type MembersTableProps = {
  canManage: boolean;
  viewerIsOwner: boolean;
  currentUserId: string;
  /** The signed-in person's own membership changed: the session's role and permissions are stale. */
  onOwnMembershipChanged?: () => void;
};

export function MembersTable({ canManage, viewerIsOwner, currentUserId, onOwnMembershipChanged }: MembersTableProps) {
  const members = useMembers();
  const notify = useNotify();
  const [pendingRemoval, setPendingRemoval] = useState<Member | null>(null);

  const updateRole = useUpdateMemberRole({
    onSuccess: (member) => {
      notify(`${member.displayName} is now ${roleLabel(member.role).toLowerCase()}.`);
      if (member.userId === currentUserId) onOwnMembershipChanged?.();
    },
  });
  const removeMember = useRemoveMember();

  if (members.isPending) return <LoadingState label="Loading members…" />;
  if (members.isError) return <ErrorState error={members.error} onRetry={() => members.refetch()} />;
  if (members.data.length === 0) return <EmptyState title="No members yet" />;

  const confirmRemoval = () => {
    if (!pendingRemoval) return;
    const removed = pendingRemoval;
    removeMember.mutate(removed.id, {
      onSuccess: () => {
        setPendingRemoval(null);
        notify(`${removed.displayName} was removed from the organisation.`);
        if (removed.userId === currentUserId) onOwnMembershipChanged?.();
      },
    });
  };

  return (
    <>
      {updateRole.error && (
        <div className="px-5 py-5">
          <ProblemAlert error={updateRole.error} />
        </div>
      )}
      <Table caption="Members of this organisation">
        <thead>
          <tr>
            <Th>Member</Th>
            <Th>Role</Th>
            <Th>Joined</Th>
            {canManage && (
              <Th className="text-right">
                <span className="sr-only">Actions</span>
              </Th>
            )}
          </tr>
        </thead>
        <tbody>
          {members.data.map((member) => (
            <tr key={member.id} className="hover:bg-ink-50/60">
              <Td>
                <div className="flex items-center gap-2">
                  <span className="font-semibold text-ink-900">{member.displayName}</span>
                  {member.userId === currentUserId && <Badge>You</Badge>}
                </div>
                <div className="text-xs text-ink-600">{member.email}</div>
              </Td>
              <Td>
                {canManage ? (
                  <MemberRoleSelect
                    member={member}
                    viewerIsOwner={viewerIsOwner}
                    isPending={updateRole.isPending && updateRole.variables?.memberId === member.id}
                    onChange={(role) => updateRole.mutate({ memberId: member.id, role })}
                  />
                ) : (
                  <Badge tone={member.role === 'owner' ? 'accent' : 'neutral'}>{roleLabel(member.role)}</Badge>
                )}
              </Td>
              <Td className="font-mono text-xs tabular text-ink-700">{formatDate(member.joinedAt)}</Td>
              {canManage && (
                <Td className="text-right">
                  <Button
                    variant="ghost-danger"
                    size="sm"
                    disabled={member.role === 'owner' && !viewerIsOwner}
                    onClick={() => {
                      removeMember.reset();
                      setPendingRemoval(member);
                    }}
                    aria-label={`Remove ${member.displayName}`}
                  >
                    Remove
                  </Button>
                </Td>
              )}
            </tr>
          ))}
        </tbody>
      </Table>
      <ConfirmDialog
        open={pendingRemoval !== null}
        title={removalTitle(pendingRemoval, currentUserId)}
        description={pendingRemoval && <p>{removalConsequence(pendingRemoval, currentUserId)}</p>}
        confirmLabel={pendingRemoval?.userId === currentUserId ? 'Leave organisation' : 'Remove member'}
        onConfirm={confirmRemoval}
        onCancel={() => setPendingRemoval(null)}
        isPending={removeMember.isPending}
        error={removeMember.error}
      />
    </>
  );
}
