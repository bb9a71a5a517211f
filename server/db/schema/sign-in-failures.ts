import { char, index, mysqlTable, varchar } from 'drizzle-orm/mysql-core';
import { idColumn, utcDatetime } from './columns.helpers';

/**
 * Failed sign-ins, for throttling. Kept in MariaDB rather than in memory so every server process sees the same
 * counts. A successful sign-in deletes its account's rows; rows older than a day are pruned.
 */
export const signInFailures = mysqlTable(
  'sign_in_failures',
  {
    id: idColumn(),
    /** SHA-256 of the normalised e-mail, so addresses of people without an account are not stored. */
    accountKey: char('account_key', { length: 64 }).notNull(),
    clientAddress: varchar('client_address', { length: 64 }).notNull(),
    createdAt: utcDatetime('created_at').notNull(),
  },
  (table) => [
    index('sign_in_failures_account_idx').on(table.accountKey, table.createdAt),
    index('sign_in_failures_address_idx').on(table.clientAddress, table.createdAt),
  ],
);
