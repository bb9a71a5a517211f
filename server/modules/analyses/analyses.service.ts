import type { AnalysisResult } from '@shared/dsp';
import {
  TERMINAL_STATUSES,
  type Analysis,
  type AnalysisKind,
  type AnalysisListQuery,
  type AnalysisStatus,
  type CreateAnalysisRequest,
  type Dut,
} from '@shared/schemas/analyses';
import type { Page } from '@shared/schemas/pagination';
import type { AppDeps } from '@server/deps';
import { ApiProblem, notFound } from '@server/http/api-problem';
import { findCapture } from '@server/modules/captures/captures.repo';
import { releaseAnalysis } from '@server/modules/usage/usage.service';
import { watchForFinish } from '@server/jobs/finish-watcher';
import { findAnalyses, findAnalysis, listAnalyses, markCanceled, type AnalysisRow } from './analyses.repo';
import { enqueuePrepared, prepareAnalysis, type StoredAnalysisRequest } from './analysis-create';
import { presentAnalysis } from './analysis-presenter';
import { decodeSortCursor, encodeSortCursor, sortSpecOf } from './analysis-sort';

export async function requireAnalysisRow(deps: AppDeps, organisationId: string, analysisId: string): Promise<AnalysisRow> {
  const row = await findAnalysis(deps.db, organisationId, analysisId);
  if (!row) throw notFound('analysis');
  return row;
}

export async function getAnalysis(deps: AppDeps, organisationId: string, analysisId: string): Promise<Analysis> {
  return presentAnalysis(await requireAnalysisRow(deps, organisationId, analysisId));
}

export const isTerminal = (status: string) => (TERMINAL_STATUSES as readonly string[]).includes(status);

/**
 * Waits up to `seconds` for the analysis to finish: woken at once by a worker in this process, else by the shared
 * status poll (server/jobs/finish-watcher.ts: one query per tick for all waiting requests, for workers in other
 * processes). Returns the row as last read.
 */
export async function waitForAnalysis(deps: AppDeps, organisationId: string, analysisId: string, seconds: number): Promise<AnalysisRow> {
  const watch = watchForFinish(deps, organisationId, analysisId, seconds * 1000);
  try {
    const row = await requireAnalysisRow(deps, organisationId, analysisId);
    if (isTerminal(row.status)) return row;
    return (await watch.done) ?? (await requireAnalysisRow(deps, organisationId, analysisId));
  } finally {
    watch.cancel();
  }
}

/** A page in the requested order; the cursor is bound to the filters and the sort (another sort's cursor is a 400). */
export async function listAnalysesPage(deps: AppDeps, organisationId: string, query: AnalysisListQuery): Promise<Page<Omit<Analysis, 'result'>>> {
  const { limit, cursor, ...filters } = query;
  const binding = { list: 'analyses', organisationId, ...filters };
  const sort = sortSpecOf(query.sort);
  const after = decodeSortCursor(deps, binding, sort, cursor);
  const rows = await listAnalyses(deps.db, organisationId, {
    ...filters,
    createdFrom: filters.createdFrom ? new Date(filters.createdFrom) : undefined,
    createdTo: filters.createdTo ? new Date(filters.createdTo) : undefined,
    limit,
    sort,
    after,
  });
  const hasMore = rows.length > limit;
  const pageRows = hasMore ? rows.slice(0, limit) : rows;
  const last = pageRows.at(-1);
  return {
    data: pageRows.map((row) => {
      const { result: _result, ...rest } = presentAnalysis(row);
      return rest;
    }),
    hasMore,
    ...(hasMore && last ? { nextCursor: encodeSortCursor(deps, binding, { key: sort.keyOf(last), id: last.id }) } : {}),
  };
}

/** Cancels a queued or running analysis. A queued one is refunded (it never ran); a running one stays charged. */
export async function cancelAnalysis(deps: AppDeps, organisationId: string, analysisId: string): Promise<Analysis> {
  const row = await requireAnalysisRow(deps, organisationId, analysisId);
  const wasQueued = row.status === 'queued';
  const now = deps.clock.now();
  const canceled = await deps.db.transaction(async (tx) => {
    const changed = await markCanceled(tx, organisationId, analysisId, now);
    if (changed && wasQueued) await releaseAnalysis(deps, organisationId, analysisId, tx);
    return changed;
  });
  if (!canceled) {
    const current = await requireAnalysisRow(deps, organisationId, analysisId);
    throw new ApiProblem('analysis_not_cancelable', `The analysis has already finished (${current.status}); nothing to cancel.`, { extensions: { status: current.status } });
  }
  return getAnalysis(deps, organisationId, analysisId);
}

/** A new analysis with the origin's inputs and the given replacements, linked to it by `rerunOf`. */
export async function rerunAnalysis(
  deps: AppDeps,
  organisationId: string,
  analysisId: string,
  changes: Partial<Pick<CreateAnalysisRequest, 'options' | 'conditions' | 'channels' | 'tags'>> & { calibration?: CreateAnalysisRequest['calibration'] | null; mask?: CreateAnalysisRequest['mask'] | null },
): Promise<string> {
  const origin = await requireAnalysisRow(deps, organisationId, analysisId);
  const stored = origin.request as unknown as StoredAnalysisRequest;
  const request: CreateAnalysisRequest = { ...stored.original };
  for (const key of ['options', 'conditions', 'channels', 'tags'] as const) if (changes[key] !== undefined) (request as Record<string, unknown>)[key] = changes[key];
  if (changes.calibration !== undefined) request.calibration = changes.calibration ?? undefined;
  if (changes.mask !== undefined) request.mask = changes.mask ?? undefined;
  let capture = null;
  if (origin.captureId) {
    const row = await findCapture(deps.db, organisationId, origin.captureId);
    if (!row) throw new ApiProblem('analysis_input_mismatch', 'The origin\'s capture no longer exists.');
    capture = { id: row.id, sampleRateHz: row.sampleRateHz, channelCount: row.channelCount, durationSeconds: row.durationSeconds };
    request.captureId = row.id;
  }
  const prepared = await prepareAnalysis(deps, organisationId, request, capture, { rerunOf: origin.id });
  return enqueuePrepared(deps, organisationId, prepared);
}

/** One analysis as other modules read it (masks derived from golden units, production summaries). */
export interface AnalysisResultEntry {
  id: string;
  kind: AnalysisKind;
  status: AnalysisStatus;
  dut: Dut;
  tags: string[];
  createdAt: Date;
  /** The stored engine result; null unless status is succeeded. */
  result: AnalysisResult | null;
}

/**
 * Results of the given analyses of the organisation, in the order asked. Throws the not_found problem naming the
 * first id that does not exist in the organisation; analyses that have not succeeded come back with result null.
 */
export async function getAnalysisResults(deps: AppDeps, orgId: string, analysisIds: string[]): Promise<AnalysisResultEntry[]> {
  const rows = new Map((await findAnalyses(deps.db, orgId, [...new Set(analysisIds)])).map((row) => [row.id, row]));
  return analysisIds.map((id) => {
    const row = rows.get(id);
    if (!row) throw notFound(`analysis ${id}`);
    return {
      id: row.id,
      kind: row.kind as AnalysisKind,
      status: row.status as AnalysisStatus,
      dut: { ...(row.dutModel ? { model: row.dutModel } : {}), ...(row.dutSerial ? { serial: row.dutSerial } : {}), ...(row.dutLot ? { lot: row.dutLot } : {}) },
      tags: row.tags,
      createdAt: row.createdAt,
      result: row.status === 'succeeded' && row.resultJson ? (JSON.parse(row.resultJson) as AnalysisResult) : null,
    };
  });
}
