import { TERMINAL_STATUSES } from '@shared/schemas/analyses';
import type { Database } from '@server/db/client';
import type { AppDeps } from '@server/deps';
import type { AnalysisRow } from '@server/modules/analyses/analyses.repo';
import { onJobFinished } from './job-notifier';
import { statusesByOrganisation } from './job-queue.repo';

/** How often the shared poll reads the statuses of the analyses waited for (jobs run by other processes). */
export const FINISH_POLL_MS = 250;

interface Waiter {
  organisationId: string;
  analysisId: string;
  resolve(row?: AnalysisRow): void;
}

/**
 * One per database: every analysis some request in this process waits for, and the single timer polling them.
 * However many requests wait (`Prefer: wait`), the database sees one status query per tick, not one per request.
 */
class FinishWatcher {
  private readonly waiters = new Set<Waiter>();
  private timer: NodeJS.Timeout | null = null;
  private polling = false;

  constructor(
    private readonly db: Database,
    private readonly logger: AppDeps['logger'],
  ) {}

  add(waiter: Waiter): void {
    this.waiters.add(waiter);
    this.timer ??= setInterval(() => void this.poll(), FINISH_POLL_MS);
  }

  remove(waiter: Waiter): void {
    this.waiters.delete(waiter);
    if (this.waiters.size === 0 && this.timer) {
      clearInterval(this.timer);
      this.timer = null;
    }
  }

  private async poll(): Promise<void> {
    // A slow database must not pile up overlapping polls.
    if (this.polling || this.waiters.size === 0) return;
    this.polling = true;
    try {
      // Only the waiters asked about are judged: one added while the query runs is not in its answer.
      const asked = [...this.waiters];
      const byOrganisation = new Map<string, string[]>();
      for (const { organisationId, analysisId } of asked) {
        const ids = byOrganisation.get(organisationId) ?? [];
        ids.push(analysisId);
        byOrganisation.set(organisationId, ids);
      }
      const statuses = await statusesByOrganisation(this.db, byOrganisation);
      for (const waiter of asked) {
        if (!this.waiters.has(waiter)) continue;
        const status = statuses.get(waiter.analysisId);
        // A vanished row (deleted) ends the wait too: the caller's next read reports it.
        if (status === undefined || (TERMINAL_STATUSES as readonly string[]).includes(status)) waiter.resolve();
      }
    } catch (error) {
      this.logger.warn({ err: error }, 'polling analysis statuses failed');
    } finally {
      this.polling = false;
    }
  }
}

const watchers = new WeakMap<Database, FinishWatcher>();

export interface FinishWatch {
  /**
   * Settles when the analysis finished (as far as this process can tell) or the time ran out; with the finished
   * row when a job runner in this process finished it, else with undefined (read the row).
   */
  done: Promise<AnalysisRow | undefined>;
  cancel(): void;
}

/**
 * Starts watching for an analysis to reach a terminal status: at once when a job runner in this process finishes
 * it, else at the next shared poll. Start the watch before reading the row, so a finish in between is not missed.
 */
export function watchForFinish(deps: Pick<AppDeps, 'db' | 'logger'>, organisationId: string, analysisId: string, timeoutMs: number): FinishWatch {
  let watcher = watchers.get(deps.db);
  if (!watcher) {
    watcher = new FinishWatcher(deps.db, deps.logger);
    watchers.set(deps.db, watcher);
  }
  const owner = watcher;
  let settle!: (row: AnalysisRow | undefined) => void;
  const done = new Promise<AnalysisRow | undefined>((resolve) => (settle = resolve));
  const timer = setTimeout(() => waiter.resolve(), Math.max(0, timeoutMs));
  // The row is handed over only within its own organisation (ids are unique, the check keeps the scoping explicit).
  const stopListening = onJobFinished(analysisId, (row) => waiter.resolve(row?.organisationId === organisationId ? row : undefined));
  const waiter: Waiter = {
    organisationId,
    analysisId,
    resolve: (row?: AnalysisRow) => {
      clearTimeout(timer);
      stopListening();
      owner.remove(waiter);
      settle(row);
    },
  };
  owner.add(waiter);
  return { done, cancel: () => waiter.resolve() };
}
