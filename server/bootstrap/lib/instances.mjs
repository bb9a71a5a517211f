import { randomBytes } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { dataRoot } from './paths.mjs';
import { databaseUrl, ensureDatabaseUser, ensureInstance } from './mariadb.mjs';

/** The development database `npm start` uses. Fixed port so a SQL client can be pointed at it. */
export const DEV_DATABASE = {
  dir: path.join(dataRoot, 'mariadb'),
  port: Number(process.env.SWEEPLINE_MARIADB_PORT ?? 3407),
  database: 'sweepline',
  user: 'sweepline',
  password: 'sweepline-local-dev',
};

/** A separate instance for tests, so `npm test` never touches (or waits for) the development data. */
export const TEST_DATABASE = {
  dir: path.join(dataRoot, 'mariadb-test'),
  port: Number(process.env.SWEEPLINE_TEST_MARIADB_PORT ?? 3408),
  user: 'sweepline_test',
  password: 'sweepline-local-test',
  /** Every test database is named swltest_<pid>_<random>; the test user may create and drop those only. */
  databasePattern: 'swltest%',
};

export async function startDevDatabase() {
  const instance = await ensureInstance({ dir: DEV_DATABASE.dir, port: DEV_DATABASE.port });
  ensureDatabaseUser(instance, {
    user: DEV_DATABASE.user,
    password: DEV_DATABASE.password,
    database: DEV_DATABASE.database,
  });
  return { instance, url: databaseUrl({ ...DEV_DATABASE, port: instance.port }) };
}

/** Returns the server URL without a database; tests create their own databases under it. */
export async function startTestDatabaseServer() {
  const instance = await ensureInstance({ dir: TEST_DATABASE.dir, port: TEST_DATABASE.port, anyPortIfBusy: true });
  ensureDatabaseUser(instance, {
    user: TEST_DATABASE.user,
    password: TEST_DATABASE.password,
    grantOn: TEST_DATABASE.databasePattern,
  });
  return { instance, url: databaseUrl({ ...TEST_DATABASE, port: instance.port }) };
}

const sleep = (ms) => new Promise((resolve) => setTimeout(resolve, ms));

function processAlive(pid) {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
}

/** Serialises start/stop decisions of concurrent test runs (mkdir is atomic). */
async function withLifecycleLock(work) {
  const lock = path.join(TEST_DATABASE.dir, 'lifecycle.lock');
  fs.mkdirSync(TEST_DATABASE.dir, { recursive: true });
  for (;;) {
    try {
      fs.mkdirSync(lock);
      break;
    } catch {
      const ageMs = Date.now() - (fs.statSync(lock, { throwIfNoEntry: false })?.mtimeMs ?? Date.now());
      if (ageMs > 120_000) fs.rmSync(lock, { recursive: true, force: true });
      else await sleep(100);
    }
  }
  try {
    return await work();
  } finally {
    fs.rmSync(lock, { recursive: true, force: true });
  }
}

function liveLeases(leaseDir) {
  if (!fs.existsSync(leaseDir)) return [];
  return fs.readdirSync(leaseDir).filter((name) => {
    const pid = Number.parseInt(name, 10);
    if (Number.isInteger(pid) && processAlive(pid)) return true;
    fs.rmSync(path.join(leaseDir, name), { force: true });
    return false;
  });
}

/**
 * Test runs may overlap (`npm test` while a single file runs in another terminal). Each run holds a lease on
 * the test MariaDB; the last run to let go stops it, so no database outlives the tests.
 * Returns { url, port, release() }.
 */
export async function acquireTestDatabaseServer() {
  const leaseDir = path.join(TEST_DATABASE.dir, 'leases');
  return withLifecycleLock(async () => {
    const { instance, url } = await startTestDatabaseServer();
    fs.mkdirSync(leaseDir, { recursive: true });
    const lease = path.join(leaseDir, `${process.pid}-${randomBytes(4).toString('hex')}`);
    fs.writeFileSync(lease, '');
    return {
      url,
      port: instance.port,
      runSql: instance.runSql,
      release: () =>
        withLifecycleLock(async () => {
          fs.rmSync(lease, { force: true });
          if (liveLeases(leaseDir).length === 0) await instance.stop();
        }),
    };
  });
}
