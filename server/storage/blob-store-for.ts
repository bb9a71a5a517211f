import path from 'node:path';
import type { AppDeps } from '@server/deps';
import type { BlobStore } from './blob-store';
import { createFileBlobStore } from './file-blob-store';

const stores = new Map<string, ReturnType<typeof createFileBlobStore>>();

/** The blob store configured for these deps (one instance per folder, shared by every request). */
export function blobStoreFor(deps: Pick<AppDeps, 'config'>): BlobStore & { tempDir: string } {
  const root = path.resolve(deps.config.blobDir);
  let store = stores.get(root);
  if (!store) {
    store = createFileBlobStore(root);
    stores.set(root, store);
  }
  return store;
}
