import { index, json, mysqlEnum, mysqlTable, varchar } from 'drizzle-orm/mysql-core';
import { asciiBinary, idColumn, idReference, utcDatetime } from './columns.helpers';
import { organisations } from './identity';

export const auditEvents = mysqlTable(
  'audit_events',
  {
    id: idColumn(),
    organisationId: idReference('organisation_id')
      .notNull()
      .references(() => organisations.id),
    actorType: mysqlEnum('actor_type', ['user', 'api_key']).notNull(),
    actorId: idReference('actor_id').notNull(),
    /** The actor's name at the time, so the log still reads well after renames. */
    actorLabel: varchar('actor_label', { length: 100 }).notNull(),
    action: varchar('action', { length: 64 }).notNull(),
    objectType: varchar('object_type', { length: 32 }).notNull(),
    objectId: asciiBinary('object_id', { length: 64 }).notNull(),
    details: json('details').$type<Record<string, unknown>>().notNull(),
    createdAt: utcDatetime('created_at').notNull(),
  },
  (table) => [
    index('audit_events_organisation_created_idx').on(table.organisationId, table.createdAt, table.id),
    index('audit_events_organisation_object_idx').on(table.organisationId, table.objectId),
  ],
);
