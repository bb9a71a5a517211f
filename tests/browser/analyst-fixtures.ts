import { randomUUID } from 'node:crypto';
import type { APIRequestContext } from 'playwright-core';
import { designSynchronizedSweep, renderSweep, writeWav } from '@shared/dsp';

export const SAMPLE_RATE_HZ = 48_000;
export const SWEEP_PARAMETERS = { startHz: 20, stopHz: 20_000, approximateDurationSeconds: 2, sampleRateHz: SAMPLE_RATE_HZ, levelDbfs: -12, trailingSilenceSeconds: 0.5 };

/** Direct-form I biquad. */
function biquad(x: Float64Array, b: number[], a: number[]): Float64Array {
  const y = new Float64Array(x.length);
  let x1 = 0, x2 = 0, y1 = 0, y2 = 0;
  for (let n = 0; n < x.length; n++) {
    const v = (b[0] * x[n] + b[1] * x1 + b[2] * x2 - a[1] * y1 - a[2] * y2) / a[0];
    x2 = x1; x1 = x[n]; y2 = y1; y1 = v;
    y[n] = v;
  }
  return y;
}

/** RBJ Audio EQ Cookbook peaking EQ (R. Bristow-Johnson): A = 10^(G/40), α = sin(w0)/(2Q). */
function peaking(f0Hz: number, gainDb: number, q: number) {
  const A = 10 ** (gainDb / 40);
  const w0 = (2 * Math.PI * f0Hz) / SAMPLE_RATE_HZ;
  const alpha = Math.sin(w0) / (2 * q);
  return { b: [1 + alpha * A, -2 * Math.cos(w0), 1 - alpha * A], a: [1 + alpha / A, -2 * Math.cos(w0), 1 - alpha / A] };
}

/** A sweep capture of a unit: a memoryless polynomial (its harmonics) followed by a peaking filter (its response). */
export function unitCapture(filter: { f0Hz: number; gainDb: number; q: number } | null): Buffer {
  const sweep = renderSweep(designSynchronizedSweep(SWEEP_PARAMETERS));
  const bent = sweep.map((x) => x + 0.02 * x * x + 0.01 * x * x * x);
  const { b, a } = filter ? peaking(filter.f0Hz, filter.gainDb, filter.q) : { b: [1, 0, 0], a: [1, 0, 0] };
  const bytes = writeWav({ sampleRateHz: SAMPLE_RATE_HZ, channels: [biquad(bent, b, a)], encoding: 'float32' });
  return Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength);
}

/** JSON calls through the browser context's cookies (the signed-in console session), with the Origin the CSRF check wants. */
export function apiCalls(request: APIRequestContext, baseUrl: string) {
  const headers = () => ({ Origin: baseUrl, 'Idempotency-Key': randomUUID() });
  const check = async <T>(response: Awaited<ReturnType<APIRequestContext['post']>>, expected: number[]): Promise<T> => {
    const body = await response.json();
    if (!expected.includes(response.status())) throw new Error(`${response.url()} answered ${response.status()}: ${JSON.stringify(body)}`);
    return body as T;
  };
  return {
    post: <T>(path: string, data: unknown, extra: Record<string, string> = {}, expected = [200, 201, 202]) =>
      request.post(path, { data, headers: { ...headers(), ...extra } }).then((r) => check<T>(r, expected)),
    upload: <T>(path: string, fileName: string, buffer: Buffer) =>
      request.post(path, { multipart: { file: { name: fileName, mimeType: 'audio/wav', buffer } }, headers: headers() }).then((r) => check<T>(r, [201])),
    get: <T>(path: string) => request.get(path).then((r) => check<T>(r, [200])),
  };
}
