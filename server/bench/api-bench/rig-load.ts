import { randomUUID } from 'node:crypto';
import { Pool } from 'undici';

/**
 * The simulated rigs: `rigs` loops, each posting the same multipart body (analysis JSON + WAV, built once) with
 * `Prefer: wait` and its own Idempotency-Key, one request after another, until the deadline. Kept lean because
 * it shares the machine's cores with the server: one keep-alive connection per rig (undici Pool), no per-request
 * body building, and only the status field of each answer is looked at.
 */
export interface RigLoadResult {
  /** Latencies of answers that were 200 with status succeeded, ms, by completion time (ms since start). */
  completions: Array<{ atMs: number; latencyMs: number; phases: RequestPhases | null }>;
  errors: string[];
  elapsedSeconds: number;
  cpuSeconds: number;
}

/**
 * Where one request's time went, ms, from the analysis's own timestamps (same machine, same clock): sent → row
 * created (upload received and checked), → claimed by a worker (queue), → finished (inputs, engine, result
 * write), → answer received (notification, response).
 */
export interface RequestPhases {
  uploadMs: number;
  queueMs: number;
  runMs: number;
  answerMs: number;
}

const BOUNDARY = '----sweepline-bench-4f1c2a9e';

/** multipart/form-data (RFC 7578) with the text part `analysis` and the file part `file`. */
export function multipartBody(analysisJson: string, wavBytes: Uint8Array, filename: string): Buffer {
  const head = Buffer.from(
    `--${BOUNDARY}\r\nContent-Disposition: form-data; name="analysis"\r\n\r\n${analysisJson}\r\n` +
      `--${BOUNDARY}\r\nContent-Disposition: form-data; name="file"; filename="${filename}"\r\nContent-Type: audio/wav\r\n\r\n`,
  );
  return Buffer.concat([head, wavBytes, Buffer.from(`\r\n--${BOUNDARY}--\r\n`)]);
}

const timestampOf = (text: string, field: string) => Date.parse(new RegExp(`"${field}":"([^"]+)"`).exec(text)?.[1] ?? '');

function phasesOf(text: string, sentMs: number, receivedMs: number): RequestPhases | null {
  const [created, started, finished] = ['createdAt', 'startedAt', 'finishedAt'].map((field) => timestampOf(text, field));
  if (![created, started, finished].every(Number.isFinite)) return null;
  const sent = performance.timeOrigin + sentMs;
  const received = performance.timeOrigin + receivedMs;
  return { uploadMs: created! - sent, queueMs: started! - created!, runMs: finished! - started!, answerMs: received - finished! };
}

export async function runRigLoad(options: { base: string; secret: string; body: Buffer; rigs: number; seconds: number; waitSeconds: number }): Promise<RigLoadResult> {
  const pool = new Pool(options.base, { connections: options.rigs, pipelining: 1, keepAliveTimeout: 60_000 });
  const headers = {
    authorization: `Bearer ${options.secret}`,
    'content-type': `multipart/form-data; boundary=${BOUNDARY}`,
    'content-length': String(options.body.length),
    prefer: `wait=${options.waitSeconds}`,
  };
  const completions: RigLoadResult['completions'] = [];
  const errors: string[] = [];
  const cpuStart = process.cpuUsage();
  const started = performance.now();
  const deadline = started + options.seconds * 1000;
  const rig = async () => {
    while (performance.now() < deadline) {
      const t0 = performance.now();
      try {
        const response = await pool.request({ method: 'POST', path: '/v1/analyses', headers: { ...headers, 'idempotency-key': randomUUID() }, body: options.body });
        const text = await response.body.text();
        // The status sits near the start of the analysis; no need to parse the whole result.
        const status = /"status":"(\w+)"/.exec(text)?.[1];
        const t1 = performance.now();
        if (response.statusCode === 200 && status === 'succeeded') completions.push({ atMs: t1 - started, latencyMs: t1 - t0, phases: phasesOf(text, t0, t1) });
        else errors.push(`${response.statusCode} ${status ?? /"code":"(\w+)"/.exec(text)?.[1] ?? ''} after ${((t1 - t0) / 1000).toFixed(0)} s`);
      } catch (error) {
        errors.push((error as Error).message);
      }
    }
  };
  await Promise.all(Array.from({ length: options.rigs }, rig));
  const elapsedSeconds = (performance.now() - started) / 1000;
  const cpu = process.cpuUsage(cpuStart);
  await pool.close();
  return { completions, errors, elapsedSeconds, cpuSeconds: (cpu.user + cpu.system) / 1e6 };
}
