import { useQueryClient, type QueryClient } from '@tanstack/react-query';
import { useNavigate, useParams, type LoaderFunctionArgs } from 'react-router';
import { AuthLayout } from '@console/components/layouts/auth-layout';
import { useNotify } from '@console/components/ui/notifications';
import { paths } from '@console/config/paths';
import { authKeys } from '@console/features/auth/api/keys';
import { getSessionQueryOptions, useSession } from '@console/features/auth/api/get-session';
import { useSignOut } from '@console/features/auth/api/sign-out';
import { lookUpInvitationQueryOptions } from '@console/features/invitations/api/lookup-invitation';
import { AcceptInvitation } from '@console/features/invitations/components/accept-invitation';
import { roleLabel } from '@console/utils/roles';

// Outside the signed-in shell: the person opening the link may have no account yet.
export const clientLoader =
  (queryClient: QueryClient) =>
  ({ params }: LoaderFunctionArgs) => {
    void queryClient.prefetchQuery(getSessionQueryOptions());
    if (params.token) void queryClient.prefetchQuery(lookUpInvitationQueryOptions(params.token));
    return null;
  };

export default function InvitationAcceptRoute() {
  const { token = '' } = useParams();
  const navigate = useNavigate();
  const notify = useNotify();
  const queryClient = useQueryClient();
  const session = useSession();
  const signOut = useSignOut();
  return (
    <AuthLayout
      title="You are invited"
      lead="Someone on Sweepline asked you to join their organisation. Check the details, then accept."
    >
      <AcceptInvitation
        token={token}
        session={session.isPending ? undefined : (session.data ?? null)}
        signOut={{ run: () => signOut.mutateAsync().catch(() => undefined), isPending: signOut.isPending }}
        onJoined={(joined) => {
          // The session now points at the invited organisation: nothing cached for another one may show through.
          queryClient.removeQueries({ predicate: (query) => query.queryKey[0] !== authKeys.all[0] });
          queryClient.setQueryData(authKeys.session(), joined);
          notify(`Welcome to ${joined.activeOrganisation.name}. You joined as ${roleLabel(joined.activeOrganisation.role).toLowerCase()}.`);
          navigate(paths.app.root.getHref(), { replace: true });
        }}
      />
    </AuthLayout>
  );
}
