import { useQueryClient, type QueryClient } from '@tanstack/react-query';
import { PageHeader } from '@console/components/ui/page-header';
import { Panel } from '@console/components/ui/panel';
import { Alert } from '@console/components/ui/alert';
import { authKeys } from '@console/features/auth/api/keys';
import { getSessionQueryOptions, useSession } from '@console/features/auth/api/get-session';
import { getMembersQueryOptions } from '@console/features/members/api/get-members';
import { MembersTable } from '@console/features/members/components/members-table';
import { getInvitationsQueryOptions } from '@console/features/invitations/api/get-invitations';
import { InvitationsPanel } from '@console/features/invitations/components/invitations-panel';
import { hasPermission } from '@console/lib/authorization';
import { ROLES, roleLabel, roleSummary } from '@console/utils/roles';

export const clientLoader = (queryClient: QueryClient) => async () => {
  void queryClient.prefetchQuery(getMembersQueryOptions());
  const session = await queryClient.ensureQueryData(getSessionQueryOptions());
  if (hasPermission(session, 'members:manage')) void queryClient.prefetchQuery(getInvitationsQueryOptions());
  return null;
};

export default function MembersRoute() {
  const queryClient = useQueryClient();
  const { data: session } = useSession();
  if (!session) return null;
  const canManage = hasPermission(session, 'members:manage');

  return (
    <>
      <PageHeader
        eyebrow="Organisation"
        title="Members"
        description={`Everyone who can sign in to ${session.activeOrganisation.name}, and what their role lets them do.`}
      />
      <div className="grid items-start gap-6 xl:grid-cols-[minmax(0,1fr)_18rem]">
        <Panel title="People" flush>
          {!canManage && (
            <div className="px-5 py-5">
              <Alert tone="info" title="Read-only for your role">
                Owners and admins change roles and remove members.
              </Alert>
            </div>
          )}
          <MembersTable
            canManage={canManage}
            viewerIsOwner={session.activeOrganisation.role === 'owner'}
            currentUserId={session.user.id}
            onOwnMembershipChanged={() => queryClient.invalidateQueries({ queryKey: authKeys.session() })}
          />
        </Panel>
        <Panel title="Roles" headingLevel="h2">
          <dl className="space-y-4">
            {ROLES.map((role) => (
              <div key={role} className="space-y-0.5">
                <dt className="text-sm font-bold text-ink-900">{roleLabel(role)}</dt>
                <dd className="text-xs text-ink-600">{roleSummary(role)}</dd>
              </div>
            ))}
          </dl>
          <p className="mt-4 border-t border-ink-100 pt-3 text-xs text-ink-500">
            Every organisation keeps at least one owner.
          </p>
        </Panel>
      </div>
      {canManage && <InvitationsPanel viewerIsOwner={session.activeOrganisation.role === 'owner'} className="mt-6" />}
    </>
  );
}
