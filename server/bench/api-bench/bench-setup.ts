import { spawn, type ChildProcess } from 'node:child_process';
import { randomUUID } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { mkdtemp, rm } from 'node:fs/promises';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import mysql from 'mysql2/promise';
import { loadConfig } from '@server/config/env';
import { createDatabase } from '@server/db/client';
import { applyMigrations } from '@server/db/migrate';
import { systemClock } from '@server/lib/clock';
import { createLogger } from '@server/lib/logger';
import { setOrganisationPlan } from '@server/modules/usage/organisation-plan.service';
import { acquireTestDatabaseServer } from '../../bootstrap/lib/instances.mjs';

const SESSION_SECRET = 'sweepline-bench-session-secret-0123456789abcdef';

/** One line of the server's periodic report (server/jobs/loop-delay-report.ts plus the bench server's fields). */
export interface ServerReport {
  final: boolean;
  elapsedSeconds: number;
  p99Ms: number;
  maxMs: number;
  intervalP99Ms: number;
  intervalMaxMs: number;
  rssBytes: number;
  peakRssBytes: number;
  heapUsedBytes: number;
  externalBytes: number;
  cpuSeconds: number;
  queries: number;
  queryKinds: Record<string, number>;
  engine: { completed: number; queued: number; runTimeP50Ms: number; runTimeP99Ms: number; waitTimeP50Ms: number; utilization: number };
}

/** The server's memory right after a full garbage collection (its SIGUSR2 answer). */
export interface SettledMemory {
  rssBytes: number;
  heapUsedBytes: number;
  externalBytes: number;
  arrayBuffersBytes: number;
}

export interface BenchServer {
  base: string;
  pid: number;
  engineThreads: number;
  jobConcurrency: number;
  databaseConnections: number;
  validateResponses: boolean;
  nodeEnv: string;
  reports: ServerReport[];
  onReport(listener: (report: ServerReport) => void): void;
  /** Asks the server for a full GC and the memory still in use afterwards. */
  settledMemory(): Promise<SettledMemory>;
  stop(): Promise<void>;
}

async function freeLoopbackPort(): Promise<number> {
  return new Promise<number>((resolve) => {
    const probe = net.createServer().listen(0, '127.0.0.1', () => {
      const { port } = probe.address() as net.AddressInfo;
      probe.close(() => resolve(port));
    });
  });
}

/** A fresh database on the shared test MariaDB, and a function that drops it and releases the lease. */
export async function createBenchDatabase(): Promise<{ url: string; serverPid: number | null; drop(): Promise<void> }> {
  const lease = await acquireTestDatabaseServer();
  const name = `swltest_${process.pid}_bench`;
  const admin = await mysql.createConnection({ uri: lease.url });
  await admin.query(`CREATE DATABASE \`${name}\``);
  // The MariaDB server's pid, to report its CPU (it is shared with other test runs, so that is an upper bound).
  const [[{ pidFile }]] = (await admin.query('SELECT @@pid_file AS pidFile')) as unknown as [[{ pidFile: string }]];
  await admin.end();
  let serverPid: number | null = null;
  try {
    serverPid = Number.parseInt(readFileSync(pidFile, 'utf8').trim(), 10) || null;
  } catch {
    serverPid = null;
  }
  const url = `${lease.url}${name}`;
  await applyMigrations(url);
  return {
    url,
    serverPid,
    drop: async () => {
      const again = await mysql.createConnection({ uri: lease.url });
      await again.query(`DROP DATABASE IF EXISTS \`${name}\``);
      await again.end();
      await lease.release();
    },
  };
}

/**
 * Starts server/bench/api-bench-server.ts as production runs it: NODE_ENV=production (so responses are not
 * checked against their schemas), its own blob folder, LOG_LEVEL=error. `nodeArgs` (e.g. --cpu-prof) go first.
 */
export async function startBenchServer(databaseUrl: string, options: { nodeArgs: string[]; env: Record<string, string> }): Promise<BenchServer> {
  const port = await freeLoopbackPort();
  const blobDir = await mkdtemp(path.join(os.tmpdir(), 'swl-bench-blobs-'));
  const child: ChildProcess = spawn(process.execPath, ['--expose-gc', ...options.nodeArgs, '--import', 'tsx', 'server/bench/api-bench-server.ts'], {
    env: {
      ...process.env,
      NODE_ENV: 'production',
      LOG_LEVEL: 'error',
      DATABASE_URL: databaseUrl,
      SESSION_SECRET,
      PUBLIC_ORIGIN: `http://127.0.0.1:${port}`,
      SWEEPLINE_PORT: String(port),
      SWEEPLINE_SEED_DEMO: 'false',
      SWEEPLINE_BLOB_DIR: blobDir,
      SWEEPLINE_LOOP_DELAY_REPORT: '1',
      ...options.env,
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  const reports: ServerReport[] = [];
  const listeners: Array<(report: ServerReport) => void> = [];
  const settledWaiters: Array<(memory: SettledMemory) => void> = [];
  let pending = '';
  child.stderr!.on('data', (chunk: Buffer) => {
    pending += chunk.toString();
    const lines = pending.split('\n');
    pending = lines.pop() ?? '';
    for (const line of lines) {
      if (line.startsWith('loop-delay ')) {
        const report = JSON.parse(line.slice(11)) as ServerReport;
        reports.push(report);
        listeners.forEach((listener) => listener(report));
      } else if (line.startsWith('memory-settled ')) {
        const memory = JSON.parse(line.slice(15)) as SettledMemory;
        settledWaiters.splice(0).forEach((resolve) => resolve(memory));
      } else if (line.trim()) process.stderr.write(`[server] ${line}\n`);
    }
  });
  const ready = await new Promise<RegExpExecArray>((resolve, reject) => {
    child.once('exit', (code) => reject(new Error(`the bench server exited (${code}) before listening`)));
    child.stdout!.on('data', (chunk: Buffer) => {
      const match = /listening (\d+) threads=(\d+) concurrency=(\d+) connections=(\d+) validateResponses=(\w+) nodeEnv=(\w+)/.exec(chunk.toString());
      if (match) resolve(match);
    });
  });
  let stopped: Promise<void> | undefined;
  const stopChild = async () => {
    if (child.exitCode === null && child.signalCode === null) {
      const exited = new Promise((resolve) => child.once('exit', resolve));
      child.kill('SIGTERM');
      await exited;
    }
    await rm(blobDir, { recursive: true, force: true });
  };
  return {
    base: `http://127.0.0.1:${ready[1]}`,
    pid: child.pid!,
    engineThreads: Number(ready[2]),
    jobConcurrency: Number(ready[3]),
    databaseConnections: Number(ready[4]),
    validateResponses: ready[5] === 'true',
    nodeEnv: ready[6],
    reports,
    onReport: (listener) => listeners.push(listener),
    settledMemory: () =>
      new Promise<SettledMemory>((resolve) => {
        settledWaiters.push(resolve);
        child.kill('SIGUSR2');
      }),
    stop: () => (stopped ??= stopChild()),
  };
}

/** An organisation with room for the run (large quotas, no practical rate limit), a rig key and a stored sweep. */
export async function prepareOrganisation(base: string, databaseUrl: string, sweep: Record<string, number>): Promise<{ secret: string; stimulusId: string }> {
  const signUp = await fetch(`${base}/v1/auth/sign-up`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', origin: base },
    body: JSON.stringify({ email: `bench.${Date.now()}@kestrelbay.example`, password: 'kb65-bench-password', displayName: 'Bench Rig', organisationName: 'Kestrel Bay Acoustics' }),
  });
  const session = (await signUp.json()) as { activeOrganisation: { id: string } };
  const cookie = signUp.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');
  // The plan is set before the first rate-limited request, so no process caches the free plan's limits.
  const db = createDatabase(databaseUrl, { connectionLimit: 2 });
  const config = loadConfig({ NODE_ENV: 'test', SESSION_SECRET, DATABASE_URL: databaseUrl });
  await setOrganisationPlan({ db: db.db, clock: systemClock, config, logger: createLogger('silent') } as never, session.activeOrganisation.id, {
    planId: 'plant',
    limitOverrides: { analysesPerMonth: 10_000_000, audioMinutesPerMonth: 10_000_000, requestsPerMinute: 10_000_000, storageBytes: 1e13 },
  });
  await db.close();
  const keyResponse = await fetch(`${base}/v1/api-keys`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', origin: base, cookie, 'idempotency-key': randomUUID() },
    body: JSON.stringify({ name: 'bench rigs', scopes: ['captures:write', 'analyses:write', 'analyses:read'] }),
  });
  const { secret } = (await keyResponse.json()) as { secret: string };
  const stimulus = (await (
    await fetch(`${base}/v1/stimuli`, {
      method: 'POST',
      headers: { authorization: `Bearer ${secret}`, 'content-type': 'application/json', 'idempotency-key': randomUUID() },
      body: JSON.stringify({ type: 'sweep', parameters: sweep }),
    })
  ).json()) as { id: string };
  return { secret, stimulusId: stimulus.id };
}
