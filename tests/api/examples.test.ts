import { execFile } from 'node:child_process';
import { once } from 'node:events';
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { promisify } from 'node:util';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { designSynchronizedSweep, renderSweep } from '@shared/dsp';
import { seedDemo } from '@server/db/seed/seed';
import { DEMO_API_KEY, DEMO_USERS } from '@server/db/seed/demo-scenario';
import { startJobRunner, type JobRunner } from '@server/jobs/job-runner';
import { biquadFilter, biquadMagnitudeDb, wav } from './analyses-fixtures';
import { browserAgent, createApiKey, type Agent } from '../support/actors';
import { createTestContext, type TestContext } from '../support/test-app';

/**
 * The rig examples in examples/ run as child processes against a live server on 127.0.0.1 with the demo
 * organisation and keys carrying the demo key's scopes, as a rig developer runs them against `npm start`. The
 * server drops the connection on the first answer to each creating POST, so every example must retry with the same
 * Idempotency-Key and still create exactly one stimulus, capture and analysis.
 */
const execFileAsync = promisify(execFile);
const CHILD_TIMEOUT_MS = 90_000;

// The sweep each example defines in its STIMULUS block (checked below against what the example created).
const SWEEP = { startHz: 20, stopHz: 20_000, approximateDurationSeconds: 2, sampleRateHz: 48_000, levelDbfs: -12 };
const fs = SWEEP.sampleRateHz;

// The DUT stand-in: an RBJ Audio EQ Cookbook low-pass, f0 = 2 kHz, Q = 1/√2 (a woofer's upper roll-off).
// LPF: w0 = 2π f0/fs, α = sin(w0)/(2Q), b = [(1−cos w0)/2, 1−cos w0, (1−cos w0)/2], a = [1+α, −2cos w0, 1−α].
function rbjLowPassCoefficients(f0Hz: number, q: number, sampleRateHz: number) {
  const w0 = (2 * Math.PI * f0Hz) / sampleRateHz;
  const alpha = Math.sin(w0) / (2 * q);
  const cos = Math.cos(w0);
  return { b: [(1 - cos) / 2, 1 - cos, (1 - cos) / 2] as [number, number, number], a: [1 + alpha, -2 * cos, 1 - alpha] as [number, number, number] };
}
const { b, a } = rbjLowPassCoefficients(2000, Math.SQRT1_2, fs);
const expectedLevelAt1kHzDb = biquadMagnitudeDb(b, a, 1000, fs);

// A static x + a2·x² before the filter: x² = (1 − cos 2θ)/2 gives a 2nd harmonic of a2·A/2 re the fundamental
// (trigonometric power identity), which the filter then weights by |H(2f0)|/|H(f0)|; no other order.
const SECOND_ORDER = 0.02;
const sweepAmplitude = 10 ** (SWEEP.levelDbfs / 20);
const expectedThdAt1kHzPercent = ((100 * SECOND_ORDER * sweepAmplitude) / 2) * 10 ** ((biquadMagnitudeDb(b, a, 2000, fs) - expectedLevelAt1kHzDb) / 20);

/** Where |H| falls to (level at 1 kHz − dropDb), by bisection on the filter's own closed-form magnitude. */
function expectedUpperEdgeHz(dropDb: number): number {
  let low = 1000;
  let high = 20_000;
  for (let i = 0; i < 60; i++) {
    const mid = Math.sqrt(low * high);
    if (biquadMagnitudeDb(b, a, mid, fs) > expectedLevelAt1kHzDb - dropDb) low = mid;
    else high = mid;
  }
  return Math.sqrt(low * high);
}

let context: TestContext;
let runner: JobRunner;
let server: http.Server;
let baseUrl: string;
let owner: Agent;
let workDir: string;
let capturePath: string;

/** Paths whose first answer (per example run) is cut off after the server has done the work. */
const FLAKY_PATHS = new Set(['/v1/stimuli', '/v1/captures', '/v1/analyses']);
let dropped = new Set<string>();
let droppedCount = 0;

beforeAll(async () => {
  workDir = await mkdtemp(join(tmpdir(), 'swl-examples-'));
  context = await createTestContext({
    config: { blobDir: join(workDir, 'blobs'), jobs: { engineThreads: 1, leaseSeconds: 30, maxAttempts: 3, runWorkers: true } },
  });
  const demo = await seedDemo(context.deps, [], { workspace: false });
  expect(demo.apiKeySecret).toBeTruthy();
  // The demo owner's console session reads what the examples created (its rate limit is not the rig key's).
  const ownerUser = DEMO_USERS.find((user) => user.role === 'owner')!;
  owner = browserAgent(context);
  const signedIn = await owner.post('/v1/auth/sign-in').send({ email: ownerUser.email, password: ownerUser.password });
  expect(signedIn.status, JSON.stringify(signedIn.body)).toBe(200);
  runner = startJobRunner(context.deps, { threads: 1, pollMs: 50 });

  server = http.createServer((req, res) => {
    const path = (req.url ?? '').split('?')[0];
    if (req.method === 'POST' && FLAKY_PATHS.has(path) && !dropped.has(path)) {
      dropped.add(path);
      // The handler runs to the end (and the idempotency record completes); only the answer is lost.
      res.writeHead = (() => {
        droppedCount++;
        req.socket.destroy();
        return res;
      }) as typeof res.writeHead;
    }
    context.app(req, res);
  });
  server.listen(0, '127.0.0.1');
  await once(server, 'listening');
  baseUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;

  // Measurement channel: the sweep through x + a2·x², then the low-pass; reference channel: the sweep (loopback).
  const sweep = renderSweep(designSynchronizedSweep(SWEEP));
  const measurement = biquadFilter(sweep.map((x) => x + SECOND_ORDER * x * x), b, a);
  capturePath = join(workDir, 'kb65-24-000123.wav');
  await writeFile(capturePath, wav([measurement, sweep], fs));
});

afterAll(async () => {
  server?.closeAllConnections();
  await new Promise<void>((resolve) => (server ? server.close(() => resolve()) : resolve()));
  await runner?.stop();
  await context?.close();
  if (workDir) await rm(workDir, { recursive: true, force: true });
});

async function count(path: string): Promise<number> {
  const response = await owner.get(`${path}?limit=100`);
  expect(response.status, JSON.stringify(response.body)).toBe(200);
  return (response.body as { data: unknown[] }).data.length;
}

/**
 * One example run with its own key carrying the demo key's scopes: six runs within a minute would otherwise
 * share one key's per-minute request limit.
 */
async function runExample(command: string, args: string[], waitSeconds: number) {
  const { secret: apiKey } = await createApiKey(owner, DEMO_API_KEY.scopes, { name: `KB-65 line 1 rig ${waitSeconds}` });
  dropped = new Set();
  droppedCount = 0;
  const before = { stimuli: await count('/v1/stimuli'), captures: await count('/v1/captures'), analyses: await count('/v1/analyses') };
  const result = await execFileAsync(command, [...args, 'run', capturePath], {
    cwd: workDir,
    timeout: CHILD_TIMEOUT_MS,
    env: { ...process.env, SWEEPLINE_BASE_URL: baseUrl, SWEEPLINE_API_KEY: apiKey, SWEEPLINE_STIMULUS_DIR: workDir, SWEEPLINE_WAIT_SECONDS: String(waitSeconds) },
  }).catch((error: { code?: number; stdout?: string; stderr?: string; message: string }) => {
    throw new Error(`${command} exited ${error.code}: ${error.message}\nstdout:\n${error.stdout}\nstderr:\n${error.stderr}`);
  });
  const stdout = result.stdout;
  const after = { stimuli: await count('/v1/stimuli'), captures: await count('/v1/captures'), analyses: await count('/v1/analyses') };
  return { stdout, stderr: result.stderr, before, after };
}

const parse = (stdout: string, pattern: RegExp) => {
  const match = pattern.exec(stdout);
  expect(match, `${pattern} in:\n${stdout}`).not.toBeNull();
  return match!;
};

const curlMissing = await execFileAsync('which', ['curl']).then(() => false, () => true);
if (curlMissing) process.stderr.write('[examples] curl not found: skipping the bash example (Debian: apt-get install curl)\n');

const examples = [
  { name: 'node examples/rig-loop.mjs', command: process.execPath, args: ['examples/rig-loop.mjs'], skip: false },
  { name: 'python3 examples/rig_loop.py', command: 'python3', args: ['examples/rig_loop.py'], skip: false },
  { name: 'bash examples/rig-loop.sh', command: 'bash', args: ['examples/rig-loop.sh'], skip: curlMissing },
];

// wait=10: the analysis POST answers 200 with the result; wait=0: it answers 202 and the example polls Location.
const waits = [
  { waitSeconds: 10, path: 'Prefer: wait=10, result in the answer' },
  { waitSeconds: 0, path: 'Prefer: wait=0, 202 then polling' },
];

describe('rig examples against a live server', () => {
  for (const example of examples) for (const { waitSeconds, path } of waits) {
    const title = `${example.name} (${path})${example.skip ? ' skipped: curl is not installed' : ''}`;
    it.skipIf(example.skip)(title, { timeout: 150_000 }, async () => {
      const args = example.args.map((arg) => join(process.cwd(), arg));
      const { stdout, stderr, before, after } = await runExample(example.command, args, waitSeconds);

      // Idempotency: three dropped answers were retried, and each creating request made exactly one object.
      expect(droppedCount).toBe(3);
      expect(stderr).toContain('same Idempotency-Key');
      expect(after.stimuli - before.stimuli).toBe(1);
      expect(after.captures - before.captures).toBe(1);
      expect(after.analyses - before.analyses).toBe(1);

      // The safety cautions come from the stimulus response.
      expect(stdout).toContain('SAFETY before playing the stimulus');
      expect(stdout).toMatch(/ear simulator|hearing/i);

      const analysisId = parse(stdout, /^analysis (ana_\w+) succeeded$/m)[1];
      if (waitSeconds === 0) expect(stdout).toMatch(new RegExp(`^  analysis ${analysisId}: (queued|running|succeeded)`, 'm'));
      else expect(stdout).not.toMatch(/^  analysis ana_\w+: /m);
      const analysis = (await owner.get(`/v1/analyses/${analysisId}`)).body;
      expect(analysis.status).toBe('succeeded');
      expect(analysis.kind).toBe('response_and_distortion');
      expect(analysis.dut).toEqual({ model: 'KB-65 woofer', serial: 'KB65-24-000123', lot: 'KB65-L24-07' });
      expect(analysis.request).toMatchObject({ channels: { measurement: 0, reference: 1 }, conditions: { distanceM: 1, driveVoltageVrms: 2.83 } });
      const capture = (await owner.get(`/v1/captures/${analysis.captureId}`)).body;
      expect(capture).toMatchObject({ filename: 'kb65-24-000123.wav', channelCount: 2 });
      const stimulus = (await owner.get(`/v1/stimuli/${analysis.stimulusId}`)).body;
      expect(stimulus.parameters).toMatchObject(SWEEP);

      // RBJ Audio EQ Cookbook low-pass: the printed reference level (1 kHz, re the loopback) and the upper −3 dB
      // point match the filter's closed-form |H(e^jw)|.
      const level = Number(parse(stdout, /reference level\s+(-?\d+\.\d{2}) dB/)[1]);
      expect(Math.abs(level - expectedLevelAt1kHzDb)).toBeLessThan(0.1);
      const upper = Number(parse(stdout, /-3 dB points\s+.*\.\. (\d+\.\d) Hz/)[1]);
      expect(Math.abs(upper / expectedUpperEdgeHz(3) - 1)).toBeLessThan(0.02);
      // Synchronized sweep harmonic separation (Novak et al., JAES 63(10) 2015): THD_F at 1 kHz is HD2 alone.
      const thd = Number(parse(stdout, /THD_F at reference\s+(?:<= )?(\d+\.\d+) % at 1000\.0 Hz/)[1]);
      expect(Math.abs(thd / expectedThdAt1kHzPercent - 1)).toBeLessThan(0.03);
      expect(stdout).toMatch(/verdict\s+none \(no tolerance mask\)/);
      expect(stdout).toContain('warning uncalibrated');
    });
  }
});
