import os from 'node:os';
import { Piscina } from 'piscina';
import type { EngineTask, EngineTaskOutput } from './engine/job-spec';

/** Threads for this process: the configured number, else all cores but one (at least one). */
export function engineThreadCount(configured: number | null): number {
  return configured ?? Math.max(1, os.availableParallelism() - 1);
}

/** How the engine threads have been used since the pool started (benchmarks and logs). */
export interface EnginePoolStats {
  completed: number;
  queued: number;
  /** Engine time per task and time a task waited for a free thread, ms. */
  runTimeP50Ms: number;
  runTimeP99Ms: number;
  waitTimeP50Ms: number;
  /** Share of the threads' capacity spent running tasks since the pool started, 0–1. */
  utilization: number;
}

export interface EnginePool {
  threads: number;
  run(task: EngineTask, signal: AbortSignal): Promise<EngineTaskOutput>;
  stats(): EnginePoolStats;
  close(): Promise<void>;
}

export function createEnginePool(threads: number): EnginePool {
  const startedMs = performance.now();
  const pool = new Piscina({
    filename: new URL('./engine-worker-entry.mjs', import.meta.url).href,
    minThreads: threads,
    maxThreads: threads,
    // Threads stay up for the process's life: starting one costs the TypeScript loader and engine warm-up.
    idleTimeout: Number.POSITIVE_INFINITY,
  });
  return {
    threads,
    run: (task, signal) => {
      const transferList = task.wavBytes ? [task.wavBytes.buffer as ArrayBuffer] : [];
      return pool.run(task, { signal, transferList }) as Promise<EngineTaskOutput>;
    },
    stats: () => {
      const { runTime, waitTime } = pool.histogram;
      return {
        completed: pool.completed,
        queued: pool.queueSize,
        runTimeP50Ms: runTime.p50,
        runTimeP99Ms: runTime.p99,
        waitTimeP50Ms: waitTime.p50,
        utilization: (runTime.average * pool.completed) / ((performance.now() - startedMs) * threads),
      };
    },
    close: () => pool.destroy(),
  };
}
