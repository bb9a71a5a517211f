import { z } from 'zod';
import {
  analysisExportQuerySchema,
  analysisListQuerySchema,
  analysisPageSchema,
  analysisParamsSchema,
  analysisSchema,
  createAnalysisRequestSchema,
  preferHeadersSchema,
  rerunAnalysisRequestSchema,
} from '@shared/schemas/analyses';
import { captureUploadSchema } from '@shared/schemas/captures';
import { ApiProblem } from '@server/http/api-problem';
import { defineRoute } from '@server/http/define-route';
import type { AppDeps } from '@server/deps';
import type { Response } from 'express';
import { analysisCsv } from './analysis-export';
import { createAnalysisFromHttp } from './analysis-create';
import { presentAnalysis } from './analysis-presenter';
import { cancelAnalysis, getAnalysis, isTerminal, listAnalysesPage, requireAnalysisRow, rerunAnalysis, waitForAnalysis } from './analyses.service';
import { preferredWaitSeconds } from './prefer-wait';

const location = { location: { description: 'URL of the analysis.', schema: z.string() } };
const pollAfter = { 'retry-after': { description: 'Seconds to wait before polling again; sent while the analysis is queued or running.', schema: z.string().optional() } };
const waitHeaders = {
  ...location,
  ...pollAfter,
  'preference-applied': { description: '`wait=N` when the request sent `Prefer: wait=N` (RFC 7240).', schema: z.string().optional() },
  vary: { description: '`Prefer` when the request sent `Prefer: wait=N`.', schema: z.string().optional() },
};
const multipartAnalysisSchema = captureUploadSchema
  .extend({ analysis: z.string().meta({ description: 'The CreateAnalysisRequest as JSON text (without captureId).' }) })
  .meta({ id: 'AnalysisUpload', description: 'multipart/form-data: part `analysis` (JSON) and part `file` (the WAV).' });

/** 202 with the monitor, or 200 with the finished analysis when `Prefer: wait=N` was met in time. */
async function acceptedReply(deps: AppDeps, organisationId: string, analysisId: string, preferHeader: string | undefined, res: Response) {
  const wait = preferredWaitSeconds(preferHeader);
  const headers: Record<string, string> = { Location: `/v1/analyses/${analysisId}` };
  if (wait !== null) {
    headers['Preference-Applied'] = `wait=${wait}`;
    headers.Vary = 'Prefer';
    const row = await waitForAnalysis(deps, organisationId, analysisId, wait);
    // A finished analysis never changes again: its idempotency record keeps only the id, not a second copy of the
    // result (results run to hundreds of kB), and a replay rebuilds the same body from the row.
    if (isTerminal(row.status)) return { status: 200 as const, body: presentAnalysis(row), headers, replayFrom: row.id };
    res.setHeader('Retry-After', '2');
    return { status: 202 as const, body: presentAnalysis(row), headers };
  }
  headers['Retry-After'] = '2';
  return { status: 202 as const, body: await getAnalysis(deps, organisationId, analysisId), headers };
}

/** Rebuilds a finished analysis stored by reference in an idempotency record (see acceptedReply). */
const replayFinishedAnalysis = (deps: AppDeps, organisationId: string, analysisId: string) => getAnalysis(deps, organisationId, analysisId);

const WAIT_NOTE =
  '`Prefer: wait=N` (RFC 7240, N ≤ 60 s) holds the request until the analysis finishes, then answers 200 with the ' +
  'finished analysis and `Preference-Applied: wait=N`; if it is not finished in time the answer is the usual 202.';

export const analysisRoutes = [
  defineRoute({
    method: 'post',
    path: '/analyses',
    operationId: 'createAnalysis',
    summary: 'Start an analysis',
    description:
      'JSON (capture by `captureId`, or `spectrum` for kind spectrum) or multipart/form-data with the WAV uploaded in ' +
      'the same request (parts `analysis` and `file`). Everything checkable is checked now (400/422 with JSON ' +
      'pointers: unknown capture or stimulus, channel out of range, stimulus rate ≠ capture rate, engine options); ' +
      'the analysis is charged to the plan atomically (429 quota_exceeded when over, and nothing is charged for a ' +
      `refused request). Answers 202 with \`Location\`. ${WAIT_NOTE} Results without a calibration are relative ` +
      '(dB re the stimulus / dBFS) and carry the `uncalibrated` warning; absolute levels are only as good as the ' +
      "calibration — follow the lab's own procedures.",
    tags: ['Analyses'],
    permission: 'analyses:write',
    idempotency: { mode: 'required', fingerprint: 'handler' },
    resolveReplay: replayFinishedAnalysis,
    request: {
      headers: preferHeadersSchema,
      bodyContent: { 'application/json': createAnalysisRequestSchema, 'multipart/form-data': multipartAnalysisSchema },
    },
    responses: {
      200: { description: 'Finished within the Prefer: wait time.', schema: analysisSchema, headers: waitHeaders },
      202: { description: 'Accepted; poll Location.', schema: analysisSchema, headers: waitHeaders },
    },
    problems: ['not_found', 'invalid_parameters', 'analysis_input_mismatch', 'multipart_invalid', 'payload_too_large', 'invalid_wav', 'capture_over_limit', 'calibration_not_found', 'mask_not_found', 'quota_exceeded'],
    handler: async ({ deps, principal, req, res, idempotency }) => {
      const analysisId = await createAnalysisFromHttp(deps, principal, req, res, idempotency);
      return acceptedReply(deps, principal.organisationId, analysisId, req.get('prefer'), res);
    },
  }),
  defineRoute({
    method: 'get',
    path: '/analyses',
    operationId: 'listAnalyses',
    summary: 'List analyses',
    description:
      'Without results (GET one for the result). Filters combine with AND; `tag` matches one tag. `sort` orders the ' +
      'whole list on the server (default `-createdAt`, newest first); `nextCursor` continues in the same order and ' +
      'filters, and a cursor used with another sort or other filters is a 400 `invalid_cursor`.',
    tags: ['Analyses'],
    permission: 'analyses:read',
    request: { query: analysisListQuerySchema },
    responses: { 200: { description: 'A page of analyses.', schema: analysisPageSchema } },
    problems: ['invalid_cursor'],
    handler: async ({ deps, principal, query }) => ({ status: 200, body: await listAnalysesPage(deps, principal.organisationId, query) }),
  }),
  defineRoute({
    method: 'get',
    path: '/analyses/{analysisId}',
    operationId: 'getAnalysis',
    summary: 'Get an analysis',
    description: 'Status, progress and, when succeeded, the result exactly as stored. `Retry-After: 2` while not finished.',
    tags: ['Analyses'],
    permission: 'analyses:read',
    request: { params: analysisParamsSchema },
    responses: { 200: { description: 'The analysis.', schema: analysisSchema, headers: pollAfter } },
    problems: ['not_found'],
    handler: async ({ deps, principal, params }) => {
      const analysis = await getAnalysis(deps, principal.organisationId, params.analysisId);
      return { status: 200, body: analysis, headers: (isTerminal(analysis.status) ? {} : { 'Retry-After': '2' }) as Record<string, string> };
    },
  }),
  defineRoute({
    method: 'get',
    path: '/analyses/{analysisId}/export',
    operationId: 'exportAnalysis',
    summary: 'Export a result as JSON or CSV',
    description:
      'json: the stored result text, byte for byte. csv: `#` comment lines (analysis, DUT, engine version, calibration, ' +
      'every convention and warning), then a header row and one row per frequency with every curve as a column.',
    tags: ['Analyses'],
    permission: 'analyses:read',
    request: { params: analysisParamsSchema, query: analysisExportQuerySchema },
    responses: { 200: { description: 'The exported result (application/json or text/csv).', contentType: 'text/csv' } },
    problems: ['not_found', 'analysis_not_succeeded'],
    handler: async ({ deps, principal, params, query, res }) => {
      const row = await requireAnalysisRow(deps, principal.organisationId, params.analysisId);
      if (row.status !== 'succeeded' || !row.resultJson) {
        throw new ApiProblem('analysis_not_succeeded', `The analysis is ${row.status}; only a succeeded analysis has a result to export.`);
      }
      const csv = query.format === 'csv';
      res.status(200);
      res.setHeader('Content-Type', csv ? 'text/csv; charset=utf-8' : 'application/json; charset=utf-8');
      res.setHeader('Content-Disposition', `attachment; filename="${row.id}.${csv ? 'csv' : 'json'}"`);
      res.end(csv ? analysisCsv(row) : row.resultJson);
      return { status: 200 };
    },
  }),
  defineRoute({
    method: 'post',
    path: '/analyses/{analysisId}/rerun',
    operationId: 'rerunAnalysis',
    summary: 'Re-run with other options',
    description: `A new analysis of the same inputs with the members given replaced; it names its origin in \`rerunOf\`. Charged like a new analysis. ${WAIT_NOTE}`,
    tags: ['Analyses'],
    permission: 'analyses:write',
    idempotency: 'required',
    resolveReplay: replayFinishedAnalysis,
    request: { params: analysisParamsSchema, body: rerunAnalysisRequestSchema, headers: preferHeadersSchema },
    responses: { 200: { description: 'Finished within the Prefer: wait time.', schema: analysisSchema, headers: waitHeaders }, 202: { description: 'Accepted.', schema: analysisSchema, headers: waitHeaders } },
    problems: ['not_found', 'invalid_parameters', 'analysis_input_mismatch', 'calibration_not_found', 'mask_not_found', 'quota_exceeded'],
    handler: async ({ deps, principal, params, body, req, res }) => {
      const analysisId = await rerunAnalysis(deps, principal.organisationId, params.analysisId, body);
      return acceptedReply(deps, principal.organisationId, analysisId, req.get('prefer'), res);
    },
  }),
  defineRoute({
    method: 'post',
    path: '/analyses/{analysisId}/cancel',
    operationId: 'cancelAnalysis',
    summary: 'Cancel a queued or running analysis',
    description: 'A queued analysis is canceled and refunded; a running one is stopped (its result discarded) and stays charged. 409 when already finished.',
    tags: ['Analyses'],
    permission: 'analyses:write',
    request: { params: analysisParamsSchema },
    responses: { 200: { description: 'The canceled analysis.', schema: analysisSchema } },
    problems: ['not_found', 'analysis_not_cancelable'],
    handler: async ({ deps, principal, params }) => ({ status: 200, body: await cancelAnalysis(deps, principal.organisationId, params.analysisId) }),
  }),
];
