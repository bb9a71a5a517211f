import { char, index, int, mysqlEnum, mysqlTable, uniqueIndex, varchar } from 'drizzle-orm/mysql-core';
import { ROLES } from '../../../shared/schemas/permissions';
import { idColumn, idReference, utcDatetime } from './columns.helpers';
import { organisations, users } from './identity';

/**
 * An e-mail invitation to join an organisation with a role. Only the SHA-256 of the link's token is stored;
 * a resend replaces it, so the previous link stops working. `status` is what people did with it; "expired" for
 * a pending row past `expiresAt` is decided when it is read, and stored only when a new invitation replaces it.
 */
export const invitations = mysqlTable(
  'invitations',
  {
    id: idColumn(),
    organisationId: idReference('organisation_id')
      .notNull()
      .references(() => organisations.id),
    /** Stored lower-cased, like users.email. */
    email: varchar('email', { length: 254 }).notNull(),
    role: mysqlEnum('role', ROLES).notNull(),
    status: mysqlEnum('status', ['pending', 'accepted', 'revoked', 'expired']).notNull(),
    /**
     * The e-mail while the invitation is pending, NULL otherwise: the unique index then allows one pending
     * invitation per address and organisation (NULLs never collide), however many requests race.
     */
    pendingEmail: varchar('pending_email', { length: 254 }),
    /** SHA-256 (hex) of the current link token; the token itself is never stored. */
    tokenHash: char('token_hash', { length: 64 }).notNull(),
    expiresAt: utcDatetime('expires_at').notNull(),
    invitedByLabel: varchar('invited_by_label', { length: 100 }).notNull(),
    invitedByUserId: idReference('invited_by_user_id').references(() => users.id, { onDelete: 'set null' }),
    /** What happened to the last e-mail: sent, failed (relay refused or down) or not_sent (no relay configured). */
    emailStatus: mysqlEnum('email_status', ['sent', 'failed', 'not_sent']).notNull(),
    emailError: varchar('email_error', { length: 500 }),
    lastSentAt: utcDatetime('last_sent_at').notNull(),
    /** E-mails sent for this invitation (the first one and every resend). */
    sendCount: int('send_count').notNull(),
    acceptedByUserId: idReference('accepted_by_user_id').references(() => users.id, { onDelete: 'set null' }),
    acceptedAt: utcDatetime('accepted_at'),
    revokedAt: utcDatetime('revoked_at'),
    createdAt: utcDatetime('created_at').notNull(),
    updatedAt: utcDatetime('updated_at').notNull(),
  },
  (table) => [
    uniqueIndex('invitations_token_hash_unique').on(table.tokenHash),
    uniqueIndex('invitations_pending_email_unique').on(table.organisationId, table.pendingEmail),
    index('invitations_organisation_created_idx').on(table.organisationId, table.createdAt, table.id),
  ],
);
