import { spawn, type ChildProcess } from 'node:child_process';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { designSynchronizedSweep, renderSweep } from '@shared/dsp';
import { analyses } from '@server/db/tables';
import { setOrganisationPlan } from '@server/modules/usage/organisation-plan.service';
import { auth, idempotencyKey, measureContext, wav, type MeasureContext } from './analyses-fixtures';

let m: MeasureContext;
const children: ChildProcess[] = [];
beforeAll(async () => {
  m = await measureContext({ runJobs: false });
});
afterAll(async () => {
  for (const child of children) if (child.exitCode === null) child.kill('SIGKILL');
  await m?.close();
});

function startWorker(): Promise<{ child: ChildProcess; owner: string; done: string[] }> {
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/jobs/worker-process.ts'], {
    env: {
      ...process.env,
      NODE_ENV: 'test',
      LOG_LEVEL: 'silent',
      DATABASE_URL: m.context.database.url,
      SWEEPLINE_BLOB_DIR: m.blobDir,
      SWEEPLINE_JOB_LEASE_SECONDS: '2',
      SWEEPLINE_ENGINE_THREADS: '1',
      SESSION_SECRET: 'sweepline-test-session-secret-0123456789abcdef',
    },
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  children.push(child);
  const done: string[] = [];
  return new Promise((resolve, reject) => {
    let buffer = '';
    child.stdout!.on('data', (chunk: Buffer) => {
      buffer += chunk.toString();
      let newline;
      while ((newline = buffer.indexOf('\n')) >= 0) {
        const line = buffer.slice(0, newline);
        buffer = buffer.slice(newline + 1);
        if (line.startsWith('ready ')) resolve({ child, owner: line.slice(6), done });
        if (line.startsWith('done ')) done.push(line.split(' ')[1]);
      }
    });
    child.once('exit', (code) => reject(new Error(`worker exited with ${code}`)));
  });
}

const fs = 48_000;
async function queueSweepAnalyses(count: number, seconds: number) {
  const parameters = { startHz: 20, stopHz: 20_000, approximateDurationSeconds: seconds, sampleRateHz: fs, levelDbfs: -12, trailingSilenceSeconds: 0.5 };
  const stimulus = await m.api().post('/v1/stimuli').set(auth(m.key)).set(idempotencyKey()).send({ type: 'sweep', parameters });
  const sweep = renderSweep(designSynchronizedSweep(parameters));
  const capture = await m.api().post('/v1/captures').set(auth(m.key)).set(idempotencyKey()).attach('file', wav([sweep]), 'sweep.wav');
  expect(capture.status, JSON.stringify(capture.body)).toBe(201);
  const ids: string[] = [];
  for (let i = 0; i < count; i++) {
    const created = await m.api().post('/v1/analyses').set(auth(m.key)).set(idempotencyKey())
      .send({ kind: 'response_and_distortion', captureId: capture.body.id, stimulusId: stimulus.body.id });
    expect(created.status, JSON.stringify(created.body)).toBe(202);
    ids.push(created.body.id);
  }
  return ids;
}

async function waitUntil<T>(read: () => Promise<T>, ok: (value: T) => boolean, timeoutMs: number): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const value = await read();
    if (ok(value) || Date.now() > deadline) return value;
    await new Promise((resolve) => setTimeout(resolve, 20));
  }
}

const rows = () => m.context.deps.db.select({ id: analyses.id, status: analyses.status, leaseOwner: analyses.leaseOwner, attempts: analyses.attempts }).from(analyses);

describe('jobs shared by several processes', () => {
  it('two worker processes share one queue: each job runs exactly once', async () => {
    await setOrganisationPlan(m.context.deps, m.owner.organisationId, { planId: 'plant' });
    const ids = await queueSweepAnalyses(6, 1);
    const [a, b] = await Promise.all([startWorker(), startWorker()]);
    const finished = await waitUntil(rows, (all) => ids.every((id) => all.find((row) => row.id === id)?.status === 'succeeded'), 60_000);
    // A worker prints "done" after its commit, so the last line can arrive just after the rows say succeeded.
    await waitUntil(async () => a.done.length + b.done.length, (count) => count >= ids.length, 10_000);
    expect(finished.filter((row) => ids.includes(row.id)).map((row) => row.status)).toEqual(ids.map(() => 'succeeded'));
    expect([...a.done, ...b.done].sort()).toEqual([...ids].sort());
    expect(new Set([...a.done, ...b.done]).size).toBe(ids.length);
    a.child.kill('SIGTERM');
    b.child.kill('SIGTERM');
  }, 90_000);

  it('a worker killed mid-job (SIGKILL): the job finishes on another after the lease expires', async () => {
    // A 30 s capture keeps the job running long enough (hundreds of ms) for the poll below to see it mid-job.
    await setOrganisationPlan(m.context.deps, m.owner.organisationId, { planId: 'plant' });
    const [id] = await queueSweepAnalyses(1, 30);
    const victim = await startWorker();
    const running = await waitUntil(
      rows,
      (all) => all.some((row) => row.id === id && row.leaseOwner === victim.owner && row.status === 'running'),
      30_000,
    );
    expect(running.find((row) => row.id === id)?.status).toBe('running');
    victim.child.kill('SIGKILL');
    const survivor = await startWorker();
    const done = await waitUntil(rows, (all) => all.find((row) => row.id === id)?.status === 'succeeded', 60_000);
    const row = done.find((candidate) => candidate.id === id)!;
    expect(row.status).toBe('succeeded');
    expect(row.attempts).toBe(2);
    await waitUntil(async () => survivor.done, (lines) => lines.includes(id), 10_000);
    expect(survivor.done).toContain(id);
    const [stored] = await m.context.deps.db.select().from(analyses).where(eq(analyses.id, id));
    expect(stored.resultJson).toContain('"kind":"response_and_distortion"');
    survivor.child.kill('SIGTERM');
  }, 90_000);

  it('Prefer: wait is answered when a worker in another process finishes the job, several waiting requests at once', async () => {
    // No runner in this process: the waiting requests learn of the finish only from the shared status poll.
    await setOrganisationPlan(m.context.deps, m.owner.organisationId, { planId: 'plant', limitOverrides: { requestsPerMinute: 100_000 } });
    const parameters = { startHz: 20, stopHz: 20_000, approximateDurationSeconds: 1, sampleRateHz: fs, levelDbfs: -12, trailingSilenceSeconds: 0.5 };
    const stimulus = await m.api().post('/v1/stimuli').set(auth(m.key)).set(idempotencyKey()).send({ type: 'sweep', parameters });
    const sweep = renderSweep(designSynchronizedSweep(parameters));
    const worker = await startWorker();
    const answers = await Promise.all(
      [0, 1, 2].map(() =>
        m.api().post('/v1/analyses').set(auth(m.key)).set(idempotencyKey()).set('Prefer', 'wait=50')
          .field('analysis', JSON.stringify({ kind: 'frequency_response', stimulusId: stimulus.body.id }))
          .attach('file', wav([sweep]), 'sweep.wav'),
      ),
    );
    for (const answer of answers) {
      expect(answer.status, JSON.stringify(answer.body).slice(0, 300)).toBe(200);
      expect(answer.body.status).toBe('succeeded');
      expect(answer.headers['preference-applied']).toBe('wait=50');
      expect(answer.body.result.kind).toBe('frequency_response');
    }
    await waitUntil(async () => worker.done, (lines) => answers.every((answer) => lines.includes(answer.body.id)), 10_000);
    expect(answers.every((answer) => worker.done.includes(answer.body.id))).toBe(true);
    worker.child.kill('SIGTERM');
  }, 90_000);
});
