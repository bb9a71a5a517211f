import type { ApiKey, CreateApiKeyRequest, CreatedApiKey, CurrentApiKey } from '@shared/schemas/api-keys';
import type { Page } from '@shared/schemas/pagination';
import type { AppDeps } from '@server/deps';
import { newId } from '@server/lib/ids';
import { ApiProblem, invalidField, notFound } from '@server/http/api-problem';
import { decodeCursor, toPage } from '@server/http/pagination';
import type { Principal } from '@server/http/principal';
import { recordAuditEvent } from '@server/modules/audit/audit.service';
import { findOrganisation } from '@server/modules/organisations/organisations.repo';
import { generateApiKeySecret } from './api-key-secret';
import { presentApiKey } from './api-key-presenter';
import { findApiKey, insertApiKey, listApiKeys, markRevoked } from './api-keys.repo';

/** A key never grants more than its creator holds (a keys:manage key cannot mint a broader key). */
function refuseScopesBeyondCreator(principal: Principal, scopes: readonly string[]) {
  const missing = scopes.filter((scope) => !principal.permissions.has(scope as never));
  if (missing.length > 0) {
    throw new ApiProblem('scope_not_held', `You cannot grant scopes you do not hold yourself: ${missing.join(', ')}.`, {
      extensions: { missingScopes: missing },
    });
  }
}

export async function createApiKey(deps: AppDeps, principal: Principal, input: CreateApiKeyRequest): Promise<CreatedApiKey> {
  const now = deps.clock.now();
  refuseScopesBeyondCreator(principal, input.scopes);
  const expiresAt = input.expiresAt ? new Date(input.expiresAt) : null;
  if (expiresAt && expiresAt.getTime() <= now.getTime()) throw invalidField('#/expiresAt', 'The expiry must lie in the future.');

  const id = newId('apiKey');
  const { secret, prefix, lastFour, secretHash } = generateApiKeySecret();
  const organisationId = principal.organisationId;
  await deps.db.transaction(async (tx) => {
    await insertApiKey(tx, organisationId, {
      id,
      name: input.name,
      prefix,
      lastFour,
      secretHash,
      scopes: input.scopes,
      createdByUserId: principal.actor.type === 'user' ? principal.actor.id : null,
      createdAt: now,
      expiresAt,
    });
    await recordAuditEvent(tx, organisationId, principal.actor, {
      action: 'api_key.created',
      objectType: 'api_key',
      objectId: id,
      details: { name: input.name, prefix, scopes: input.scopes, expiresAt: expiresAt?.toISOString() ?? null },
    }, now);
  });
  const row = await findApiKey(deps.db, organisationId, id);
  if (!row) throw new Error('created API key vanished');
  return { apiKey: presentApiKey(row, now), secret };
}

export async function listApiKeysPage(deps: AppDeps, organisationId: string, query: { limit: number; cursor?: string }): Promise<Page<ApiKey>> {
  const binding = { list: 'api-keys', organisationId };
  const after = decodeCursor(deps, binding, query.cursor);
  const rows = await listApiKeys(deps.db, organisationId, { limit: query.limit, after });
  const now = deps.clock.now();
  return toPage(deps, binding, rows, query.limit, (row) => row, (row) => presentApiKey(row, now));
}

export async function getApiKey(deps: AppDeps, organisationId: string, keyId: string): Promise<ApiKey> {
  const row = await findApiKey(deps.db, organisationId, keyId);
  if (!row) throw notFound('API key');
  return presentApiKey(row, deps.clock.now());
}

/** Revoking twice is harmless: the second call returns the key unchanged and logs nothing. */
export async function revokeApiKey(deps: AppDeps, principal: Principal, keyId: string): Promise<ApiKey> {
  const organisationId = principal.organisationId;
  const existing = await findApiKey(deps.db, organisationId, keyId);
  if (!existing) throw notFound('API key');
  const now = deps.clock.now();
  await deps.db.transaction(async (tx) => {
    if (!(await markRevoked(tx, organisationId, keyId, now))) return;
    await recordAuditEvent(tx, organisationId, principal.actor, {
      action: 'api_key.revoked',
      objectType: 'api_key',
      objectId: keyId,
      details: { name: existing.name, prefix: existing.prefix },
    }, now);
  });
  const row = await findApiKey(deps.db, organisationId, keyId);
  if (!row) throw notFound('API key');
  return presentApiKey(row, now);
}

export async function describeCallingKey(deps: AppDeps, principal: Principal): Promise<CurrentApiKey> {
  const [row, organisation] = await Promise.all([
    findApiKey(deps.db, principal.organisationId, principal.actor.id),
    findOrganisation(deps.db, principal.organisationId),
  ]);
  if (!row || !organisation) throw notFound('API key');
  return { apiKey: presentApiKey(row, deps.clock.now()), organisation: { id: organisation.id, name: organisation.name } };
}
