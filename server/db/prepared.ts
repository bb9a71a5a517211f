import { drizzle } from 'drizzle-orm/mysql2';
import type { Pool, PoolConnection, ResultSetHeader } from 'mysql2/promise';
import type { Database, Executor } from './client';
import * as tables from './tables';

/**
 * Statements with large parameters (a stored result runs to ~100 kB) sent as prepared statements. Drizzle's mysql2
 * driver sends every statement in the text protocol: the driver escapes each value into the SQL and the server
 * parses it back out, which for a 100 kB text costs about twice the CPU, on both sides, of the binary protocol a
 * prepared statement uses (`npm run bench:api` shows the difference). The statement is still built by drizzle,
 * so column names and value mapping stay in one place.
 */

/** A transaction on one pooled connection: a drizzle executor and the driver connection share it. */
export async function transactionOnConnection<T>(db: Database, work: (scope: { tx: Executor; connection: PoolConnection }) => Promise<T>): Promise<T> {
  const pool = (db as unknown as { $client: Pool }).$client;
  const connection = await pool.getConnection();
  try {
    await connection.beginTransaction();
    // 'planetscale' mode as in client.ts (MariaDB rejects the LATERAL joins of the default mode).
    const tx = drizzle(connection, { schema: tables, mode: 'planetscale' });
    const result = await work({ tx, connection });
    await connection.commit();
    return result;
  } catch (error) {
    await connection.rollback().catch(() => undefined);
    throw error;
  } finally {
    connection.release();
  }
}

/** Runs a drizzle-built insert, update or delete as a prepared statement; returns the affected row count. */
export async function executePrepared(connection: PoolConnection, statement: { toSQL(): { sql: string; params: unknown[] } }): Promise<number> {
  const { sql, params } = statement.toSQL();
  const [result] = await connection.execute<ResultSetHeader>(sql, params as never);
  return result.affectedRows;
}
