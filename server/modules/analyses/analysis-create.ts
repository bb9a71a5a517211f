import { readFile } from 'node:fs/promises';
import type { Request, Response } from 'express';
import { createAnalysisRequestSchema, type CreateAnalysisRequest } from '@shared/schemas/analyses';
import type { StimulusType } from '@shared/schemas/stimuli';
import type { AppDeps } from '@server/deps';
import { ApiProblem, notFound } from '@server/http/api-problem';
import type { IdempotencyHandle } from '@server/http/idempotency';
import { multipartFingerprint, rawBodyFingerprint } from '@server/http/idempotency';
import type { Principal } from '@server/http/principal';
import { parseRequestPart } from '@server/http/validation';
import { newId } from '@server/lib/ids';
import { findCapture } from '@server/modules/captures/captures.repo';
import { commitDecodedCapture, decodeReceivedCapture } from '@server/modules/captures/captures.service';
import { receiveMultipart } from '@server/modules/captures/multipart-upload';
import { uploadLimitsFor } from '@server/modules/captures/upload-limits';
import { resolveCalibrationForAnalysis } from '@server/modules/calibrations/calibrations.service';
import { getMaskForAnalysis } from '@server/modules/masks/masks.service';
import { designFromRequest, requireStimulusRow } from '@server/modules/stimuli/stimuli.service';
import { releaseAnalysis, reserveAnalysis } from '@server/modules/usage/usage.service';
import { blobStoreFor } from '@server/storage/blob-store-for';
import type { AnalysisJobSpec } from '@server/jobs/engine/job-spec';
import { notifyJobQueued } from '@server/jobs/job-notifier';
import { insertAnalysis, type AnalysisRow } from './analyses.repo';
import { validateAnalysisSpec, type CaptureFacts } from './analysis-validation';
import { resolveSensitivitySource } from './sensitivity-source';

/** What is stored in the row's `request` column: the engine spec, the references and the public summary. */
export interface StoredAnalysisRequest {
  spec: AnalysisJobSpec;
  calibration: CreateAnalysisRequest['calibration'] | null;
  mask: CreateAnalysisRequest['mask'] | null;
  summary: Omit<CreateAnalysisRequest, 'spectrum'>;
  original: CreateAnalysisRequest;
}

async function resolveStimulus(deps: AppDeps, organisationId: string, request: CreateAnalysisRequest) {
  if (request.stimulusId && request.stimulus) throw new ApiProblem('validation_failed', 'Give stimulusId or stimulus, not both.', { errors: [{ in: 'body', pointer: '#/stimulus', detail: 'Remove one of stimulusId and stimulus.' }] });
  if (request.stimulusId) {
    const row = await requireStimulusRow(deps, organisationId, request.stimulusId).catch(() => {
      throw new ApiProblem('analysis_input_mismatch', `No stimulus ${request.stimulusId} exists in the active organisation.`, { errors: [{ in: 'body', pointer: '#/stimulusId', detail: 'Unknown stimulus.' }] });
    });
    return { stimulus: { type: row.type as StimulusType, parameters: row.parameters }, pointer: ['stimulusId'], stimulusId: row.id };
  }
  if (request.stimulus) {
    const design = designFromRequest(request.stimulus.type, request.stimulus.parameters, ['stimulus']);
    return { stimulus: { type: request.stimulus.type, parameters: design.parameters }, pointer: ['stimulus', 'parameters', 'sampleRateHz'], stimulusId: null };
  }
  return { stimulus: null, pointer: ['stimulusId'], stimulusId: null };
}

export function specOf(request: CreateAnalysisRequest, stimulus: AnalysisJobSpec['stimulus']): AnalysisJobSpec {
  return {
    kind: request.kind,
    stimulus,
    channels: { measurement: request.channels?.measurement ?? 0, reference: request.channels?.reference ?? null },
    conditions: request.conditions ?? {},
    options: request.options ?? {},
    ...(request.spectrum ? { spectrum: request.spectrum } : {}),
    ...(request.calibrator ? { calibrator: request.calibrator } : {}),
    ...(request.sensitivity ? { sensitivity: request.sensitivity } : {}),
  };
}

export interface PreparedAnalysis {
  row: Omit<AnalysisRow, 'organisationId'>;
}

/** Validates the request against its capture and stimulus and builds the row to insert (status queued). */
export async function prepareAnalysis(
  deps: AppDeps,
  organisationId: string,
  request: CreateAnalysisRequest,
  capture: (CaptureFacts & { id: string | null }) | null,
  extra: { rerunOf?: string } = {},
): Promise<PreparedAnalysis> {
  const derived = request.kind === 'sensitivity' && request.sensitivity?.responseAnalysisId ? await resolveSensitivitySource(deps, organisationId, request) : null;
  const { stimulus, pointer, stimulusId } = await resolveStimulus(deps, organisationId, request);
  const spec = specOf(request, stimulus);
  if (derived) {
    spec.conditions = derived.conditions;
    spec.sensitivity = { ...spec.sensitivity!, source: derived.source };
  } else {
    validateAnalysisSpec(request, spec, capture, pointer);
  }
  // Unknown calibrations and masks are refused now rather than failing the job later.
  await resolveCalibrationForAnalysis(deps, organisationId, request.calibration ?? null);
  if (request.mask) await getMaskForAnalysis(deps, organisationId, request.mask.maskId, request.mask.version);
  const { spectrum: _spectrum, ...summary } = request;
  const stored: StoredAnalysisRequest = { spec, calibration: request.calibration ?? null, mask: request.mask ?? null, summary, original: request };
  const now = deps.clock.now();
  return {
    row: {
      id: newId('analysis'),
      kind: request.kind,
      status: 'queued',
      progress: 0,
      captureId: capture?.id ?? null,
      stimulusId,
      request: stored as unknown as Record<string, unknown>,
      dutModel: request.dut?.model ?? null,
      dutSerial: request.dut?.serial ?? null,
      dutLot: request.dut?.lot ?? null,
      tags: request.tags ?? [],
      rerunOf: extra.rerunOf ?? null,
      audioSeconds: capture?.durationSeconds ?? 0,
      attempts: 0,
      leaseOwner: null,
      leaseExpiresAt: null,
      cancelRequested: 0,
      resultJson: null,
      error: null,
      verdict: null,
      worstMarginDb: null,
      calibration: null,
      engineVersion: null,
      createdAt: now,
      updatedAt: now,
      startedAt: null,
      finishedAt: null,
    },
  };
}

/**
 * Charges the analysis to the plan (atomic conditional increment; 429 when over), then inserts the job (and an
 * uploaded capture) in one transaction; if that fails the charge is refunded, so a refused request costs nothing.
 * The charge runs in its own short transaction: holding a pooled connection open while the usage service takes
 * another would exhaust the pool under many concurrent requests.
 */
export async function enqueuePrepared(deps: AppDeps, organisationId: string, prepared: PreparedAnalysis, before?: (tx: Parameters<Parameters<AppDeps['db']['transaction']>[0]>[0]) => Promise<void>) {
  const analysisId = prepared.row.id;
  await reserveAnalysis(deps, organisationId, { audioSeconds: prepared.row.audioSeconds, analysisId });
  try {
    await deps.db.transaction(async (tx) => {
      if (before) await before(tx);
      await insertAnalysis(tx, organisationId, prepared.row);
    });
  } catch (error) {
    await releaseAnalysis(deps, organisationId, analysisId).catch(() => false);
    throw error;
  }
  notifyJobQueued();
  return analysisId;
}

async function captureFacts(deps: AppDeps, organisationId: string, captureId: string | undefined) {
  if (!captureId) return null;
  const row = await findCapture(deps.db, organisationId, captureId);
  if (!row) throw notFound('capture');
  return { id: row.id, sampleRateHz: row.sampleRateHz, channelCount: row.channelCount, durationSeconds: row.durationSeconds };
}

/**
 * POST /analyses, JSON or multipart (part `analysis` = the JSON request, part `file` = the WAV). With a file, the
 * capture row is written in the same transaction as the analysis, so a refused analysis keeps no capture either.
 */
export async function createAnalysisFromHttp(deps: AppDeps, principal: Principal, req: Request, res: Response, idempotency: IdempotencyHandle): Promise<string> {
  const organisationId = principal.organisationId;
  if (!req.is('multipart/form-data')) {
    if (req.headers['content-length'] && req.headers['content-length'] !== '0' && !req.is(['application/json', 'application/*+json'])) {
      throw new ApiProblem('unsupported_media_type', 'Send the analysis as JSON, or as multipart/form-data with parts "analysis" (JSON) and "file" (WAV).');
    }
    const request = parseRequestPart(createAnalysisRequestSchema, req.body ?? {}, 'body');
    await idempotency.claim(rawBodyFingerprint(req));
    const prepared = await prepareAnalysis(deps, organisationId, request, await captureFacts(deps, organisationId, request.captureId));
    return enqueuePrepared(deps, organisationId, prepared);
  }
  const limits = await uploadLimitsFor(deps, organisationId);
  const received = await receiveMultipart(req, res, { tempDir: blobStoreFor(deps).tempDir, maxBytes: limits.maxBytes });
  try {
    let json: unknown;
    try {
      json = JSON.parse(received.fields.analysis ?? '{}');
    } catch {
      throw new ApiProblem('malformed_json', 'The part "analysis" is not valid JSON.');
    }
    const request = parseRequestPart(createAnalysisRequestSchema, json, 'body');
    await idempotency.claim(multipartFingerprint({ fields: received.fields, files: received.file ? [{ field: 'file', sha256: received.file.sha256 }] : [] }));
    if (!received.file) {
      const prepared = await prepareAnalysis(deps, organisationId, request, await captureFacts(deps, organisationId, request.captureId));
      return await enqueuePrepared(deps, organisationId, prepared);
    }
    if (request.captureId) throw new ApiProblem('validation_failed', 'Give captureId or upload a file, not both.', { errors: [{ in: 'body', pointer: '#/captureId', detail: 'Remove captureId when uploading.' }] });
    const decoded = decodeReceivedCapture(await readFile(received.file.path), limits);
    const captureId = newId('capture');
    const prepared = await prepareAnalysis(deps, organisationId, { ...request, captureId }, { id: captureId, sampleRateHz: decoded.wav.sampleRateHz, channelCount: decoded.wav.channelCount, durationSeconds: decoded.wav.durationSeconds });
    const commit = await commitDecodedCapture(deps, organisationId, received.file, decoded, captureId);
    try {
      return await enqueuePrepared(deps, organisationId, prepared, commit.insert);
    } catch (error) {
      await commit.rollbackBlob();
      throw error;
    }
  } finally {
    await received.discard();
  }
}
