import { createReadStream } from 'node:fs';
import { access, mkdir, readFile, rename, rm } from 'node:fs/promises';
import path from 'node:path';
import type { Readable } from 'node:stream';
import { BlobNotFoundError, requireSha256, type BlobStore, type StoredBlob } from './blob-store';
import { writeHashedFile } from './hashing-file-writer';

/**
 * Blobs on a local disk (or a shared mount): <root>/<aa>/<sha256>. Writes go to <root>/tmp first and are renamed
 * into place, so a reader never sees a half-written blob and a crash leaves only a temp file.
 */
export function createFileBlobStore(root: string): BlobStore & { root: string; tempDir: string } {
  const tempDir = path.join(root, 'tmp');
  const blobPath = (sha256: string) => path.join(root, requireSha256(sha256).slice(0, 2), sha256);
  const exists = async (sha256: string) => {
    try {
      await access(blobPath(sha256));
      return true;
    } catch {
      return false;
    }
  };
  /** Renames a hashed temp file to its address (same file system: atomic); a blob already there is kept. */
  const moveIntoPlace = async (written: { path: string; sha256: string; bytes: number }): Promise<StoredBlob> => {
    const target = blobPath(written.sha256);
    await mkdir(path.dirname(target), { recursive: true });
    if (await exists(written.sha256)) await rm(written.path, { force: true });
    else await rename(written.path, target);
    return { sha256: written.sha256, bytes: written.bytes };
  };
  return {
    root,
    tempDir,
    async put(source: Readable): Promise<StoredBlob> {
      return moveIntoPlace(await writeHashedFile(source, tempDir));
    },
    async adopt(file) {
      // A file elsewhere (another file system, perhaps) is copied and hashed again instead.
      if (path.dirname(path.resolve(file.path)) !== path.resolve(tempDir)) return moveIntoPlace(await writeHashedFile(createReadStream(file.path), tempDir));
      return moveIntoPlace(file);
    },
    async get(sha256: string) {
      if (!(await exists(sha256))) throw new BlobNotFoundError(sha256);
      return createReadStream(blobPath(sha256));
    },
    async read(sha256: string) {
      try {
        return await readFile(blobPath(sha256));
      } catch (error) {
        if ((error as NodeJS.ErrnoException).code === 'ENOENT') throw new BlobNotFoundError(sha256);
        throw error;
      }
    },
    exists,
    async delete(sha256: string) {
      await rm(blobPath(sha256), { force: true });
    },
  };
}
