import { index, mysqlEnum, mysqlTable, uniqueIndex, varchar } from 'drizzle-orm/mysql-core';
import { ROLES } from '../../../shared/schemas/permissions';
import { idColumn, idReference, timestamps } from './columns.helpers';

export const users = mysqlTable(
  'users',
  {
    id: idColumn(),
    /** Stored lower-cased; unique. */
    email: varchar('email', { length: 254 }).notNull(),
    displayName: varchar('display_name', { length: 100 }).notNull(),
    /** PHC string of an argon2id hash. */
    passwordHash: varchar('password_hash', { length: 255 }).notNull(),
    ...timestamps,
  },
  (table) => [uniqueIndex('users_email_unique').on(table.email)],
);

export const organisations = mysqlTable('organisations', {
  id: idColumn(),
  name: varchar('name', { length: 100 }).notNull(),
  ...timestamps,
});

export const memberships = mysqlTable(
  'memberships',
  {
    id: idColumn(),
    organisationId: idReference('organisation_id')
      .notNull()
      .references(() => organisations.id),
    userId: idReference('user_id')
      .notNull()
      .references(() => users.id),
    role: mysqlEnum('role', ROLES).notNull(),
    ...timestamps,
  },
  (table) => [
    uniqueIndex('memberships_organisation_user_unique').on(table.organisationId, table.userId),
    index('memberships_user_idx').on(table.userId),
  ],
);
