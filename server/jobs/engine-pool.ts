import os from 'node:os';
import { Piscina } from 'piscina';
import type { EngineTask, EngineTaskOutput } from './engine/job-spec';

/** Threads for this process: the configured number, else all cores but one (at least one). */
export function engineThreadCount(configured: number | null): number {
  return configured ?? Math.max(1, os.availableParallelism() - 1);
}

export interface EnginePool {
  threads: number;
  run(task: EngineTask, signal: AbortSignal): Promise<EngineTaskOutput>;
  close(): Promise<void>;
}

export function createEnginePool(threads: number): EnginePool {
  const pool = new Piscina({
    filename: new URL('./engine-worker-entry.mjs', import.meta.url).href,
    minThreads: threads,
    maxThreads: threads,
    idleTimeout: 60_000,
  });
  return {
    threads,
    run: (task, signal) => {
      const transferList = task.wavBytes ? [task.wavBytes.buffer as ArrayBuffer] : [];
      return pool.run(task, { signal, transferList }) as Promise<EngineTaskOutput>;
    },
    close: () => pool.destroy(),
  };
}
