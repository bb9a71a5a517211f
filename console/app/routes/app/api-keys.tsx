import { useState } from 'react';
import type { QueryClient } from '@tanstack/react-query';
import { Alert } from '@console/components/ui/alert';
import { PageHeader } from '@console/components/ui/page-header';
import { Panel } from '@console/components/ui/panel';
import { ErrorState, LoadingState } from '@console/components/ui/states';
import { getSessionQueryOptions, useSession } from '@console/features/auth/api/get-session';
import { getApiKeysQueryOptions } from '@console/features/api-keys/api/get-api-keys';
import { ApiKeySecretDialog } from '@console/features/api-keys/components/api-key-secret-dialog';
import { ApiKeysTable } from '@console/features/api-keys/components/api-keys-table';
import { CreateApiKeyForm } from '@console/features/api-keys/components/create-api-key-form';
import { grantableScopes } from '@console/features/api-keys/utils/key-display';
import { getPermissionsQueryOptions, usePermissions } from '@console/features/permissions/api/get-permissions';
import { hasPermission } from '@console/lib/authorization';
import type { CreatedApiKey } from '@shared/schemas/api-keys';

const KEYS_PERMISSION = 'keys:manage';

export const clientLoader = (queryClient: QueryClient) => async () => {
  const session = await queryClient.ensureQueryData(getSessionQueryOptions());
  if (hasPermission(session, KEYS_PERMISSION)) {
    void queryClient.prefetchInfiniteQuery(getApiKeysQueryOptions());
    void queryClient.prefetchQuery(getPermissionsQueryOptions());
  }
  return null;
};

type CreateKeyPanelProps = { sessionPermissions: string[]; onCreated: (created: CreatedApiKey) => void };

function CreateKeyPanel({ sessionPermissions, onCreated }: CreateKeyPanelProps) {
  const catalogue = usePermissions();
  return (
    <Panel
      title="Create a key"
      description="One key per rig or job: each can then be revoked without stopping the others."
    >
      {catalogue.isPending && <LoadingState label="Loading scopes…" />}
      {catalogue.isError && <ErrorState error={catalogue.error} onRetry={() => catalogue.refetch()} />}
      {catalogue.isSuccess && (
        <CreateApiKeyForm scopes={grantableScopes(catalogue.data.scopes, sessionPermissions)} onCreated={onCreated} />
      )}
    </Panel>
  );
}

export default function ApiKeysRoute() {
  const { data: session } = useSession();
  const [created, setCreated] = useState<CreatedApiKey | null>(null);
  if (!session) return null;
  const canManage = hasPermission(session, KEYS_PERMISSION);

  return (
    <>
      <PageHeader
        eyebrow="Organisation"
        title="API keys"
        description="Rigs and scripts authenticate with these keys: send one as Authorization: Bearer on every request."
      />
      {canManage ? (
        <div className="space-y-6">
          <CreateKeyPanel sessionPermissions={session.permissions} onCreated={setCreated} />
          <Panel
            title="Keys"
            description="Secrets are never shown again; a key is recognised by its prefix and last four characters."
            flush
          >
            <ApiKeysTable canRevoke={canManage} />
          </Panel>
          <ApiKeySecretDialog created={created} onClose={() => setCreated(null)} />
        </div>
      ) : (
        <Alert tone="info" title="Your role does not manage API keys">
          Owners and admins of {session.activeOrganisation.name} create and revoke keys for the organisation’s rigs.
        </Alert>
      )}
    </>
  );
}
