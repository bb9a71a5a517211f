import { bigint, char, double, index, int, json, mysqlTable, varchar } from 'drizzle-orm/mysql-core';
import { idColumn, idReference, utcDatetime } from './columns.helpers';
import { organisations } from './identity';

export interface CaptureFormatColumn {
  sampleEncoding: 'pcm_int' | 'float';
  bitsPerSample: number;
  formatTag: number;
  extensible: boolean;
}

/** Metadata of an uploaded WAV; the bytes live in the blob store under `sha256`. */
export const captures = mysqlTable(
  'captures',
  {
    id: idColumn(),
    organisationId: idReference('organisation_id')
      .notNull()
      .references(() => organisations.id),
    filename: varchar('filename', { length: 255 }).notNull(),
    sha256: char('sha256', { length: 64 }).notNull(),
    sizeBytes: bigint('size_bytes', { mode: 'number', unsigned: true }).notNull(),
    sampleRateHz: int('sample_rate_hz').notNull(),
    channelCount: int('channel_count').notNull(),
    frameCount: bigint('frame_count', { mode: 'number', unsigned: true }).notNull(),
    durationSeconds: double('duration_seconds').notNull(),
    format: json('format').$type<CaptureFormatColumn>().notNull(),
    channelStats: json('channel_stats').$type<Record<string, unknown>[]>().notNull(),
    warnings: json('warnings').$type<Record<string, unknown>[]>().notNull(),
    createdAt: utcDatetime('created_at').notNull(),
  },
  (table) => [
    index('captures_organisation_created_idx').on(table.organisationId, table.createdAt, table.id),
    index('captures_sha256_idx').on(table.sha256),
  ],
);
