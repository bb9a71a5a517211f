import { char, int, json, longtext, mysqlTable, index, uniqueIndex, varchar } from 'drizzle-orm/mysql-core';
import { asciiBinary, idReference, utcDatetime } from './columns.helpers';
import { organisations } from './identity';

/**
 * One row per (organisation, method, route template, Idempotency-Key): the unique index is what decides which
 * of several concurrent duplicates runs. The stored response is replayed to retries until `expiresAt`.
 */
export const idempotencyRecords = mysqlTable(
  'idempotency_records',
  {
    organisationId: idReference('organisation_id')
      .notNull()
      .references(() => organisations.id, { onDelete: 'cascade' }),
    method: asciiBinary('method', { length: 8 }).notNull(),
    routeTemplate: asciiBinary('route_template', { length: 200 }).notNull(),
    idempotencyKey: asciiBinary('idempotency_key', { length: 255 }).notNull(),
    /** SHA-256 (hex) of the request as sent (see server/http/idempotency.ts for what is hashed). */
    fingerprint: char('fingerprint', { length: 64 }).notNull(),
    state: varchar('state', { length: 16 }).$type<'in_progress' | 'completed'>().notNull(),
    responseStatus: int('response_status'),
    responseHeaders: json('response_headers').$type<Record<string, string>>(),
    responseBody: longtext('response_body'),
    createdAt: utcDatetime('created_at').notNull(),
    expiresAt: utcDatetime('expires_at').notNull(),
  },
  (table) => [
    uniqueIndex('idempotency_records_scope_unique').on(table.organisationId, table.method, table.routeTemplate, table.idempotencyKey),
    index('idempotency_records_expires_idx').on(table.expiresAt),
  ],
);
