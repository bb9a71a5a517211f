type WithPermissions = { permissions: readonly string[] } | null | undefined;

/** Hides what the session may not do; the API refuses it anyway, this only spares a pointless 403. */
export function hasPermission(session: WithPermissions, permission: string): boolean {
  return !!session && session.permissions.includes(permission);
}
