import { rm } from 'node:fs/promises';
import { Readable } from 'node:stream';
import { and, eq, inArray } from 'drizzle-orm';
import { createAnalysisRequestSchema, type CreateAnalysisRequest } from '@shared/schemas/analyses';
import type { Capture } from '@shared/schemas/captures';
import { analyses } from '@server/db/tables';
import type { AppDeps } from '@server/deps';
import { enqueuePrepared, prepareAnalysis, type StoredAnalysisRequest } from '@server/modules/analyses/analysis-create';
import { resolveCalibrationForAnalysis } from '@server/modules/calibrations/calibrations.service';
import { storeReceivedCapture } from '@server/modules/captures/captures.service';
import { uploadLimitsFor } from '@server/modules/captures/upload-limits';
import { getMaskForAnalysis } from '@server/modules/masks/masks.service';
import { createEnginePool } from '@server/jobs/engine-pool';
import { runAnalysis } from '@server/jobs/engine/run-analysis';
import type { EngineTask, EngineTaskOutput } from '@server/jobs/engine/job-spec';
import { blobStoreFor } from '@server/storage/blob-store-for';
import { writeHashedFile } from '@server/storage/hashing-file-writer';

/** The same deps with the clock stopped at `when`: what the services stamp on rows the seed writes "back then". */
export function at(deps: AppDeps, when: Date): AppDeps {
  const fixed = when.getTime();
  return { ...deps, clock: { now: () => new Date(fixed) } };
}

/** Stores WAV bytes through the capture service, exactly as an upload (checked against the plan's limits). */
export async function storeDemoCapture(deps: AppDeps, orgId: string, filename: string, wav: Uint8Array): Promise<Capture> {
  const store = blobStoreFor(deps);
  const hashed = await writeHashedFile(Readable.from([Buffer.from(wav.buffer, wav.byteOffset, wav.byteLength)]), store.tempDir);
  try {
    return await storeReceivedCapture(deps, orgId, { ...hashed, originalName: filename }, await uploadLimitsFor(deps, orgId));
  } finally {
    await rm(hashed.path, { force: true });
  }
}

/**
 * Analyses run inline, not through the job queue: the seed hands each one to engine threads of its own (the
 * same worker entry and engine code the job runner uses) and stores the row already finished. Queueing would
 * leave the demo half-measured while the first start's runner catches up, could hand the seed's jobs to another
 * process sharing the queue (claims take the oldest job of any organisation), and would stamp every result with
 * today's time instead of its measuring time. Validation, calibration and mask resolution, the usage charge and
 * the insert still go through the analysis services, so the stored request, verdict and usage are what an API
 * call would have produced at that time.
 */
export interface DemoEngine {
  analyse(deps: AppDeps, orgId: string, request: CreateAnalysisRequest, capture: Capture, wav: Uint8Array, runSeconds?: number): Promise<FinishedDemoAnalysis>;
  close(): Promise<void>;
}

export interface FinishedDemoAnalysis {
  id: string;
  verdict: string | null;
  finishedAt: Date;
}

/** `threads` 0 runs the engine on this thread (the same pure function the worker threads run). */
export function startDemoEngine(threads: number): DemoEngine {
  const pool = threads > 0 ? createEnginePool(threads) : null;
  const never = new AbortController().signal;
  const run = (task: EngineTask): Promise<EngineTaskOutput> => (pool ? pool.run(task, never) : Promise.resolve().then(() => runAnalysis(task)));
  return {
    async analyse(deps, orgId, input, capture, wav, runSeconds = 2) {
      const request = createAnalysisRequestSchema.parse({ ...input, captureId: capture.id });
      const facts = { id: capture.id, sampleRateHz: capture.sampleRateHz, channelCount: capture.channelCount, durationSeconds: capture.durationSeconds };
      const prepared = await prepareAnalysis(deps, orgId, request, facts);
      const stored = prepared.row.request as unknown as StoredAnalysisRequest;
      const applied = await resolveCalibrationForAnalysis(deps, orgId, stored.calibration);
      const mask = stored.mask ? await getMaskForAnalysis(deps, orgId, stored.mask.maskId, stored.mask.version) : null;
      const output = await run({
          spec: stored.spec,
          // Each task takes over its own copy (the pool transfers the buffer to the thread).
          wavBytes: wav.slice(),
          calibration: applied ? { id: applied.id, dbfsAtOnePascal: applied.dbfsAtOnePascal, expired: applied.expired } : null,
          mask: mask ? { mask: mask.mask, id: mask.id, version: mask.version, referenceLevel: mask.referenceLevel } : null,
      });
      const createdAt = prepared.row.createdAt;
      const finishedAt = new Date(createdAt.getTime() + runSeconds * 1000);
      prepared.row = {
        ...prepared.row,
        status: 'succeeded',
        progress: 1,
        attempts: 1,
        resultJson: output.resultJson,
        verdict: output.verdict,
        worstMarginDb: output.worstMarginDb,
        calibration: applied as unknown as Record<string, unknown> | null,
        engineVersion: output.engineVersion,
        startedAt: new Date(createdAt.getTime() + 200),
        finishedAt,
        updatedAt: finishedAt,
      };
      const id = await enqueuePrepared(deps, orgId, prepared);
      return { id, verdict: output.verdict, finishedAt };
    },
    close: async () => pool?.close(),
  };
}

export interface ExistingDemoAnalysis {
  id: string;
  serial: string;
  kind: string;
}

/** The organisation's analyses of the given serial numbers (ids and kinds only: the seed's "already there" check). */
export async function analysesOfSerials(deps: AppDeps, orgId: string, serials: string[]): Promise<ExistingDemoAnalysis[]> {
  if (serials.length === 0) return [];
  const rows = await deps.db
    .select({ id: analyses.id, serial: analyses.dutSerial, kind: analyses.kind, createdAt: analyses.createdAt })
    .from(analyses)
    .where(and(eq(analyses.organisationId, orgId), inArray(analyses.dutSerial, serials)))
    .orderBy(analyses.createdAt);
  return rows.map((row) => ({ id: row.id, serial: row.serial ?? '', kind: row.kind }));
}

/** Runs `work` over `items` with at most `limit` in flight, keeping the results in order. */
export async function inBatches<T, R>(items: T[], limit: number, work: (item: T) => Promise<R>): Promise<R[]> {
  const results: R[] = new Array(items.length);
  let next = 0;
  const lanes = Array.from({ length: Math.min(limit, items.length) }, async () => {
    while (next < items.length) {
      const index = next++;
      results[index] = await work(items[index]);
    }
  });
  await Promise.all(lanes);
  return results;
}
