import { fileURLToPath } from 'node:url';
import { drizzle } from 'drizzle-orm/mysql2';
import { migrate } from 'drizzle-orm/mysql2/migrator';
import mysql from 'mysql2/promise';

export const MIGRATIONS_FOLDER = fileURLToPath(new URL('../../drizzle', import.meta.url));

/**
 * Applies pending migrations from drizzle/ on one dedicated connection (DDL must not be spread over a pool).
 * A named lock lets several processes start at once: one migrates, the others wait and find nothing to do.
 */
export async function applyMigrations(databaseUrl: string): Promise<void> {
  const connection = await mysql.createConnection({ uri: databaseUrl, timezone: 'Z', multipleStatements: false });
  try {
    const [rows] = await connection.query("SELECT GET_LOCK('sweepline_migrations', 120) AS locked");
    if ((rows as Array<{ locked: number }>)[0]?.locked !== 1) throw new Error('Timed out waiting for the migration lock');
    try {
      await migrate(drizzle(connection), { migrationsFolder: MIGRATIONS_FOLDER });
    } finally {
      await connection.query("SELECT RELEASE_LOCK('sweepline_migrations')");
    }
  } finally {
    await connection.end();
  }
}
