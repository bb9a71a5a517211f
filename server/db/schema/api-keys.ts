import { char, index, json, mysqlTable, varchar } from 'drizzle-orm/mysql-core';
import type { Permission } from '../../../shared/schemas/permissions';
import { asciiBinary, idColumn, idReference, utcDatetime } from './columns.helpers';
import { organisations, users } from './identity';

export const apiKeys = mysqlTable(
  'api_keys',
  {
    id: idColumn(),
    organisationId: idReference('organisation_id')
      .notNull()
      .references(() => organisations.id),
    name: varchar('name', { length: 100 }).notNull(),
    /** First characters of the secret: shown to people and used to find candidate rows. */
    prefix: asciiBinary('prefix', { length: 24 }).notNull(),
    lastFour: asciiBinary('last_four', { length: 4 }).notNull(),
    /** SHA-256 (hex) of the whole secret; the secret itself is never stored. */
    secretHash: char('secret_hash', { length: 64 }).notNull(),
    scopes: json('scopes').$type<Permission[]>().notNull(),
    createdByUserId: idReference('created_by_user_id').references(() => users.id, { onDelete: 'set null' }),
    createdAt: utcDatetime('created_at').notNull(),
    expiresAt: utcDatetime('expires_at'),
    lastUsedAt: utcDatetime('last_used_at'),
    revokedAt: utcDatetime('revoked_at'),
  },
  (table) => [
    index('api_keys_prefix_idx').on(table.prefix),
    index('api_keys_organisation_created_idx').on(table.organisationId, table.createdAt, table.id),
  ],
);
