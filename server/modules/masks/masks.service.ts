import { evaluateMask, isEngineError, referenceLevel, validateMask, type MagnitudeCurve, type MaskVerdict, type ReferenceLevelSpec, type ToleranceMask } from '@shared/dsp';
import type { CreateMaskRequest, Mask, MaskVersion, MaskVersionContent } from '@shared/schemas/masks';
import type { Page } from '@shared/schemas/pagination';
import type { Executor } from '@server/db/client';
import type { AppDeps } from '@server/deps';
import { ApiProblem, notFound } from '@server/http/api-problem';
import { decodeCursor, toPage } from '@server/http/pagination';
import type { Actor } from '@server/http/principal';
import { newId } from '@server/lib/ids';
import { recordAuditEventBy } from '@server/modules/audit/audit.service';
import { problemFromEngineError } from '@server/modules/analyses/engine-problem';
import { presentMask, presentMaskSummary, presentMaskVersion } from './mask-presenter';
import {
  advanceLatestVersion,
  findMask,
  findMaskForUpdate,
  findMaskVersion,
  insertMask,
  insertMaskVersion,
  listMasks,
  listMaskVersions,
  type MaskVersionRow,
} from './masks.repo';

/** Engine "mask.upper[3].levelDb" → request "#/upper/3/levelDb". */
function rewriteMaskField(segments: string[]): string[] {
  return segments[0] === 'mask' ? segments.slice(1) : segments;
}

/** Checks limits with the engine (ascending, finite, upper ≥ lower) and the reference rule; 422 mask_invalid. */
export function checkMaskContent(content: MaskVersionContent): void {
  if (content.levelReference === 'relative' && !content.referenceLevel) {
    throw new ApiProblem('mask_invalid', 'A relative mask needs referenceLevel: the curve level its limits are relative to.', {
      errors: [{ in: 'body', pointer: '#/referenceLevel', detail: 'Required when levelReference is relative.' }],
    });
  }
  if (content.levelReference === 'absolute' && content.referenceLevel) {
    throw new ApiProblem('mask_invalid', 'An absolute mask takes no referenceLevel; its limits are in the curve\'s own dB.', {
      errors: [{ in: 'body', pointer: '#/referenceLevel', detail: 'Remove it, or make the mask relative.' }],
    });
  }
  if (content.referenceLevel?.kind === 'band_mean' && !(content.referenceLevel.toHz > content.referenceLevel.fromHz)) {
    throw new ApiProblem('mask_invalid', 'referenceLevel.toHz must be above fromHz.', {
      errors: [{ in: 'body', pointer: '#/referenceLevel/toHz', detail: 'Must be above fromHz.' }],
    });
  }
  try {
    validateMask(engineMask(content));
  } catch (error) {
    if (isEngineError(error)) throw problemFromEngineError(error, { code: 'mask_invalid', rewrite: rewriteMaskField });
    throw error;
  }
}

function engineMask(content: Pick<MaskVersionContent, 'levelReference' | 'upper' | 'lower'>): ToleranceMask {
  return {
    levelReference: content.levelReference,
    ...(content.upper ? { upper: content.upper } : {}),
    ...(content.lower ? { lower: content.lower } : {}),
  };
}

export interface NewVersionInput extends MaskVersionContent {
  derivation?: Record<string, unknown> | null;
}

/** Appends the next version under the mask row's lock; earlier versions are never touched. */
async function appendVersion(db: Executor, orgId: string, maskId: string, input: NewVersionInput, at: Date): Promise<number> {
  const mask = await findMaskForUpdate(db, orgId, maskId);
  if (!mask) throw notFound('mask');
  const version = mask.latestVersion + 1;
  await insertMaskVersion(db, orgId, versionRow(maskId, version, input, at));
  await advanceLatestVersion(db, orgId, maskId, version, at);
  return version;
}

function versionRow(maskId: string, version: number, input: NewVersionInput, at: Date) {
  return {
    maskId,
    version,
    levelReference: input.levelReference,
    reference: (input.referenceLevel as Record<string, unknown> | undefined) ?? null,
    upper: input.upper ?? null,
    lower: input.lower ?? null,
    derivation: input.derivation ?? null,
    note: input.note ?? null,
    createdAt: at,
  };
}

function auditDetails(input: NewVersionInput, version: number) {
  return { version, levelReference: input.levelReference, note: input.note ?? null, derivedFrom: (input.derivation?.analysisIds as string[] | undefined) ?? null };
}

export async function createMaskWithVersion(deps: AppDeps, orgId: string, name: string, input: NewVersionInput, actor?: Actor): Promise<Mask> {
  checkMaskContent(input);
  const id = newId('mask');
  const now = deps.clock.now();
  await deps.db.transaction(async (tx) => {
    await insertMask(tx, orgId, { id, name, latestVersion: 1, createdAt: now, updatedAt: now });
    await insertMaskVersion(tx, orgId, versionRow(id, 1, input, now));
    await recordAuditEventBy(tx, orgId, actor, { action: 'mask.created', objectType: 'mask', objectId: id, details: { name, ...auditDetails(input, 1) } }, now);
  });
  return getMask(deps, orgId, id);
}

export async function createMask(deps: AppDeps, orgId: string, input: CreateMaskRequest, actor?: Actor): Promise<Mask> {
  const { name, ...content } = input;
  return createMaskWithVersion(deps, orgId, name, content, actor);
}

export async function addMaskVersion(deps: AppDeps, orgId: string, maskId: string, input: NewVersionInput, actor?: Actor): Promise<MaskVersion> {
  checkMaskContent(input);
  const now = deps.clock.now();
  const version = await deps.db.transaction(async (tx) => {
    const added = await appendVersion(tx, orgId, maskId, input, now);
    await recordAuditEventBy(tx, orgId, actor, { action: 'mask.version_created', objectType: 'mask', objectId: maskId, details: auditDetails(input, added) }, now);
    return added;
  });
  const row = await findMaskVersion(deps.db, orgId, maskId, version);
  return presentMaskVersion(row!);
}

export async function getMask(deps: AppDeps, orgId: string, maskId: string): Promise<Mask> {
  const mask = await findMask(deps.db, orgId, maskId);
  if (!mask) throw notFound('mask');
  const current = await findMaskVersion(deps.db, orgId, maskId, mask.latestVersion);
  return presentMask(mask, current!);
}

export async function listMasksPage(deps: AppDeps, orgId: string, query: { limit: number; cursor?: string }): Promise<Page<Omit<Mask, 'current'>>> {
  const binding = { list: 'masks', organisationId: orgId };
  const rows = await listMasks(deps.db, orgId, { limit: query.limit, after: decodeCursor(deps, binding, query.cursor) });
  return toPage(deps, binding, rows, query.limit, (row) => row, presentMaskSummary);
}

export async function listVersions(deps: AppDeps, orgId: string, maskId: string): Promise<MaskVersion[]> {
  if (!(await findMask(deps.db, orgId, maskId))) throw notFound('mask');
  return (await listMaskVersions(deps.db, orgId, maskId)).map(presentMaskVersion);
}

export async function getVersion(deps: AppDeps, orgId: string, maskId: string, version: number): Promise<MaskVersion> {
  const row = await findMaskVersion(deps.db, orgId, maskId, version);
  if (!row) throw notFound('mask version');
  return presentMaskVersion(row);
}

/** A mask version as the analysis worker applies it. */
export interface ResolvedMask {
  id: string;
  version: number;
  name: string;
  mask: ToleranceMask;
  /** For relative masks: the curve level that counts as 0 dB; null for absolute masks. */
  referenceLevel: ReferenceLevelSpec | null;
}

function resolved(name: string, row: MaskVersionRow): ResolvedMask {
  const reference = row.reference as (ReferenceLevelSpec & { average?: 'db' | 'power' }) | null;
  return {
    id: row.maskId,
    version: row.version,
    name,
    mask: engineMask({ levelReference: row.levelReference, upper: row.upper ?? undefined, lower: row.lower ?? undefined }),
    referenceLevel: reference?.kind === 'band_mean' ? { ...reference, average: reference.average ?? 'power' } : reference,
  };
}

/**
 * The mask an analysis names: the given version, or the latest one. Unknown mask or version → 422
 * mask_not_found (pointer #/mask). The version returned is immutable, so a verdict can name it for good.
 */
export async function getMaskForAnalysis(deps: AppDeps, orgId: string, maskId: string, version?: number): Promise<ResolvedMask> {
  const mask = await findMask(deps.db, orgId, maskId);
  const row = mask ? await findMaskVersion(deps.db, orgId, maskId, version ?? mask.latestVersion) : undefined;
  if (!mask || !row) {
    throw new ApiProblem('mask_not_found', `No tolerance mask ${maskId}${version ? ` version ${version}` : ''} exists in the active organisation.`, {
      errors: [{ in: 'body', pointer: version ? '#/mask/version' : '#/mask/maskId', detail: 'Create the mask first (POST /v1/masks).' }],
    });
  }
  return resolved(mask.name, row);
}

/**
 * Convenience for the worker: the verdict of a curve against a resolved mask, the reference level of a relative
 * mask read from the curve itself. Throws EngineError on a curve the mask does not overlap.
 */
export function evaluateResolvedMask(resolvedMask: ResolvedMask, curve: MagnitudeCurve, guardBandDb = 0): MaskVerdict {
  const referenceLevelDb = resolvedMask.referenceLevel ? referenceLevel(curve, resolvedMask.referenceLevel, 'mask.referenceLevel').levelDb : undefined;
  return evaluateMask(curve, resolvedMask.mask, { referenceLevelDb, guardBandDb });
}
