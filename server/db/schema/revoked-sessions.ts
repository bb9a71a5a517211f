import { index, mysqlTable } from 'drizzle-orm/mysql-core';
import { asciiBinary, idReference, utcDatetime } from './columns.helpers';

/**
 * Console sessions ended by sign-out before their natural expiry. A session cookie is a signed token (no row
 * per session), so a copied cookie would otherwise stay valid until it expires; a revoked session id is refused
 * by every server process. A row is only needed until the session could have expired anyway, then it is pruned.
 */
export const revokedSessions = mysqlTable(
  'revoked_sessions',
  {
    /** The `sid` claim: one id per sign-in, kept when the token is re-issued by use. */
    sessionId: asciiBinary('session_id', { length: 32 }).primaryKey(),
    userId: idReference('user_id').notNull(),
    /** The latest the session could have lasted (sign-in time + the maximum session age). */
    expiresAt: utcDatetime('expires_at').notNull(),
    createdAt: utcDatetime('created_at').notNull(),
  },
  (table) => [index('revoked_sessions_expires_idx').on(table.expiresAt)],
);
