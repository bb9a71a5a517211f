import { double, index, int, json, longtext, mysqlTable, varchar } from 'drizzle-orm/mysql-core';
import { idColumn, idReference, utcDatetime } from './columns.helpers';
import { captures } from './captures';
import { organisations } from './identity';
import { stimuli } from './stimuli';

/**
 * An analysis is also its job: workers claim queued rows (FOR UPDATE SKIP LOCKED), hold a lease they renew, and
 * store the result JSON as text so it is returned exactly as the engine serialised it.
 */
export const analyses = mysqlTable(
  'analyses',
  {
    id: idColumn(),
    organisationId: idReference('organisation_id')
      .notNull()
      .references(() => organisations.id),
    kind: varchar('kind', { length: 32 }).notNull(),
    status: varchar('status', { length: 16 }).notNull(),
    progress: double('progress').notNull(),
    captureId: idReference('capture_id').references(() => captures.id),
    stimulusId: idReference('stimulus_id').references(() => stimuli.id),
    /** The validated request (spectrum arrays included), what the worker runs. */
    request: json('request').$type<Record<string, unknown>>().notNull(),
    dutModel: varchar('dut_model', { length: 100 }),
    dutSerial: varchar('dut_serial', { length: 100 }),
    dutLot: varchar('dut_lot', { length: 100 }),
    tags: json('tags').$type<string[]>().notNull(),
    rerunOf: idReference('rerun_of'),
    audioSeconds: double('audio_seconds').notNull(),
    attempts: int('attempts').notNull(),
    leaseOwner: varchar('lease_owner', { length: 64 }),
    leaseExpiresAt: utcDatetime('lease_expires_at'),
    cancelRequested: int('cancel_requested').notNull(),
    resultJson: longtext('result_json'),
    error: json('error').$type<Record<string, unknown>>(),
    verdict: varchar('verdict', { length: 16 }),
    /**
     * Smallest mask margin of the stored result (upper or lower limit; negative = violation), written with the result
     * so lists can sort by it; null without a mask verdict. Written by the job, not derived by the database from the
     * result text: a generated column re-parsed the whole result (~100 kB of JSON) on every update of the row.
     */
    worstMarginDb: double('worst_margin_db'),
    calibration: json('calibration').$type<Record<string, unknown>>(),
    engineVersion: varchar('engine_version', { length: 64 }),
    createdAt: utcDatetime('created_at').notNull(),
    updatedAt: utcDatetime('updated_at').notNull(),
    startedAt: utcDatetime('started_at'),
    finishedAt: utcDatetime('finished_at'),
  },
  (table) => [
    index('analyses_organisation_created_idx').on(table.organisationId, table.createdAt, table.id),
    index('analyses_queue_idx').on(table.status, table.createdAt),
    index('analyses_capture_idx').on(table.captureId),
    index('analyses_dut_idx').on(table.organisationId, table.dutModel, table.dutLot),
    // Keyset pages of GET /v1/analyses?sort=… : (organisation, sort key, id).
    index('analyses_organisation_model_idx').on(table.organisationId, table.dutModel, table.id),
    index('analyses_organisation_serial_idx').on(table.organisationId, table.dutSerial, table.id),
    index('analyses_organisation_verdict_idx').on(table.organisationId, table.verdict, table.id),
    index('analyses_organisation_margin_idx').on(table.organisationId, table.worstMarginDb, table.id),
  ],
);
