import type { Permission } from '@shared/schemas/permissions';
import type { AppDeps } from '@server/deps';
import { constantTimeEqual } from '@server/lib/crypto';
import { ApiProblem } from '@server/http/api-problem';
import type { Principal } from '@server/http/principal';
import { describeSecret, hasSecretFormat } from './api-key-secret';
import { findKeysForAuthentication, touchLastUsed } from './api-keys.repo';

const invalid = () =>
  new ApiProblem('invalid_api_key', 'The API key is not recognised. Check that it was copied whole, or create a new one.');

/** Expired and revoked keys get their own codes so a rig's operator knows to replace the key, not retype it. */
export async function authenticateApiKey(deps: AppDeps, candidate: string): Promise<Principal> {
  if (!hasSecretFormat(candidate)) throw invalid();
  const { prefix, secretHash } = describeSecret(candidate);
  const rows = await findKeysForAuthentication(deps.db, prefix);
  const row = rows.find((candidateRow) => constantTimeEqual(candidateRow.secretHash, secretHash));
  if (!row) throw invalid();
  const now = deps.clock.now();
  if (row.revokedAt) throw new ApiProblem('api_key_revoked', `The API key "${row.name}" was revoked on ${row.revokedAt.toISOString()}.`);
  if (row.expiresAt && row.expiresAt.getTime() <= now.getTime()) {
    throw new ApiProblem('api_key_expired', `The API key "${row.name}" expired on ${row.expiresAt.toISOString()}.`);
  }
  const staleAfterMs = deps.config.apiKeyLastUsedIntervalSeconds * 1000;
  if (!row.lastUsedAt || now.getTime() - row.lastUsedAt.getTime() >= staleAfterMs) {
    await touchLastUsed(deps.db, row.organisationId, row.id, now, deps.config.apiKeyLastUsedIntervalSeconds);
  }
  return {
    organisationId: row.organisationId,
    permissions: new Set<Permission>(row.scopes),
    actor: { type: 'api_key', id: row.id, label: row.name },
  };
}
