import { customType, datetime } from 'drizzle-orm/mysql-core';

/** Widest id we generate (prefix + "_" + 20 base62 characters) with room to spare. */
const ID_LENGTH = 32;

/**
 * Case-sensitive ASCII text: ids and key prefixes are base62, where "a" and "A" differ. The database default
 * collation ignores case, which would make two distinct ids compare equal and reorder keyset pages.
 */
export const asciiBinary = customType<{ data: string; driverData: string; config: { length: number } }>({
  dataType: (config) => `varchar(${config?.length ?? 255}) CHARACTER SET ascii COLLATE ascii_bin`,
});

/** Prefixed random string id (see server/lib/ids.ts); MariaDB rejects drizzle's serial(). */
export const idColumn = () => asciiBinary('id', { length: ID_LENGTH }).primaryKey();

/** A reference to another table's id (same type, so foreign keys match). */
export const idReference = (name: string) => asciiBinary(name, { length: ID_LENGTH });

/** UTC instant with milliseconds; the server runs with time_zone +00:00 so values round-trip exactly. */
export const utcDatetime = (name: string) => datetime(name, { mode: 'date', fsp: 3 });

/** Both set by the application from its clock, never by a database default, so tests can move time. */
export const timestamps = {
  createdAt: utcDatetime('created_at').notNull(),
  updatedAt: utcDatetime('updated_at').notNull(),
};
