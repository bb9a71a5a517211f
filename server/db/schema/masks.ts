import { int, index, json, mysqlTable, primaryKey, varchar } from 'drizzle-orm/mysql-core';
import { idColumn, idReference, timestamps, utcDatetime } from './columns.helpers';
import { organisations } from './identity';

export interface MaskPointColumn {
  frequencyHz: number;
  levelDb: number;
}

/** A tolerance mask: a name and its versions; only `latestVersion` moves. */
export const masks = mysqlTable(
  'masks',
  {
    id: idColumn(),
    organisationId: idReference('organisation_id')
      .notNull()
      .references(() => organisations.id),
    name: varchar('name', { length: 100 }).notNull(),
    latestVersion: int('latest_version').notNull(),
    ...timestamps,
  },
  (table) => [index('masks_organisation_created_idx').on(table.organisationId, table.createdAt, table.id)],
);

/** One immutable version of a mask: verdicts name (maskId, version), so a version is never changed in place. */
export const maskVersions = mysqlTable(
  'mask_versions',
  {
    maskId: idReference('mask_id')
      .notNull()
      .references(() => masks.id),
    organisationId: idReference('organisation_id')
      .notNull()
      .references(() => organisations.id),
    version: int('version').notNull(),
    levelReference: varchar('level_reference', { length: 16 }).$type<'absolute' | 'relative'>().notNull(),
    /** For relative masks: the reference the limits are relative to (e.g. { kind: 'at_1khz' }). */
    reference: json('reference').$type<Record<string, unknown>>(),
    upper: json('upper').$type<MaskPointColumn[]>(),
    lower: json('lower').$type<MaskPointColumn[]>(),
    /** Set for derived versions: golden analyses, k, minimum half-width, per-frequency statistics. */
    derivation: json('derivation').$type<Record<string, unknown>>(),
    note: varchar('note', { length: 500 }),
    createdAt: utcDatetime('created_at').notNull(),
  },
  (table) => [primaryKey({ columns: [table.maskId, table.version] })],
);
