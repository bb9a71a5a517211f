import { readFile } from 'node:fs/promises';
import type { Request, Response } from 'express';
import { captureStats, isEngineError, readWav, signalStatsWarnings, type DecodedWav, type EngineError } from '@shared/dsp';
import type { Capture } from '@shared/schemas/captures';
import type { Page } from '@shared/schemas/pagination';
import type { Executor } from '@server/db/client';
import type { AppDeps } from '@server/deps';
import type { IdempotencyHandle } from '@server/http/idempotency';
import { multipartFingerprint } from '@server/http/idempotency';
import { recordStorageBytes } from '@server/modules/usage/usage.service';
import { ApiProblem, notFound } from '@server/http/api-problem';
import { decodeCursor, toPage } from '@server/http/pagination';
import type { Principal } from '@server/http/principal';
import { newId } from '@server/lib/ids';
import { blobStoreFor } from '@server/storage/blob-store-for';
import { presentCapture, channelStatsColumn } from './capture-presenter';
import {
  analysesUsingCapture,
  countCapturesWithBlob,
  deleteCaptureRow,
  findCapture,
  insertCapture,
  listCaptures,
  type CaptureRow,
} from './captures.repo';
import { receiveMultipart, type ReceivedFile } from './multipart-upload';
import { uploadLimitsFor, type UploadLimits } from './upload-limits';

const LIMIT_NAMES: Record<string, string> = {
  maxChannels: 'maxUploadChannels',
  maxDurationSeconds: 'maxUploadDurationSeconds',
  maxSampleRateHz: 'maxUploadSampleRateHz',
  minSampleRateHz: 'minSampleRateHz',
  maxBytes: 'maxUploadBytes',
};

function problemFromWavError(error: EngineError): ApiProblem {
  const limit = error.details?.limit;
  if (typeof limit === 'string') {
    const extensions = { engineCode: error.code, limit: LIMIT_NAMES[limit] ?? limit, allowed: error.details?.allowed, actual: error.details?.actual };
    if (limit === 'maxBytes') return new ApiProblem('payload_too_large', error.message, { extensions });
    return new ApiProblem('capture_over_limit', `${error.message} (plan limit ${extensions.limit}).`, { extensions });
  }
  return new ApiProblem('invalid_wav', error.message, { extensions: { engineCode: error.code } });
}

/** Decodes and checks the uploaded bytes; any failure is a 4xx naming the reason. */
function decodeUpload(bytes: Uint8Array, limits: UploadLimits): DecodedWav {
  if (bytes.length === 0) throw new ApiProblem('invalid_wav', 'The file is empty.', { extensions: { engineCode: 'wav_empty' } });
  try {
    return readWav(bytes, limits);
  } catch (error) {
    if (isEngineError(error)) throw problemFromWavError(error);
    throw error;
  }
}

function safeFilename(name: string): string {
  const base = name.split(/[\\/]/).pop() ?? '';
  const cleaned = base.replace(/[^\w.\- ]+/g, '_').slice(0, 200);
  return cleaned || 'capture.wav';
}

export interface DecodedCapture {
  wav: DecodedWav;
  stats: ReturnType<typeof captureStats>;
}

/** Decodes and checks received bytes against the plan's limits (4xx naming the reason on failure). */
export function decodeReceivedCapture(bytes: Uint8Array, limits: UploadLimits): DecodedCapture {
  const wav = decodeUpload(bytes, limits);
  return { wav, stats: captureStats(wav.channels) };
}

/**
 * Moves a decoded upload into the blob store and returns the row insert to run (in the caller's transaction, so
 * a refused request keeps no capture) and the blob clean-up for when that transaction fails.
 */
export async function commitDecodedCapture(deps: AppDeps, organisationId: string, file: ReceivedFile, decoded: DecodedCapture, captureId = newId('capture')) {
  const store = blobStoreFor(deps);
  // The received file was hashed while it arrived, in the store's temp folder: it is moved into place, not copied.
  const stored = await store.adopt(file);
  const { wav, stats } = decoded;
  const row: Omit<CaptureRow, 'organisationId'> = {
    id: captureId,
    filename: safeFilename(file.originalName),
    sha256: stored.sha256,
    sizeBytes: stored.bytes,
    sampleRateHz: wav.sampleRateHz,
    channelCount: wav.channelCount,
    frameCount: wav.frameCount,
    durationSeconds: wav.durationSeconds,
    format: { sampleEncoding: wav.sampleEncoding, bitsPerSample: wav.bitsPerSample, formatTag: wav.formatTag, extensible: wav.extensible },
    channelStats: channelStatsColumn(stats),
    warnings: signalStatsWarnings(stats) as unknown as Record<string, unknown>[],
    createdAt: deps.clock.now(),
  };
  // Storage is charged first (429 when over the plan) in its own short transaction, refunded if the insert fails.
  try {
    await recordStorageBytes(deps, organisationId, stored.bytes);
  } catch (error) {
    if ((await countCapturesWithBlob(deps.db, stored.sha256)) === 0) await store.delete(stored.sha256);
    throw error;
  }
  return {
    row,
    insert: async (tx: Executor) => {
      await insertCapture(tx, organisationId, row);
    },
    rollbackBlob: async () => {
      await recordStorageBytes(deps, organisationId, -stored.bytes).catch(() => undefined);
      if ((await countCapturesWithBlob(deps.db, stored.sha256)) === 0) await store.delete(stored.sha256);
    },
  };
}

/** Validates a received file, stores it and records its metadata; a refused file leaves neither blob nor row. */
export async function storeReceivedCapture(deps: AppDeps, organisationId: string, file: ReceivedFile, limits: UploadLimits): Promise<Capture> {
  const decoded = decodeReceivedCapture(await readFile(file.path), limits);
  const commit = await commitDecodedCapture(deps, organisationId, file, decoded);
  try {
    await deps.db.transaction((tx) => commit.insert(tx));
  } catch (error) {
    await commit.rollbackBlob();
    throw error;
  }
  return presentCapture({ ...commit.row, organisationId });
}

/** POST /captures: multipart upload of one WAV in the part `file`. */
export async function uploadCapture(deps: AppDeps, principal: Principal, req: Request, res: Response, idempotency: IdempotencyHandle): Promise<Capture> {
  const limits = await uploadLimitsFor(deps, principal.organisationId);
  const received = await receiveMultipart(req, res, { tempDir: blobStoreFor(deps).tempDir, maxBytes: limits.maxBytes });
  try {
    if (!received.file) throw new ApiProblem('multipart_invalid', 'The upload has no part named "file" holding the WAV.');
    await idempotency.claim(multipartFingerprint({ fields: received.fields, files: [{ field: 'file', sha256: received.file.sha256 }] }));
    return await storeReceivedCapture(deps, principal.organisationId, received.file, limits);
  } finally {
    await received.discard();
  }
}

export async function getCapture(deps: AppDeps, organisationId: string, captureId: string): Promise<Capture> {
  const row = await findCapture(deps.db, organisationId, captureId);
  if (!row) throw notFound('capture');
  return presentCapture(row);
}

export async function listCapturesPage(deps: AppDeps, organisationId: string, query: { limit: number; cursor?: string }): Promise<Page<Capture>> {
  const binding = { list: 'captures', organisationId };
  const after = decodeCursor(deps, binding, query.cursor);
  const rows = await listCaptures(deps.db, organisationId, { limit: query.limit, after });
  return toPage(deps, binding, rows, query.limit, (row) => row, presentCapture);
}

/** The stored bytes, exactly as uploaded, with the capture's metadata. */
export async function openCaptureDownload(deps: AppDeps, organisationId: string, captureId: string) {
  const row = await findCapture(deps.db, organisationId, captureId);
  if (!row) throw notFound('capture');
  return { capture: presentCapture(row), stream: await blobStoreFor(deps).get(row.sha256) };
}

/** Deletes a capture no analysis uses; the blob goes when no capture points at it any more. */
export async function deleteCapture(deps: AppDeps, organisationId: string, captureId: string): Promise<void> {
  const row = await findCapture(deps.db, organisationId, captureId);
  if (!row) throw notFound('capture');
  const users = await analysesUsingCapture(deps.db, organisationId, captureId, 10);
  if (users.length > 0) {
    throw new ApiProblem(
      'capture_in_use',
      `The capture is used by ${users.length === 10 ? 'at least 10' : users.length} analysis(es) (${users.join(', ')}); their results refer to it. Delete those analyses first or keep the capture.`,
      { extensions: { analysisIds: users } },
    );
  }
  try {
    await deleteCaptureRow(deps.db, organisationId, captureId);
  } catch (error) {
    // An analysis created meanwhile holds a foreign key to the capture (MariaDB errno 1451).
    if ((error as { errno?: number }).errno === 1451 || (error as { cause?: { errno?: number } }).cause?.errno === 1451) {
      throw new ApiProblem('capture_in_use', 'An analysis started using the capture while it was being deleted; it was kept.');
    }
    throw error;
  }
  await recordStorageBytes(deps, organisationId, -row.sizeBytes);
  if ((await countCapturesWithBlob(deps.db, row.sha256)) === 0) await blobStoreFor(deps).delete(row.sha256);
}

/**
 * A stored capture decoded for analysis: its metadata (as the API returns it) and the samples, one Float64Array
 * per channel, full scale = ±1. Throws the not_found problem for an id outside the organisation.
 */
export async function loadCaptureChannels(deps: AppDeps, orgId: string, captureId: string): Promise<{ capture: Capture; wav: DecodedWav }> {
  const row = await findCapture(deps.db, orgId, captureId);
  if (!row) throw notFound('capture');
  const bytes = await blobStoreFor(deps).read(row.sha256);
  return { capture: presentCapture(row), wav: readWav(bytes, { maxBytes: bytes.length + 1, maxDurationSeconds: 1e9, maxChannels: 1024, maxSampleRateHz: 1e7 }) };
}

/** Raw stored bytes of a capture (the job runner hands them to an engine thread, which decodes them). */
export async function readCaptureBytes(deps: AppDeps, orgId: string, captureId: string): Promise<{ row: CaptureRow; bytes: Buffer }> {
  const row = await findCapture(deps.db, orgId, captureId);
  if (!row) throw notFound('capture');
  return { row, bytes: await blobStoreFor(deps).read(row.sha256) };
}

export { findCapture };
