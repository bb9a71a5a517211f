import { bigint, double, int, mysqlTable, primaryKey, index, varchar, uniqueIndex } from 'drizzle-orm/mysql-core';
import { asciiBinary, idReference, utcDatetime } from './columns.helpers';
import { organisations } from './identity';

/**
 * Monthly counters per organisation and period. Quota checks are one conditional UPDATE on this row
 * (`… WHERE used + n <= limit`), so concurrent requests can never overdraw it.
 */
export const usageCounters = mysqlTable(
  'usage_counters',
  {
    organisationId: idReference('organisation_id')
      .notNull()
      .references(() => organisations.id, { onDelete: 'cascade' }),
    periodStart: utcDatetime('period_start').notNull(),
    periodEnd: utcDatetime('period_end').notNull(),
    analysesCount: int('analyses_count').notNull().default(0),
    audioSeconds: double('audio_seconds').notNull().default(0),
  },
  (table) => [primaryKey({ columns: [table.organisationId, table.periodStart] })],
);

/** What each analysis was charged, so a release refunds exactly that, once. */
export const usageCharges = mysqlTable(
  'usage_charges',
  {
    organisationId: idReference('organisation_id')
      .notNull()
      .references(() => organisations.id, { onDelete: 'cascade' }),
    analysisId: idReference('analysis_id').notNull(),
    periodStart: utcDatetime('period_start').notNull(),
    audioSeconds: double('audio_seconds').notNull(),
    createdAt: utcDatetime('created_at').notNull(),
  },
  (table) => [primaryKey({ columns: [table.organisationId, table.analysisId] })],
);

/** Bytes an organisation keeps (captures, results): a running total, not a monthly figure. */
export const storageUsage = mysqlTable('storage_usage', {
  organisationId: idReference('organisation_id')
    .primaryKey()
    .references(() => organisations.id, { onDelete: 'cascade' }),
  storageBytes: bigint('storage_bytes', { mode: 'number' }).notNull().default(0),
});

/** One row per threshold crossed per period: the unique key makes the notice happen once. */
export const usageThresholdNotices = mysqlTable(
  'usage_threshold_notices',
  {
    organisationId: idReference('organisation_id')
      .notNull()
      .references(() => organisations.id, { onDelete: 'cascade' }),
    periodStart: utcDatetime('period_start').notNull(),
    quota: varchar('quota', { length: 16 }).$type<'analyses' | 'audio_minutes' | 'storage_bytes'>().notNull(),
    thresholdPercent: int('threshold_percent').notNull(),
    createdAt: utcDatetime('created_at').notNull(),
    /** Set by whoever mails the organisation's admins (null = not yet mailed). */
    notifiedAt: utcDatetime('notified_at'),
  },
  (table) => [uniqueIndex('usage_threshold_notices_unique').on(table.organisationId, table.periodStart, table.quota, table.thresholdPercent)],
);

/**
 * Fixed one-minute request windows per partition (API key or session user). Shared by every server process,
 * so the limit holds however many processes answer.
 */
export const rateLimitWindows = mysqlTable(
  'rate_limit_windows',
  {
    partitionKey: asciiBinary('partition_key', { length: 80 }).notNull(),
    windowStart: utcDatetime('window_start').notNull(),
    requestCount: int('request_count').notNull(),
  },
  (table) => [primaryKey({ columns: [table.partitionKey, table.windowStart] }), index('rate_limit_windows_start_idx').on(table.windowStart)],
);
