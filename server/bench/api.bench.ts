import { spawn } from 'node:child_process';
import net from 'node:net';
import { randomUUID } from 'node:crypto';
import { mkdtemp, rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import mysql from 'mysql2/promise';
import { designSynchronizedSweep, renderSweep, writeWav } from '@shared/dsp';
import { createDatabase } from '@server/db/client';
import { applyMigrations } from '@server/db/migrate';
import { setOrganisationPlan } from '@server/modules/usage/organisation-plan.service';
import { systemClock } from '@server/lib/clock';
import { createLogger } from '@server/lib/logger';
import { loadConfig } from '@server/config/env';
import { acquireTestDatabaseServer } from '../bootstrap/lib/instances.mjs';

/**
 * `npm run bench:api`: the server (own database, own blob folder) on loopback, RIGS simulated rigs each posting a
 * 2 s, 48 kHz sweep capture with its analysis (multipart, Prefer: wait=30) for SECONDS seconds. Bounded in count
 * and time; stops by itself. Env: BENCH_RIGS (32), BENCH_SECONDS (60).
 */
const RIGS = Number(process.env.BENCH_RIGS ?? 32);
const SECONDS = Number(process.env.BENCH_SECONDS ?? 60);
const SESSION_SECRET = 'sweepline-bench-session-secret-0123456789abcdef';

const percentile = (sorted: number[], p: number) => (sorted.length ? sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))] : NaN);

async function main() {
  const lease = await acquireTestDatabaseServer();
  const name = `swltest_${process.pid}_bench`;
  const admin = await mysql.createConnection({ uri: lease.url });
  await admin.query(`CREATE DATABASE \`${name}\``);
  await admin.end();
  const databaseUrl = `${lease.url}${name}`;
  await applyMigrations(databaseUrl);
  // A free loopback port, so the server can run with NODE_ENV=production (its PUBLIC_ORIGIN must be known).
  const freePort = await new Promise<number>((resolve) => {
    const probe = net.createServer().listen(0, '127.0.0.1', () => {
      const { port } = probe.address() as net.AddressInfo;
      probe.close(() => resolve(port));
    });
  });
  const blobDir = await mkdtemp(path.join(os.tmpdir(), 'swl-bench-blobs-'));
  const server = spawn(process.execPath, ['--import', 'tsx', 'server/bench/api-bench-server.ts'], {
    // Production mode: no per-response schema check, as deployed.
    env: {
      ...process.env,
      NODE_ENV: 'production',
      LOG_LEVEL: 'error',
      DATABASE_URL: databaseUrl,
      SESSION_SECRET,
      PUBLIC_ORIGIN: `http://127.0.0.1:${freePort}`,
      SWEEPLINE_PORT: String(freePort),
      SWEEPLINE_SEED_DEMO: 'false',
      SWEEPLINE_BLOB_DIR: blobDir,
      SWEEPLINE_LOOP_DELAY_REPORT: '1',
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  const loopLines: Array<{ final: boolean; p99Ms: number; maxMs: number; rssBytes: number; peakRssBytes: number }> = [];
  server.stderr!.on('data', (chunk: Buffer) => {
    for (const line of chunk.toString().split('\n')) {
      if (line.startsWith('loop-delay ')) loopLines.push(JSON.parse(line.slice(11)));
      else if (line.trim()) process.stderr.write(`[server] ${line}\n`);
    }
  });
  const ready = await new Promise<string>((resolve) => server.stdout!.on('data', (chunk: Buffer) => { const m = /listening (\d+) threads=(\d+)/.exec(chunk.toString()); if (m) resolve(`${m[1]} ${m[2]}`); }));
  const [port, threads] = ready.split(' ');
  const base = `http://127.0.0.1:${port}`;

  // An organisation with room for the run: sign up, a rig key, a plan with large quotas.
  const signUp = await fetch(`${base}/v1/auth/sign-up`, { method: 'POST', headers: { 'content-type': 'application/json', origin: base }, body: JSON.stringify({ email: `bench.${Date.now()}@kestrelbay.example`, password: 'kb65-bench-password', displayName: 'Bench Rig', organisationName: 'Kestrel Bay Acoustics' }) });
  const session = (await signUp.json()) as { activeOrganisation: { id: string } };
  const cookie = signUp.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');
  // The plan is set before the first rate-limited request, so no process caches the free plan's limits.
  const db = createDatabase(databaseUrl, { connectionLimit: 2 });
  const config = { ...loadConfig({ NODE_ENV: 'test', SESSION_SECRET, DATABASE_URL: databaseUrl }) };
  await setOrganisationPlan({ db: db.db, clock: systemClock, config, logger: createLogger('silent') } as never, session.activeOrganisation.id, {
    planId: 'plant',
    limitOverrides: { analysesPerMonth: 10_000_000, audioMinutesPerMonth: 10_000_000, requestsPerMinute: 10_000_000, storageBytes: 1e13 },
  });
  await db.close();
  const keyResponse = await fetch(`${base}/v1/api-keys`, { method: 'POST', headers: { 'content-type': 'application/json', origin: base, cookie, 'idempotency-key': randomUUID() }, body: JSON.stringify({ name: 'bench rigs', scopes: ['captures:write', 'analyses:write', 'analyses:read'] }) });
  const { secret } = (await keyResponse.json()) as { secret: string };

  const parameters = { startHz: 20, stopHz: 20_000, approximateDurationSeconds: 2, sampleRateHz: 48_000, levelDbfs: -12, trailingSilenceSeconds: 0.3 };
  const auth = { authorization: `Bearer ${secret}` };
  const stimulus = (await (await fetch(`${base}/v1/stimuli`, { method: 'POST', headers: { ...auth, 'content-type': 'application/json', 'idempotency-key': randomUUID() }, body: JSON.stringify({ type: 'sweep', parameters }) })).json()) as { id: string };
  const bytes = writeWav({ sampleRateHz: 48_000, channels: [renderSweep(designSynchronizedSweep(parameters)).map((x) => 0.8 * x)], encoding: 'float32' });
  const analysis = JSON.stringify({ kind: 'frequency_response', stimulusId: stimulus.id, dut: { model: 'KB-65 woofer', serial: 'KB65-24-000123' } });

  const latencies: number[] = [];
  const errors: string[] = [];
  const started = performance.now();
  const deadline = started + SECONDS * 1000;
  const rig = async () => {
    while (performance.now() < deadline && latencies.length + errors.length < 100_000) {
      const form = new FormData();
      form.set('analysis', analysis);
      form.set('file', new Blob([bytes as Uint8Array<ArrayBuffer>], { type: 'audio/wav' }), 'kb65-24-000123.wav');
      const t0 = performance.now();
      try {
        const response = await fetch(`${base}/v1/analyses`, { method: 'POST', headers: { ...auth, prefer: 'wait=30', 'idempotency-key': randomUUID() }, body: form });
        const body = (await response.json()) as { status?: string; code?: string };
        if (response.status === 200 && body.status === 'succeeded') latencies.push(performance.now() - t0);
        else errors.push(`${response.status} ${body.status ?? body.code}`);
      } catch (error) {
        errors.push((error as Error).message);
      }
    }
  };
  await Promise.all(Array.from({ length: RIGS }, rig));
  const elapsedSeconds = (performance.now() - started) / 1000;
  server.kill('SIGTERM');
  await new Promise((resolve) => server.once('exit', resolve));
  const admin2 = await mysql.createConnection({ uri: lease.url });
  await admin2.query(`DROP DATABASE IF EXISTS \`${name}\``);
  await admin2.end();
  await rm(blobDir, { recursive: true, force: true });
  await lease.release();

  const sorted = [...latencies].sort((a, b) => a - b);
  const final = loopLines.find((line) => line.final) ?? loopLines.at(-1);
  const first = loopLines[0];
  const mb = (bytes: number | undefined) => (bytes === undefined ? 'n/a' : `${(bytes / 1e6).toFixed(0)} MB`);
  const rows = [
    ['rigs / duration / engine threads', `${RIGS} / ${elapsedSeconds.toFixed(1)} s / ${threads}`, ''],
    ['analyses completed', String(latencies.length), ''],
    ['throughput', `${(latencies.length / elapsedSeconds).toFixed(2)} analyses/s`, 'target ≥ 15 /s'],
    ['latency p50', `${percentile(sorted, 50).toFixed(0)} ms`, ''],
    ['latency p99', `${percentile(sorted, 99).toFixed(0)} ms`, 'target < 2000 ms'],
    ['event-loop delay p99 (server)', `${final ? final.p99Ms.toFixed(1) : 'n/a'} ms (max ${final ? final.maxMs.toFixed(0) : 'n/a'} ms)`, 'target < 50 ms'],
    ['errors', `${errors.length}${errors.length ? ` (${[...new Set(errors)].slice(0, 3).join('; ')})` : ''}`, 'target 0'],
    ['server RSS first report / end / peak', `${mb(first?.rssBytes)} / ${mb(final?.rssBytes)} / ${mb(final?.peakRssBytes)}`, 'target: no growth'],
  ];
  process.stdout.write(`\nSweepline API benchmark (upload + frequency_response analysis + result, Prefer: wait)\n`);
  for (const [label, value, target] of rows) process.stdout.write(`  ${label.padEnd(38)} ${value.padEnd(34)} ${target}\n`);
}

main().catch((error: unknown) => {
  process.stderr.write(`benchmark failed: ${error instanceof Error ? error.stack : String(error)}\n`);
  process.exit(1);
});
