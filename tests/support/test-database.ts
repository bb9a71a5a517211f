import mysql from 'mysql2/promise';
import { inject } from 'vitest';
import { createDatabase, type Database } from '@server/db/client';
import { applyMigrations } from '@server/db/migrate';
import { randomBase62 } from '@server/lib/random';

export interface TestDatabase {
  name: string;
  url: string;
  db: Database;
  pool: mysql.Pool;
  /** Closes the pool and drops the database. */
  drop(): Promise<void>;
}

function serverUrl(): string {
  return process.env.SWEEPLINE_TEST_DATABASE_SERVER_URL ?? inject('testDatabaseServerUrl');
}

/**
 * A fresh database with every migration applied, on the real test MariaDB (never a mock). One per test file
 * (or per server): tests cannot see each other's rows and need no clean-up between them.
 */
export async function createTestDatabase(): Promise<TestDatabase> {
  const base = serverUrl();
  const name = `swltest_${process.pid}_${randomBase62(10).toLowerCase()}`;
  const admin = await mysql.createConnection({ uri: base });
  try {
    await admin.query(`CREATE DATABASE \`${name}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
  } finally {
    await admin.end();
  }
  const url = `${base}${name}`;
  await applyMigrations(url);
  const handle = createDatabase(url, { connectionLimit: 5 });
  return {
    name,
    url,
    db: handle.db,
    pool: handle.pool,
    async drop() {
      await handle.close();
      const connection = await mysql.createConnection({ uri: base });
      try {
        await connection.query(`DROP DATABASE IF EXISTS \`${name}\``);
      } finally {
        await connection.end();
      }
    },
  };
}
