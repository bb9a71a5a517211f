import { double, index, int, json, mysqlTable, varchar } from 'drizzle-orm/mysql-core';
import { idColumn, idReference, utcDatetime } from './columns.helpers';
import { organisations } from './identity';

/**
 * A rig input's chain sensitivity (dBFS at 1 Pa), from a calibrator capture or entered values, valid for a
 * period. Rows are never changed: a new calibration supersedes the old one for later analyses.
 */
export const calibrations = mysqlTable(
  'calibrations',
  {
    id: idColumn(),
    organisationId: idReference('organisation_id')
      .notNull()
      .references(() => organisations.id),
    rigId: varchar('rig_id', { length: 100 }).notNull(),
    inputChannel: int('input_channel').notNull(),
    source: varchar('source', { length: 32 }).$type<'calibrator_capture' | 'entered_dbfs' | 'entered_microphone'>().notNull(),
    dbfsAtOnePascal: double('dbfs_at_one_pascal').notNull(),
    /** How the figure was obtained (capture id, stated level, measured tone, microphone sensitivity…). */
    details: json('details').$type<Record<string, unknown>>().notNull(),
    notes: varchar('notes', { length: 500 }),
    validFrom: utcDatetime('valid_from').notNull(),
    validUntil: utcDatetime('valid_until'),
    createdByLabel: varchar('created_by_label', { length: 200 }).notNull(),
    createdAt: utcDatetime('created_at').notNull(),
  },
  (table) => [
    index('calibrations_organisation_created_idx').on(table.organisationId, table.createdAt, table.id),
    index('calibrations_rig_idx').on(table.organisationId, table.rigId, table.inputChannel, table.validFrom),
  ],
);
