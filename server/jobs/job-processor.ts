import { isEngineError } from '@shared/dsp';
import { PROBLEMS } from '@shared/problems';
import { transactionOnConnection } from '@server/db/prepared';
import type { AppDeps } from '@server/deps';
import { ApiProblem } from '@server/http/api-problem';
import { readCaptureBytes } from '@server/modules/captures/captures.service';
import type { AnalysisRow } from '@server/modules/analyses/analyses.repo';
import { resolveCalibrationForAnalysis, type AppliedCalibration } from '@server/modules/calibrations/calibrations.service';
import { getMaskForAnalysis } from '@server/modules/masks/masks.service';
import { emitEvent } from '@server/modules/webhook-endpoints/webhooks.service';
import type { EnginePool } from './engine-pool';
import type { AnalysisJobSpec, EngineTask } from './engine/job-spec';
import { finishedColumns, finishJob, renewLease, requeueJob, type ClaimedJob } from './job-queue.repo';
import { notifyJobFinished } from './job-notifier';

export interface ProcessOptions {
  owner: string;
  leaseSeconds: number;
  maxAttempts: number;
  /** Aborted by the runner on shutdown; the job is then released by the runner. */
  shutdown: AbortSignal;
}

interface StoredRequest {
  spec: AnalysisJobSpec;
  calibration?: { calibrationId?: string; rigId?: string; inputChannel?: number } | null;
  mask?: { maskId: string; version?: number } | null;
}

/** The event's DUT summary needs model and serial; without both it is left out. */
function dutOf(row: AnalysisRow) {
  if (!row.dutModel || !row.dutSerial) return undefined;
  return { model: row.dutModel, serial: row.dutSerial, ...(row.dutLot ? { lot: row.dutLot } : {}) };
}

async function buildTask(deps: AppDeps, row: AnalysisRow): Promise<{ task: EngineTask; applied: AppliedCalibration | null }> {
  const stored = row.request as unknown as StoredRequest;
  // A sensitivity derived from a stored response keeps the calibration that response was measured with.
  const inherited = stored.spec.sensitivity?.source?.calibration as AppliedCalibration | undefined;
  const applied = inherited ?? (await resolveCalibrationForAnalysis(deps, row.organisationId, stored.calibration ?? null));
  const resolvedMask = stored.mask ? await getMaskForAnalysis(deps, row.organisationId, stored.mask.maskId, stored.mask.version) : null;
  const bytes = row.captureId ? (await readCaptureBytes(deps, row.organisationId, row.captureId)).bytes : null;
  return {
    applied,
    task: {
      spec: stored.spec,
      // A copy the engine thread may take over (transferred, not cloned).
      wavBytes: bytes ? new Uint8Array(bytes) : null,
      calibration: applied ? { id: applied.id, dbfsAtOnePascal: applied.dbfsAtOnePascal, expired: applied.expired } : null,
      mask: resolvedMask ? { mask: resolvedMask.mask, id: resolvedMask.id, version: resolvedMask.version, referenceLevel: resolvedMask.referenceLevel } : null,
    },
  };
}

function failureOf(error: unknown): Record<string, unknown> {
  if (isEngineError(error)) {
    return { code: 'invalid_parameters', title: PROBLEMS.invalid_parameters.title, status: 422, detail: error.message, engineCode: error.code, ...(error.field ? { field: error.field } : {}) };
  }
  if (error instanceof ApiProblem) return { code: error.code, title: PROBLEMS[error.code].title, status: error.status, detail: error.detail, ...error.extensions };
  return { code: 'internal_error', title: PROBLEMS.internal_error.title, status: 500, detail: 'The analysis failed unexpectedly; it may succeed if re-run.' };
}

/**
 * The row as `finishJob` leaves it, for requests in this process waiting on the job. JSON columns go through
 * JSON as the database would return them, so an answer built from this row matches one built from a read.
 */
function finishedRow(row: AnalysisRow, outcome: Parameters<typeof finishJob>[3]): AnalysisRow {
  const columns = finishedColumns(outcome);
  const asStored = <T>(value: T | null): T | null => (value === null ? null : (JSON.parse(JSON.stringify(value)) as T));
  return { ...row, ...columns, error: asStored(columns.error), calibration: asStored(columns.calibration) };
}

/** Final status, result and webhook event in one transaction: the event exists exactly when the status does. */
async function finish(deps: AppDeps, row: AnalysisRow, owner: string, outcome: Parameters<typeof finishJob>[3]): Promise<boolean> {
  const written = await transactionOnConnection(deps.db, async (scope) => {
    const { tx } = scope;
    if (!(await finishJob(scope, row.id, owner, outcome))) return false;
    const common = { id: row.id, kind: row.kind, captureId: row.captureId ?? undefined, dut: dutOf(row), url: `/v1/analyses/${row.id}` };
    if (outcome.status === 'succeeded') {
      const verdict = outcome.verdict === 'pass' || outcome.verdict === 'fail' || outcome.verdict === 'incomplete' ? outcome.verdict : null;
      await emitEvent(deps, row.organisationId, 'analysis.succeeded', { ...common, status: 'succeeded', verdict }, tx);
    } else {
      const error = outcome.error as { code: string; title: string };
      await emitEvent(deps, row.organisationId, 'analysis.failed', { ...common, status: 'failed', error: { code: error.code, title: error.title } }, tx);
    }
    return true;
  });
  if (written) notifyJobFinished(row.id, finishedRow(row, outcome));
  return written;
}

/**
 * Runs one claimed job: inputs → engine thread (lease renewed meanwhile) → result, calibration record, verdict and
 * event. A job canceled or lost while running has its engine task aborted and its result discarded. Client-side
 * faults (engine errors, missing calibration or mask) fail at once; unexpected errors are retried until the
 * attempts run out.
 */
export async function processJob(deps: AppDeps, pool: EnginePool, job: ClaimedJob, options: ProcessOptions): Promise<'finished' | 'lost' | 'shutdown'> {
  const row = job;
  const abort = new AbortController();
  const onShutdown = () => abort.abort(new Error('shutdown'));
  options.shutdown.addEventListener('abort', onShutdown);
  let lost = false;
  const heartbeat = setInterval(() => {
    const now = deps.clock.now();
    renewLease(deps.db, job.id, options.owner, new Date(now.getTime() + options.leaseSeconds * 1000), now).then(
      (held) => {
        if (!held) {
          lost = true;
          abort.abort(new Error('lease lost or canceled'));
        }
      },
      (error: unknown) => deps.logger.warn({ err: error, analysisId: job.id }, 'lease renewal failed'),
    );
  }, Math.max(200, (options.leaseSeconds * 1000) / 3));
  try {
    const { task, applied } = await buildTask(deps, row);
    const output = await pool.run(task, abort.signal);
    if (lost || options.shutdown.aborted) return options.shutdown.aborted ? 'shutdown' : 'lost';
    const written = await finish(deps, row, options.owner, {
      status: 'succeeded',
      resultJson: output.resultJson,
      verdict: output.verdict,
      worstMarginDb: output.worstMarginDb,
      engineVersion: output.engineVersion,
      calibration: applied as unknown as Record<string, unknown> | null,
      now: deps.clock.now(),
    });
    return written ? 'finished' : 'lost';
  } catch (error) {
    if (options.shutdown.aborted) return 'shutdown';
    if (lost) return 'lost';
    const clientFault = isEngineError(error) || (error instanceof ApiProblem && error.status < 500);
    if (!clientFault && job.attempts < options.maxAttempts) {
      deps.logger.warn({ err: error, analysisId: job.id, attempt: job.attempts }, 'analysis attempt failed; re-queued');
      await requeueJob(deps.db, job.id, options.owner, deps.clock.now());
      return 'finished';
    }
    if (!clientFault) deps.logger.error({ err: error, analysisId: job.id }, 'analysis failed');
    await finish(deps, row, options.owner, { status: 'failed', error: failureOf(error), now: deps.clock.now() });
    return 'finished';
  } finally {
    clearInterval(heartbeat);
    options.shutdown.removeEventListener('abort', onShutdown);
  }
}
