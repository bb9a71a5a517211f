import { and, asc, eq, inArray, isNotNull, isNull, lt, ne, or, sql } from 'drizzle-orm';
import type { PoolConnection } from 'mysql2/promise';
import type { Database, Executor } from '@server/db/client';
import { executePrepared } from '@server/db/prepared';
import { analyses } from '@server/db/tables';
import type { AnalysisRow } from '@server/modules/analyses/analyses.repo';

/** The row as the claim left it (running, leased to the claimer, attempt counted): the worker needs no second read. */
export type ClaimedJob = AnalysisRow;

export interface ClaimOptions {
  owner: string;
  now: Date;
  leaseSeconds: number;
  maxAttempts: number;
  /** Told about each job failed for running out of attempts (to emit its event). */
  onExhausted?: (job: { id: string; organisationId: string; attempts: number }) => void;
}

/**
 * Queued, or running with an expired lease held by someone else: a runner never takes back its own job (it holds
 * several at once and is still working on it; a late heartbeat renews the lease as long as no one else took it).
 */
const claimable = (now: Date, owner: string) =>
  or(
    eq(analyses.status, 'queued'),
    and(
      eq(analyses.status, 'running'),
      isNotNull(analyses.leaseExpiresAt),
      lt(analyses.leaseExpiresAt, now),
      or(isNull(analyses.leaseOwner), ne(analyses.leaseOwner, owner)),
    ),
  );

/**
 * Claims the oldest claimable job: queued, or running with an expired lease (its worker died). The row lock is
 * taken with FOR UPDATE SKIP LOCKED inside a short transaction, so concurrent workers in any process each get a
 * different row and never wait on each other. A job already claimed `maxAttempts` times is failed instead.
 * Returns null when nothing is claimable.
 */
export async function claimNextJob(db: Database, options: ClaimOptions): Promise<ClaimedJob | null> {
  for (;;) {
    const outcome = await db.transaction(async (tx) => {
      const [row] = await tx
        .select()
        .from(analyses)
        .where(claimable(options.now, options.owner))
        .orderBy(asc(analyses.createdAt))
        .limit(1)
        .for('update', { skipLocked: true });
      if (!row) return { kind: 'none' as const };
      if (row.attempts >= options.maxAttempts) {
        await tx
          .update(analyses)
          .set({
            status: 'failed',
            progress: 1,
            leaseOwner: null,
            leaseExpiresAt: null,
            finishedAt: options.now,
            updatedAt: options.now,
            error: {
              code: 'analysis_attempts_exhausted',
              title: 'The analysis ran out of attempts',
              status: 500,
              detail: `The analysis was started ${row.attempts} time(s) and its worker stopped each time before finishing (lease expired); it is not retried again.`,
            },
          })
          .where(eq(analyses.id, row.id));
        return { kind: 'exhausted' as const, id: row.id, organisationId: row.organisationId, attempts: row.attempts };
      }
      const claim = {
        status: 'running',
        attempts: row.attempts + 1,
        leaseOwner: options.owner,
        leaseExpiresAt: new Date(options.now.getTime() + options.leaseSeconds * 1000),
        startedAt: options.now,
        updatedAt: options.now,
        progress: 0.1,
      };
      await tx.update(analyses).set(claim).where(eq(analyses.id, row.id));
      return { kind: 'claimed' as const, job: { ...row, ...claim } };
    });
    if (outcome.kind === 'none') return null;
    if (outcome.kind === 'claimed') return outcome.job;
    options.onExhausted?.(outcome);
  }
}

const heldBy = (jobId: string, owner: string) => and(eq(analyses.id, jobId), eq(analyses.leaseOwner, owner), eq(analyses.status, 'running'));

/** Extends the lease; false when the job is no longer ours (canceled, or claimed by another after expiry). */
export async function renewLease(db: Executor, jobId: string, owner: string, until: Date, now: Date): Promise<boolean> {
  const [result] = await db.update(analyses).set({ leaseExpiresAt: until, updatedAt: now }).where(heldBy(jobId, owner));
  return result.affectedRows === 1;
}

export interface FinishJob {
  status: 'succeeded' | 'failed';
  resultJson?: string | null;
  error?: Record<string, unknown> | null;
  verdict?: string | null;
  worstMarginDb?: number | null;
  calibration?: Record<string, unknown> | null;
  engineVersion?: string | null;
  now: Date;
}

/**
 * Writes the outcome if the job is still ours; false when it was canceled or lost meanwhile (result discarded).
 * Sent as a prepared statement on the transaction's connection: the result text is the largest value the service
 * writes, and the binary protocol carries it without escaping (server/db/prepared.ts).
 */
export async function finishJob(scope: { tx: Executor; connection: PoolConnection }, jobId: string, owner: string, outcome: FinishJob): Promise<boolean> {
  const statement = scope.tx.update(analyses).set(finishedColumns(outcome)).where(heldBy(jobId, owner));
  return (await executePrepared(scope.connection, statement)) === 1;
}

/** The columns `finishJob` writes, so a copy of the finished row can be built from the same list. */
export function finishedColumns(outcome: FinishJob) {
  return {
    status: outcome.status,
    progress: 1,
    resultJson: outcome.resultJson ?? null,
    error: outcome.error ?? null,
    verdict: outcome.verdict ?? null,
    worstMarginDb: outcome.worstMarginDb ?? null,
    calibration: outcome.calibration ?? null,
    engineVersion: outcome.engineVersion ?? null,
    leaseOwner: null,
    leaseExpiresAt: null,
    finishedAt: outcome.now,
    updatedAt: outcome.now,
  } satisfies Partial<AnalysisRow>;
}

/** Puts a job back in the queue without counting the attempt (graceful shutdown). */
export async function releaseJob(db: Executor, jobId: string, owner: string, now: Date): Promise<boolean> {
  const [result] = await db
    .update(analyses)
    .set({ status: 'queued', leaseOwner: null, leaseExpiresAt: null, progress: 0, updatedAt: now, attempts: sql`GREATEST(${analyses.attempts} - 1, 0)` })
    .where(heldBy(jobId, owner));
  return result.affectedRows === 1;
}

/** Puts a job back after a transient failure, counting the attempt. */
export async function requeueJob(db: Executor, jobId: string, owner: string, now: Date): Promise<boolean> {
  const [result] = await db
    .update(analyses)
    .set({ status: 'queued', leaseOwner: null, leaseExpiresAt: null, progress: 0, updatedAt: now })
    .where(heldBy(jobId, owner));
  return result.affectedRows === 1;
}

/** Status of each listed analysis, one statement for any number of organisations (each id scoped by its own). */
export async function statusesByOrganisation(db: Executor, idsByOrganisation: Map<string, string[]>): Promise<Map<string, string>> {
  const scopes = [...idsByOrganisation].filter(([, ids]) => ids.length > 0).map(([organisationId, ids]) => and(eq(analyses.organisationId, organisationId), inArray(analyses.id, ids)));
  if (scopes.length === 0) return new Map();
  const rows = await db.select({ id: analyses.id, status: analyses.status }).from(analyses).where(or(...scopes));
  return new Map(rows.map((row) => [row.id, row.status]));
}

export async function jobStatuses(db: Executor, jobIds: string[]): Promise<Map<string, string>> {
  if (jobIds.length === 0) return new Map();
  const rows = await db.select({ id: analyses.id, status: analyses.status }).from(analyses).where(inArray(analyses.id, jobIds));
  return new Map(rows.map((row) => [row.id, row.status]));
}
