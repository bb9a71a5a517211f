import type { Readable } from 'node:stream';

export interface StoredBlob {
  /** Lower-case hex SHA-256 of the bytes: the blob's address. */
  sha256: string;
  bytes: number;
}

/**
 * Content-addressed storage for captures. The disk store is the default; an S3-compatible store would implement
 * the same six methods (put = multipart upload keyed by hash), so switching is a configuration change.
 */
export interface BlobStore {
  /** Stores the stream under its SHA-256; storing bytes that are already there keeps one copy. */
  put(source: Readable): Promise<StoredBlob>;
  /**
   * Stores a file already written and hashed into this store's temp folder (server/storage/hashing-file-writer.ts),
   * taking it over (the file is moved, not copied, so the upload is not read and hashed a second time); a file
   * outside that folder is copied and hashed.
   */
  adopt(file: { path: string; sha256: string; bytes: number }): Promise<StoredBlob>;
  /** A stream of the blob's bytes; rejects with BlobNotFoundError when absent. */
  get(sha256: string): Promise<Readable>;
  /** The whole blob in memory (captures are bounded by the plan's upload limit). */
  read(sha256: string): Promise<Buffer>;
  exists(sha256: string): Promise<boolean>;
  /** Removing an absent blob is not an error. */
  delete(sha256: string): Promise<void>;
}

export class BlobNotFoundError extends Error {
  constructor(readonly sha256: string) {
    super(`No blob ${sha256}`);
    this.name = 'BlobNotFoundError';
  }
}

export function requireSha256(value: string): string {
  if (!/^[0-9a-f]{64}$/.test(value)) throw new Error(`Not a SHA-256 hex digest: ${value}`);
  return value;
}
