import type { QueryClient } from '@tanstack/react-query';
import { Alert } from '@console/components/ui/alert';
import { PageHeader } from '@console/components/ui/page-header';
import { getSessionQueryOptions, useSession } from '@console/features/auth/api/get-session';
import { getOutboxQueryOptions } from '@console/features/dev-outbox/api/get-outbox';
import { OutboxView } from '@console/features/dev-outbox/components/outbox-view';
import { hasPermission } from '@console/lib/authorization';

const OUTBOX_PERMISSION = 'members:manage';

export const clientLoader = (queryClient: QueryClient) => async () => {
  const session = await queryClient.ensureQueryData(getSessionQueryOptions());
  if (hasPermission(session, OUTBOX_PERMISSION)) void queryClient.prefetchQuery(getOutboxQueryOptions());
  return null;
};

export default function DevOutboxRoute() {
  const { data: session } = useSession();
  if (!session) return null;
  return (
    <>
      <PageHeader
        eyebrow="Developer"
        title="Outbox"
        description="E-mails this development server caught instead of delivering them, newest first. Open one to follow its links, such as an invitation."
      />
      {hasPermission(session, OUTBOX_PERMISSION) ? (
        <OutboxView />
      ) : (
        <Alert tone="info" title="Owners and admins only">
          Caught e-mails contain invitation links, so only members who manage the organisation can read them.
        </Alert>
      )}
    </>
  );
}
