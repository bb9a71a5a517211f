import { index, int, json, mysqlTable, varchar } from 'drizzle-orm/mysql-core';
import { idColumn, idReference, utcDatetime } from './columns.helpers';
import { organisations } from './identity';

/** A stimulus is its parameters: the audio is regenerated from them, never stored. */
export const stimuli = mysqlTable(
  'stimuli',
  {
    id: idColumn(),
    organisationId: idReference('organisation_id')
      .notNull()
      .references(() => organisations.id),
    name: varchar('name', { length: 100 }),
    type: varchar('type', { length: 32 }).notNull(),
    /** Resolved parameters (every default applied), as the engine's designer returned them. */
    parameters: json('parameters').$type<Record<string, unknown>>().notNull(),
    sampleRateHz: int('sample_rate_hz').notNull(),
    engineVersion: varchar('engine_version', { length: 64 }).notNull(),
    createdAt: utcDatetime('created_at').notNull(),
  },
  (table) => [index('stimuli_organisation_created_idx').on(table.organisationId, table.createdAt, table.id)],
);
