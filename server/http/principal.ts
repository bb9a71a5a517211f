import type { Permission, Role } from '@shared/schemas/permissions';

export type Actor =
  | { type: 'user'; id: string; label: string; membershipId: string; role: Role }
  | { type: 'api_key'; id: string; label: string };

/**
 * Who is calling, in which organisation, allowed to do what. Resolved before any handler runs, from either a
 * console session (the active membership, re-read from the database on every request) or an API key.
 */
export interface Principal {
  organisationId: string;
  permissions: ReadonlySet<Permission>;
  actor: Actor;
}

/** A signed-in console user, independent of any organisation (for the session endpoints). */
export interface SignedInUser {
  userId: string;
  /** The sign-in this session belongs to (absent for a session started in this request). */
  sessionId?: string;
  /** The organisation the session token names; its membership may have ended since. */
  activeOrganisationId: string;
  /** Seconds since the epoch when the user signed in with a password; bounds sliding refresh. */
  authTimeSeconds: number;
  expiresAt: Date;
}
