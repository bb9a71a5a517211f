import { randomBytes } from 'node:crypto';
import os from 'node:os';
import type { AppDeps } from '@server/deps';
import { emitEvent } from '@server/modules/webhook-endpoints/webhooks.service';
import { createEnginePool, engineThreadCount, type EnginePool, type EnginePoolStats } from './engine-pool';
import { claimNextJob, releaseJob, type ClaimedJob } from './job-queue.repo';
import { notifyJobFinished, onJobQueued } from './job-notifier';
import { processJob } from './job-processor';

export interface JobRunnerOptions {
  /** Engine threads (= analyses computed at once); default from config. */
  threads?: number;
  /** Jobs held at once (claimed, loading, computing or writing); default from config, else 2 × threads. */
  concurrency?: number;
  /** Idle poll interval, ms (a job queued in this process wakes the runner at once). */
  pollMs?: number;
  /** On stop, how long running jobs may take to finish before they are released, ms. */
  shutdownGraceMs?: number;
  /** Told when this runner is done with a job (tests and logs). */
  onJobDone?: (analysisId: string, outcome: string) => void;
}

export interface JobRunner {
  owner: string;
  threads: number;
  concurrency: number;
  /** Engine thread use so far (benchmarks and logs). */
  engineStats(): EnginePoolStats;
  /** Stop claiming, let running jobs finish within the grace time, release the rest (re-queued), close the pool. */
  stop(): Promise<void>;
}

/**
 * Works the analysis queue in this process: claims jobs while it holds fewer than `concurrency`, runs them on the
 * engine threads, and polls the database when idle, so any number of processes can share one queue. Holding a few
 * more jobs than threads keeps the threads busy: while one job computes, the next is claimed and its capture read,
 * and the previous one's result is written; the extra jobs wait in the engine pool's queue with their leases renewed.
 */
export function startJobRunner(deps: AppDeps, options: JobRunnerOptions = {}): JobRunner {
  const threads = options.threads ?? engineThreadCount(deps.config.jobs.engineThreads);
  const pool: EnginePool = createEnginePool(threads);
  const concurrency = Math.max(1, options.concurrency ?? deps.config.jobs.concurrency ?? threads * 2);
  const owner = `${os.hostname().slice(0, 30)}:${process.pid}:${randomBytes(4).toString('hex')}`;
  const pollMs = options.pollMs ?? 250;
  const shutdown = new AbortController();
  const active = new Map<string, Promise<unknown>>();
  let stopping = false;
  let wake: (() => void) | null = null;
  // Whether the queue may hold work. A claim that finds nothing costs three statements, so after one the runner
  // asks again only when a job is queued in this process or the poll interval has passed (jobs queued by other
  // processes, expired leases), not each time one of its own jobs finishes.
  let queuedSignals = 0;
  let mayHaveWork = true;
  let lastEmptyClaimMs = Number.NEGATIVE_INFINITY;
  const unsubscribe = onJobQueued(() => {
    queuedSignals += 1;
    mayHaveWork = true;
    wake?.();
  });

  const claimOptions = {
    owner,
    leaseSeconds: deps.config.jobs.leaseSeconds,
    maxAttempts: deps.config.jobs.maxAttempts,
    onExhausted: (job: { id: string; organisationId: string; attempts: number }) => {
      void emitEvent(deps, job.organisationId, 'analysis.failed', {
        id: job.id,
        kind: 'unknown',
        status: 'failed',
        error: { code: 'analysis_attempts_exhausted', title: 'The analysis ran out of attempts' },
        url: `/v1/analyses/${job.id}`,
      }).catch((error: unknown) => deps.logger.warn({ err: error }, 'could not record analysis.failed'));
      notifyJobFinished(job.id);
    },
  };

  const sleep = (ms: number) =>
    new Promise<void>((resolve) => {
      const timer = setTimeout(done, ms);
      function done() {
        clearTimeout(timer);
        wake = null;
        resolve();
      }
      wake = done;
    });

  function start(job: ClaimedJob) {
    const run = processJob(deps, pool, job, { owner, leaseSeconds: claimOptions.leaseSeconds, maxAttempts: claimOptions.maxAttempts, shutdown: shutdown.signal })
      .then((outcome) => options.onJobDone?.(job.id, outcome))
      .catch((error: unknown) => deps.logger.error({ err: error, analysisId: job.id }, 'job processing crashed'))
      .finally(() => {
        active.delete(job.id);
        wake?.();
      });
    active.set(job.id, run);
  }

  const loop = (async () => {
    while (!stopping) {
      const sinceEmptyClaimMs = performance.now() - lastEmptyClaimMs;
      if (active.size >= concurrency || (!mayHaveWork && sinceEmptyClaimMs < pollMs)) {
        await sleep(active.size >= concurrency ? pollMs : pollMs - sinceEmptyClaimMs);
        continue;
      }
      const signalsBefore = queuedSignals;
      let job: ClaimedJob | null = null;
      try {
        job = await claimNextJob(deps.db, { ...claimOptions, now: deps.clock.now() });
      } catch (error) {
        if (!stopping) deps.logger.warn({ err: error }, 'claiming a job failed');
      }
      if (job) {
        mayHaveWork = true;
        start(job);
      } else {
        // A job queued while this claim ran may have missed it: keep the hint then.
        mayHaveWork = queuedSignals !== signalsBefore;
        lastEmptyClaimMs = performance.now();
        if (!mayHaveWork) await sleep(pollMs);
      }
    }
  })();

  return {
    owner,
    threads,
    concurrency,
    engineStats: () => pool.stats(),
    async stop() {
      if (stopping) return;
      stopping = true;
      unsubscribe();
      wake?.();
      await loop;
      const grace = new Promise((resolve) => setTimeout(resolve, options.shutdownGraceMs ?? 10_000).unref());
      await Promise.race([Promise.allSettled([...active.values()]), grace]);
      const unfinished = [...active.keys()];
      shutdown.abort();
      await Promise.allSettled([...active.values()]);
      for (const id of unfinished) await releaseJob(deps.db, id, owner, deps.clock.now()).catch(() => false);
      await pool.close();
    },
  };
}
