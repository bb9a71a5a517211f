import { createHash, randomBytes } from 'node:crypto';
import { createWriteStream } from 'node:fs';
import { mkdir, rm } from 'node:fs/promises';
import path from 'node:path';
import { Transform, type Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';

export interface HashedFile {
  path: string;
  sha256: string;
  bytes: number;
}

export class ByteLimitExceededError extends Error {
  constructor(readonly limitBytes: number) {
    super(`The stream is longer than ${limitBytes} bytes`);
    this.name = 'ByteLimitExceededError';
  }
}

/**
 * Streams `source` into a new file in `directory` while hashing and counting it. On any failure (source error,
 * aborted client, byte limit) the partial file is removed before the promise rejects, so nothing is left behind.
 */
export async function writeHashedFile(source: Readable, directory: string, options: { maxBytes?: number } = {}): Promise<HashedFile> {
  await mkdir(directory, { recursive: true });
  const filePath = path.join(directory, `upload-${process.pid}-${randomBytes(8).toString('hex')}.part`);
  const hash = createHash('sha256');
  let bytes = 0;
  const meter = new Transform({
    transform(chunk: Buffer, _encoding, callback) {
      bytes += chunk.length;
      if (options.maxBytes !== undefined && bytes > options.maxBytes) {
        callback(new ByteLimitExceededError(options.maxBytes));
        return;
      }
      hash.update(chunk);
      callback(null, chunk);
    },
  });
  try {
    await pipeline(source, meter, createWriteStream(filePath, { flags: 'wx' }));
  } catch (error) {
    await rm(filePath, { force: true });
    throw error;
  }
  return { path: filePath, sha256: hash.digest('hex'), bytes };
}
