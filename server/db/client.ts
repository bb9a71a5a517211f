import { drizzle, type MySql2Database } from 'drizzle-orm/mysql2';
import mysql from 'mysql2/promise';
import * as tables from './tables';

export type Database = MySql2Database<typeof tables>;

/** What a transaction callback receives; repositories accept either this or the Database. */
export type Executor = Database | Parameters<Parameters<Database['transaction']>[0]>[0];

export interface DatabaseHandle {
  db: Database;
  pool: mysql.Pool;
  close(): Promise<void>;
}

export interface DatabaseOptions {
  connectionLimit?: number;
  /**
   * Whether the driver captures the caller's stack on every statement so a failed one points at its caller
   * (mysql2's `trace`, on by default). It costs a stack walk per statement (tens of µs, dozens of statements per
   * analysis), so production turns it off: a failed statement still carries its SQL, code and message.
   */
  traceStatements?: boolean;
}

/** The options every server process uses: the configured pool size, and statement traces outside production. */
export function databaseOptionsFor(config: { databaseConnections: number; nodeEnv: string }): DatabaseOptions {
  return { connectionLimit: config.databaseConnections, traceStatements: config.nodeEnv !== 'production' };
}

export function createDatabase(url: string, options: DatabaseOptions = {}): DatabaseHandle {
  const pool = mysql.createPool({
    uri: url,
    connectionLimit: options.connectionLimit ?? 10,
    trace: options.traceStatements ?? true,
    // Dates are UTC both ways, whatever the server's own default time zone.
    timezone: 'Z',
    dateStrings: false,
    supportBigNumbers: true,
  });
  pool.on('connection', (connection) => {
    connection.query("SET time_zone = '+00:00'");
  });
  // 'planetscale' mode makes relational queries avoid LATERAL joins, which MariaDB rejects.
  const db = drizzle(pool, { schema: tables, mode: 'planetscale' });
  return { db, pool, close: () => pool.end() };
}
