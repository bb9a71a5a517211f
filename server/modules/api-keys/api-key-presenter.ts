import type { ApiKey } from '@shared/schemas/api-keys';
import type { ApiKeyWithCreator } from './api-keys.repo';

export function apiKeyStatus(row: Pick<ApiKeyWithCreator, 'revokedAt' | 'expiresAt'>, now: Date): ApiKey['status'] {
  if (row.revokedAt) return 'revoked';
  if (row.expiresAt && row.expiresAt.getTime() <= now.getTime()) return 'expired';
  return 'active';
}

export function presentApiKey(row: ApiKeyWithCreator, now: Date): ApiKey {
  return {
    id: row.id,
    name: row.name,
    prefix: row.prefix,
    lastFour: row.lastFour,
    scopes: row.scopes,
    status: apiKeyStatus(row, now),
    createdAt: row.createdAt.toISOString(),
    expiresAt: row.expiresAt?.toISOString() ?? null,
    lastUsedAt: row.lastUsedAt?.toISOString() ?? null,
    revokedAt: row.revokedAt?.toISOString() ?? null,
    createdBy: row.createdByUserId && row.creatorDisplayName !== null ? { id: row.createdByUserId, displayName: row.creatorDisplayName } : null,
  };
}
