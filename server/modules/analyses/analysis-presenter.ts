import type { Analysis, AnalysisKind, AnalysisStatus } from '@shared/schemas/analyses';
import type { AnalysisRow } from './analyses.repo';

interface StoredRequest {
  summary: Analysis['request'];
}

/** The API shape of a row; `result` is parsed from the stored text (JSON round-trips doubles exactly). */
export function presentAnalysis(row: Omit<AnalysisRow, 'resultJson'> & { resultJson?: string | null }): Analysis {
  const result = row.resultJson ? (JSON.parse(row.resultJson) as Record<string, unknown>) : null;
  return {
    id: row.id,
    kind: row.kind as AnalysisKind,
    status: row.status as AnalysisStatus,
    progress: row.progress,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
    startedAt: row.startedAt?.toISOString() ?? null,
    finishedAt: row.finishedAt?.toISOString() ?? null,
    captureId: row.captureId,
    stimulusId: row.stimulusId,
    request: (row.request as unknown as StoredRequest).summary,
    dut: { model: row.dutModel, serial: row.dutSerial, lot: row.dutLot },
    tags: row.tags,
    rerunOf: row.rerunOf,
    attempts: row.attempts,
    engineVersion: row.engineVersion,
    calibration: (row.calibration as Analysis['calibration']) ?? null,
    verdict: (row.verdict as Analysis['verdict']) ?? null,
    worstMarginDb: row.worstMarginDb ?? null,
    warnings: ((result?.warnings as Analysis['warnings']) ?? []),
    conventions: (result?.conventions as Analysis['conventions']) ?? null,
    result,
    error: row.error ? ({ type: `https://sweepline.example/problems/${String(row.error.code)}`, title: '', status: 422, detail: '', instance: `/v1/analyses/${row.id}`, requestId: '', ...row.error } as Analysis['error']) : null,
  };
}
