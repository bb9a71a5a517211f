import net from 'node:net';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { captures } from '@server/db/tables';
import { auth, blobFiles, idempotencyKey, measureContext, wav, type MeasureContext } from './analyses-fixtures';

let m: MeasureContext;
beforeAll(async () => {
  m = await measureContext({ runJobs: false });
});
afterAll(async () => {
  await m?.close();
});

const tone = (seconds: number, fs = 48_000) => Float64Array.from({ length: Math.round(seconds * fs) }, (_, n) => 0.25 * Math.sin((2 * Math.PI * 1000 * n) / fs));

async function expectNothingStored() {
  expect(await m.context.deps.db.select().from(captures)).toEqual([]);
  expect(await blobFiles(m.blobDir)).toEqual([]);
}

async function post(bytes: Buffer, filename = 'capture.wav') {
  return m.api().post('/v1/captures').set(auth(m.key)).set(idempotencyKey()).attach('file', bytes, filename);
}

describe('refused uploads leave no row and no file', () => {
  const good = wav([tone(0.5)]);
  const floatWithNaN = (() => {
    const bytes = Buffer.from(wav([tone(0.1)]));
    bytes.writeFloatLE(Number.NaN, bytes.length - 8);
    return bytes;
  })();
  const cases: [string, Buffer, number, string][] = [
    ['empty file', Buffer.alloc(0), 422, 'invalid_wav'],
    ['truncated file', good.subarray(0, good.length - 3), 422, 'invalid_wav'],
    ['header only', good.subarray(0, 44), 422, 'invalid_wav'],
    ['wrong format (not RIFF)', Buffer.from('OggS\u0000\u0002 some other container'), 422, 'invalid_wav'],
    ['NaN float samples', floatWithNaN, 422, 'invalid_wav'],
    ['a text file named .wav', Buffer.from('this is a text file, not audio\n'), 422, 'invalid_wav'],
    // Bench plan limits: 2 channels, 60 s, 96 kHz (server/billing/plans.ts).
    ['too many channels', wav([tone(0.1), tone(0.1), tone(0.1)]), 422, 'capture_over_limit'],
    ['sample rate above the plan', wav([tone(0.1, 192_000)], 192_000), 422, 'capture_over_limit'],
    ['longer than the plan', wav([new Float64Array(8000 * 61)], 8000), 422, 'capture_over_limit'],
  ];
  for (const [name, bytes, status, code] of cases) {
    it(`${name} → ${status} ${code}`, async () => {
      const response = await post(bytes);
      expect(response.status, JSON.stringify(response.body)).toBe(status);
      expect(response.body.code).toBe(code);
      await expectNothingStored();
    });
  }

  it('names the limit that was hit', async () => {
    const response = await post(wav([tone(0.1), tone(0.1), tone(0.1)]));
    expect(response.body).toMatchObject({ limit: 'maxUploadChannels', allowed: 2, actual: 3 });
  });

  it('a file over the size limit → 413 naming the limit', async () => {
    const response = await post(Buffer.alloc(64 * 1e6 + 10));
    expect(response.status).toBe(413);
    expect(response.body).toMatchObject({ code: 'payload_too_large', limit: 'maxUploadBytes' });
    await expectNothingStored();
  });

  it('a connection dropped mid-upload leaves nothing', async () => {
    const server = http.createServer(m.context.app).listen(0, '127.0.0.1');
    await new Promise((resolve) => server.once('listening', resolve));
    const { port } = server.address() as AddressInfo;
    const boundary = 'kb65boundary';
    const head = `--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="cut.wav"\r\nContent-Type: audio/wav\r\n\r\n`;
    const socket = net.connect(port, '127.0.0.1');
    await new Promise((resolve) => socket.once('connect', resolve));
    socket.write(
      `POST /v1/captures HTTP/1.1\r\nHost: 127.0.0.1\r\nAuthorization: Bearer ${m.key}\r\nIdempotency-Key: 9d1b7e02-0c55-4f7b-a1c3-5e4f8d2a6b10\r\n` +
        `Content-Type: multipart/form-data; boundary=${boundary}\r\nContent-Length: 2000000\r\n\r\n${head}`,
    );
    socket.write(good.subarray(0, 20_000));
    await new Promise((resolve) => setTimeout(resolve, 300));
    socket.destroy();
    await new Promise((resolve) => setTimeout(resolve, 500));
    server.close();
    await expectNothingStored();
  });

  it('a good upload is stored once, by content hash, and is downloadable byte for byte', async () => {
    const response = await post(good, 'kb65-24-000123.wav');
    expect(response.status).toBe(201);
    expect(response.body).toMatchObject({ sampleRateHz: 48_000, channelCount: 1, frameCount: 24_000, durationSeconds: 0.5 });
    // A 0.25-peak sine: peak 20·log10(0.25) = −12.04 dBFS, AES17 RMS level equal to the peak level.
    expect(response.body.channels[0].peakDbfs).toBeCloseTo(20 * Math.log10(0.25), 3);
    expect(response.body.channels[0].rmsDbfs).toBeCloseTo(20 * Math.log10(0.25), 2);
    const download = await m.api().get(`/v1/captures/${response.body.id}/download`).set(auth(m.key)).buffer(true).parse((res, done) => {
      const chunks: Buffer[] = [];
      res.on('data', (chunk: Buffer) => chunks.push(chunk));
      res.on('end', () => done(null, Buffer.concat(chunks)));
    });
    expect(Buffer.compare(download.body as Buffer, good)).toBe(0);
    expect(download.headers.etag).toBe(`"${response.body.sha256}"`);
    expect((await blobFiles(m.blobDir)).filter((file) => !file.startsWith('tmp'))).toHaveLength(1);
  });
});
