import { mkdtemp, readdir, rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { randomUUID } from 'node:crypto';
import request from 'supertest';
import { writeWav } from '@shared/dsp';
import type { Permission } from '@shared/schemas/permissions';
import { startJobRunner, type JobRunner } from '@server/jobs/job-runner';
import { bearer, createApiKey, signUp, type SignedUp } from '../support/actors';
import { createTestContext, type TestContext } from '../support/test-app';

export const RIG_SCOPES: Permission[] = ['captures:read', 'captures:write', 'analyses:read', 'analyses:write'];

export interface MeasureContext {
  context: TestContext;
  owner: SignedUp;
  key: string;
  blobDir: string;
  runner: JobRunner | null;
  api: () => ReturnType<typeof request>;
  close(): Promise<void>;
}

/** A test app over its own database and blob folder, an owner with a rig API key, and (optionally) a job runner. */
export async function measureContext(options: { runJobs?: boolean; leaseSeconds?: number } = {}): Promise<MeasureContext> {
  const blobDir = await mkdtemp(path.join(os.tmpdir(), 'swl-blobs-'));
  const context = await createTestContext({
    config: { blobDir, jobs: { engineThreads: 1, leaseSeconds: options.leaseSeconds ?? 30, maxAttempts: 3, runWorkers: true } },
  });
  const owner = await signUp(context);
  const { secret } = await createApiKey(owner.agent, RIG_SCOPES, { name: 'KB-65 line 2 rig' });
  const runner = options.runJobs === false ? null : startJobRunner(context.deps, { threads: 1, pollMs: 50 });
  return {
    context,
    owner,
    key: secret,
    blobDir,
    runner,
    api: () => request(context.app),
    async close() {
      await runner?.stop();
      await context.close();
      await rm(blobDir, { recursive: true, force: true });
    },
  };
}

export const idempotencyKey = () => ({ 'Idempotency-Key': randomUUID() });

export function wav(channels: Float64Array[], sampleRateHz = 48_000, encoding: 'float32' | 'pcm24' = 'float32'): Buffer {
  const bytes = writeWav({ sampleRateHz, channels, encoding });
  return Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength);
}

/** Files in the blob folder (blobs and temp files), to prove a refused upload left nothing. */
export async function blobFiles(blobDir: string): Promise<string[]> {
  const out: string[] = [];
  async function walk(dir: string) {
    for (const entry of await readdir(dir, { withFileTypes: true }).catch(() => [])) {
      const full = path.join(dir, entry.name);
      if (entry.isDirectory()) await walk(full);
      else out.push(path.relative(blobDir, full));
    }
  }
  await walk(blobDir);
  return out.sort();
}

/** Direct-form I biquad, y[n] = (b0 x[n] + b1 x[n−1] + b2 x[n−2] − a1 y[n−1] − a2 y[n−2]) / a0. */
export function biquadFilter(x: Float64Array, b: [number, number, number], a: [number, number, number]): Float64Array {
  const y = new Float64Array(x.length);
  let x1 = 0, x2 = 0, y1 = 0, y2 = 0;
  for (let n = 0; n < x.length; n++) {
    const v = (b[0] * x[n] + b[1] * x1 + b[2] * x2 - a[1] * y1 - a[2] * y2) / a[0];
    x2 = x1; x1 = x[n]; y2 = y1; y1 = v;
    y[n] = v;
  }
  return y;
}

/**
 * Peaking EQ from R. Bristow-Johnson, "Cookbook formulae for audio EQ biquad filter coefficients":
 * A = 10^(G/40), w0 = 2π f0/fs, α = sin(w0)/(2Q); b = [1+αA, −2cos w0, 1−αA], a = [1+α/A, −2cos w0, 1−α/A].
 */
export function rbjPeakingCoefficients(f0Hz: number, gainDb: number, q: number, fs: number) {
  const A = 10 ** (gainDb / 40);
  const w0 = (2 * Math.PI * f0Hz) / fs;
  const alpha = Math.sin(w0) / (2 * q);
  return { b: [1 + alpha * A, -2 * Math.cos(w0), 1 - alpha * A] as [number, number, number], a: [1 + alpha / A, -2 * Math.cos(w0), 1 - alpha / A] as [number, number, number] };
}

/** |H(e^{jw})| in dB of a biquad, evaluated directly from its coefficients. */
export function biquadMagnitudeDb(b: number[], a: number[], frequencyHz: number, fs: number): number {
  const w = (2 * Math.PI * frequencyHz) / fs;
  const evalPoly = (c: number[]) => {
    const re = c[0] + c[1] * Math.cos(w) + c[2] * Math.cos(2 * w);
    const im = -(c[1] * Math.sin(w) + c[2] * Math.sin(2 * w));
    return Math.hypot(re, im);
  };
  return 20 * Math.log10(evalPoly(b) / evalPoly(a));
}

export const auth = (key: string) => bearer(key);
