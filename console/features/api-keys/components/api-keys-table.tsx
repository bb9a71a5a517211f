import { useState } from 'react';
import { Badge, type BadgeTone } from '@console/components/ui/badge';
import { Button } from '@console/components/ui/button';
import { ConfirmDialog } from '@console/components/ui/confirm-dialog';
import { useNotify } from '@console/components/ui/notifications';
import { EmptyState, ErrorState, LoadingState } from '@console/components/ui/states';
import { Table, Td, Th } from '@console/components/ui/table';
import { formatDate, formatDateTime, formatRelativeTime } from '@console/utils/format-date';
import type { ApiKey } from '@shared/schemas/api-keys';
import { useApiKeys } from '../api/get-api-keys';
import { useRevokeApiKey } from '../api/revoke-api-key';
import { maskedKey } from '../utils/key-display';
import { ApiKeyScopes } from './api-key-scopes';

const statusTone: Record<ApiKey['status'], BadgeTone> = { active: 'ok', expired: 'warning', revoked: 'danger' };
const statusLabel: Record<ApiKey['status'], string> = { active: 'Active', expired: 'Expired', revoked: 'Revoked' };

function TimeCell({ iso, empty }: { iso: string | null; empty: string }) {
  if (!iso) return <span className="text-ink-500">{empty}</span>;
  return (
    <time dateTime={iso} title={formatDateTime(iso)}>
      {formatRelativeTime(iso)}
    </time>
  );
}

/** When the key stops (or stopped) working; revocation wins over the expiry date. */
function ExpiryText({ apiKey }: { apiKey: ApiKey }) {
  if (apiKey.revokedAt) {
    return (
      <time dateTime={apiKey.revokedAt} title={formatDateTime(apiKey.revokedAt)}>
        since {formatDate(apiKey.revokedAt)}
      </time>
    );
  }
  if (!apiKey.expiresAt) return <span className="text-ink-500">No expiry</span>;
  return (
    <time dateTime={apiKey.expiresAt} title={formatDateTime(apiKey.expiresAt)}>
      {apiKey.status === 'expired' ? 'since' : 'until'} {formatDate(apiKey.expiresAt)}
    </time>
  );
}

export function ApiKeysTable({ canRevoke }: { canRevoke: boolean }) {
  const keys = useApiKeys();
  const notify = useNotify();
  const [pendingRevoke, setPendingRevoke] = useState<ApiKey | null>(null);
  const revoke = useRevokeApiKey({
    onSuccess: (apiKey) => {
      setPendingRevoke(null);
      notify(`Key “${apiKey.name}” was revoked. Requests with it are refused from now on.`);
    },
  });

  if (keys.isPending) return <LoadingState label="Loading API keys…" />;
  if (keys.isError) return <ErrorState error={keys.error} onRetry={() => keys.refetch()} />;

  const rows = keys.data.pages.flatMap((page) => page.data);
  if (rows.length === 0) {
    return (
      <EmptyState title="No API keys yet">
        Create one above for each rig or job that posts captures, so each can be revoked on its own.
      </EmptyState>
    );
  }

  return (
    <>
      <Table caption="API keys of this organisation">
        <thead>
          <tr>
            <Th>Key</Th>
            <Th>Scopes</Th>
            <Th>Created</Th>
            <Th>Last used</Th>
            <Th>Status</Th>
            {canRevoke && (
              <Th>
                <span className="sr-only">Actions</span>
              </Th>
            )}
          </tr>
        </thead>
        <tbody>
          {rows.map((apiKey) => (
            <tr key={apiKey.id} className={apiKey.status === 'active' ? 'hover:bg-ink-50/60' : 'text-ink-500'}>
              <Td>
                <div className="font-semibold text-ink-900">{apiKey.name}</div>
                <div className="font-mono text-xs whitespace-nowrap text-ink-600">{maskedKey(apiKey)}</div>
              </Td>
              <Td>
                <ApiKeyScopes scopes={apiKey.scopes} />
              </Td>
              <Td className="text-xs whitespace-nowrap">
                <time dateTime={apiKey.createdAt} title={formatDateTime(apiKey.createdAt)}>
                  {formatDate(apiKey.createdAt)}
                </time>
                {apiKey.createdBy && <div className="text-ink-600">by {apiKey.createdBy.displayName}</div>}
              </Td>
              <Td className="text-xs whitespace-nowrap">
                <TimeCell iso={apiKey.lastUsedAt} empty="Never" />
              </Td>
              <Td className="text-xs whitespace-nowrap">
                <Badge tone={statusTone[apiKey.status]}>{statusLabel[apiKey.status]}</Badge>
                <div className="mt-1 text-ink-600">
                  <ExpiryText apiKey={apiKey} />
                </div>
              </Td>
              {canRevoke && (
                <Td className="text-right">
                  {apiKey.status !== 'revoked' && (
                    <Button
                      variant="ghost-danger"
                      size="sm"
                      aria-label={`Revoke ${apiKey.name}`}
                      onClick={() => {
                        revoke.reset();
                        setPendingRevoke(apiKey);
                      }}
                    >
                      Revoke
                    </Button>
                  )}
                </Td>
              )}
            </tr>
          ))}
        </tbody>
      </Table>
      {keys.hasNextPage && (
        <div className="flex justify-center border-t border-ink-100 px-5 py-3">
          <Button variant="secondary" size="sm" isPending={keys.isFetchingNextPage} onClick={() => keys.fetchNextPage()}>
            Show more keys
          </Button>
        </div>
      )}
      <ConfirmDialog
        open={pendingRevoke !== null}
        title={pendingRevoke ? `Revoke “${pendingRevoke.name}”?` : 'Revoke key?'}
        description={
          pendingRevoke && (
            <p>
              Requests signed with <span className="font-mono text-ink-800">{maskedKey(pendingRevoke)}</span> are
              refused from the next one on. A rig still using it stops uploading. This cannot be undone.
            </p>
          )
        }
        confirmLabel="Revoke key"
        onConfirm={() => pendingRevoke && revoke.mutate(pendingRevoke.id)}
        onCancel={() => setPendingRevoke(null)}
        isPending={revoke.isPending}
        error={revoke.error}
      />
    </>
  );
}
