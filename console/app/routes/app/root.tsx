import type { QueryClient } from '@tanstack/react-query';
import { Navigate, Outlet, redirect, useLocation, useNavigate, type LoaderFunctionArgs } from 'react-router';
import { AppShell } from '@console/components/layouts/app-shell';
import { paths } from '@console/config/paths';
import { getSessionQueryOptions, useSession } from '@console/features/auth/api/get-session';
import { AccountPanel } from '@console/features/auth/components/account-panel';
import { OrganisationSwitcher } from '@console/features/auth/components/organisation-switcher';
import { useOutboxAvailable } from '@console/features/dev-outbox/api/get-outbox';
import { hasPermission } from '@console/lib/authorization';
import { navigationFor } from '../../navigation';

// Every screen under the shell needs a session; without one, go to sign-in and come back here afterwards.
export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    const session = await queryClient.ensureQueryData(getSessionQueryOptions());
    if (session) return null;
    const url = new URL(request.url);
    return redirect(paths.auth.signIn.getHref(`${url.pathname}${url.search}`));
  };

export default function AppRoot() {
  const { data: session } = useSession();
  const location = useLocation();
  const navigate = useNavigate();
  const devOutbox = useOutboxAvailable(hasPermission(session, 'members:manage'));

  // The session ended while the console was open (expired, or a 401 elsewhere cleared it).
  if (!session) {
    return <Navigate to={paths.auth.signIn.getHref(`${location.pathname}${location.search}`)} replace />;
  }

  return (
    <AppShell
      navigation={navigationFor(session, { devOutbox })}
      organisationSlot={<OrganisationSwitcher session={session} />}
      accountSlot={
        <AccountPanel session={session} onSignedOut={() => navigate(paths.auth.signIn.getHref(), { replace: true })} />
      }
    >
      <Outlet />
    </AppShell>
  );
}
