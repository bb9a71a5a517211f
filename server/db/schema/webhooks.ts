import { boolean, index, int, json, longtext, mysqlTable, text, varchar } from 'drizzle-orm/mysql-core';
import { idColumn, idReference, timestamps, utcDatetime } from './columns.helpers';
import { organisations } from './identity';

export const webhookEndpoints = mysqlTable(
  'webhook_endpoints',
  {
    id: idColumn(),
    organisationId: idReference('organisation_id')
      .notNull()
      .references(() => organisations.id),
    url: varchar('url', { length: 2048 }).notNull(),
    description: varchar('description', { length: 200 }),
    eventTypes: json('event_types').$type<string[]>().notNull(),
    enabled: boolean('enabled').notNull(),
    /** Why the service disabled it (e.g. 'gone' after a 410); null when enabled or disabled by a person. */
    disabledReason: varchar('disabled_reason', { length: 32 }),
    /** AES-256-GCM sealed `whsec_…` secret (server/webhooks/secret-box.ts), bound to the endpoint id. */
    secretSealed: varchar('secret_sealed', { length: 255 }).notNull(),
    /** The secret before the last rotation; it still signs until previousSecretExpiresAt. */
    previousSecretSealed: varchar('previous_secret_sealed', { length: 255 }),
    previousSecretExpiresAt: utcDatetime('previous_secret_expires_at'),
    ...timestamps,
  },
  (table) => [index('webhook_endpoints_organisation_created_idx').on(table.organisationId, table.createdAt, table.id)],
);

/** An event as it is sent: the exact body bytes, so every retry and resend signs the same payload. */
export const webhookEvents = mysqlTable(
  'webhook_events',
  {
    id: idColumn(),
    organisationId: idReference('organisation_id')
      .notNull()
      .references(() => organisations.id),
    type: varchar('type', { length: 64 }).notNull(),
    body: text('body').notNull(),
    createdAt: utcDatetime('created_at').notNull(),
  },
  (table) => [index('webhook_events_organisation_created_idx').on(table.organisationId, table.createdAt)],
);

export const webhookDeliveries = mysqlTable(
  'webhook_deliveries',
  {
    id: idColumn(),
    organisationId: idReference('organisation_id')
      .notNull()
      .references(() => organisations.id),
    endpointId: idReference('endpoint_id')
      .notNull()
      .references(() => webhookEndpoints.id, { onDelete: 'cascade' }),
    eventId: idReference('event_id')
      .notNull()
      .references(() => webhookEvents.id),
    status: varchar('status', { length: 16 }).$type<'pending' | 'succeeded' | 'failed'>().notNull(),
    attempts: int('attempts').notNull(),
    nextAttemptAt: utcDatetime('next_attempt_at'),
    /** A dispatcher holds a claimed delivery until this time; after it another may claim it again. */
    lockedUntil: utcDatetime('locked_until'),
    lastAttemptAt: utcDatetime('last_attempt_at'),
    lastResponseStatus: int('last_response_status'),
    lastResponseExcerpt: varchar('last_response_excerpt', { length: 1024 }),
    lastError: varchar('last_error', { length: 500 }),
    ...timestamps,
  },
  (table) => [
    index('webhook_deliveries_due_idx').on(table.status, table.nextAttemptAt),
    index('webhook_deliveries_endpoint_created_idx').on(table.organisationId, table.endpointId, table.createdAt, table.id),
  ],
);

/** The delivery log: one row per attempt. */
export const webhookDeliveryAttempts = mysqlTable(
  'webhook_delivery_attempts',
  {
    id: idColumn(),
    organisationId: idReference('organisation_id').notNull(),
    deliveryId: idReference('delivery_id')
      .notNull()
      .references(() => webhookDeliveries.id, { onDelete: 'cascade' }),
    attemptNumber: int('attempt_number').notNull(),
    outcome: varchar('outcome', { length: 32 }).notNull(),
    responseStatus: int('response_status'),
    responseExcerpt: varchar('response_excerpt', { length: 1024 }),
    error: json('error').$type<{ code: string; message: string } | null>(),
    durationMs: int('duration_ms').notNull(),
    attemptedAt: utcDatetime('attempted_at').notNull(),
  },
  (table) => [index('webhook_delivery_attempts_delivery_idx').on(table.deliveryId, table.attemptNumber)],
);
