import type { ApiKey } from '@shared/schemas/api-keys';

/** What the console shows instead of the secret: the stored prefix, an ellipsis, the last four characters. */
export function maskedKey(key: Pick<ApiKey, 'prefix' | 'lastFour'>): string {
  return `${key.prefix}…${key.lastFour}`;
}

type Scope = { name: string; description: string };

/** A key can never carry more than its creator may do, so only the creator's own permissions are offered. */
export function grantableScopes<T extends Scope>(scopes: readonly T[], sessionPermissions: readonly string[]): T[] {
  const allowed = new Set(sessionPermissions);
  return scopes.filter((scope) => allowed.has(scope.name));
}
