import { createHash } from 'node:crypto';
import { ENGINE_VERSION, writeWav, type WavWriteEncoding } from '@shared/dsp';
import type { Page } from '@shared/schemas/pagination';
import type { CreateStimulusRequest, Stimulus, StimulusType } from '@shared/schemas/stimuli';
import type { AppDeps } from '@server/deps';
import { notFound } from '@server/http/api-problem';
import { decodeCursor, toPage } from '@server/http/pagination';
import { newId } from '@server/lib/ids';
import { withEngineErrors } from '@server/modules/analyses/engine-problem';
import { designStimulus, type StimulusDesign } from './stimulus-designs';
import { findStimulus, insertStimulus, listStimuli, type StimulusRow } from './stimuli.repo';

function present(row: StimulusRow, design: StimulusDesign): Stimulus {
  return {
    id: row.id,
    name: row.name,
    type: row.type as StimulusType,
    parameters: design.parameters,
    sampleRateHz: design.sampleRateHz,
    totalSampleCount: design.totalSampleCount,
    totalDurationSeconds: design.totalDurationSeconds,
    design: design.summary,
    formula: design.formula,
    cautions: design.cautions,
    engineVersion: row.engineVersion,
    audioUrl: `/v1/stimuli/${row.id}/audio?encoding=float32`,
    createdAt: row.createdAt.toISOString(),
  };
}

/** The engine's design of a stored stimulus (its parameters were validated when it was created). */
export function designOfRow(row: StimulusRow): StimulusDesign {
  return designStimulus(row.type as StimulusType, row.parameters);
}

/** Validates parameters with the engine (422 with a pointer into #/parameters on a bad value). */
export function designFromRequest(type: StimulusType, parameters: Record<string, unknown>, pointerPrefix: string[] = []): StimulusDesign {
  return withEngineErrors(() => designStimulus(type, parameters), { rewrite: (segments) => [...pointerPrefix, ...segments] });
}

export async function createStimulus(deps: AppDeps, organisationId: string, request: CreateStimulusRequest): Promise<Stimulus> {
  const design = designFromRequest(request.type, request.parameters as Record<string, unknown>);
  const row: StimulusRow = {
    id: newId('stimulus'),
    organisationId,
    name: request.name ?? null,
    type: request.type,
    parameters: design.parameters,
    sampleRateHz: design.sampleRateHz,
    engineVersion: ENGINE_VERSION,
    createdAt: deps.clock.now(),
  };
  await insertStimulus(deps.db, organisationId, row);
  return present(row, design);
}

export async function requireStimulusRow(deps: AppDeps, organisationId: string, stimulusId: string): Promise<StimulusRow> {
  const row = await findStimulus(deps.db, organisationId, stimulusId);
  if (!row) throw notFound('stimulus');
  return row;
}

export async function getStimulus(deps: AppDeps, organisationId: string, stimulusId: string): Promise<Stimulus> {
  const row = await requireStimulusRow(deps, organisationId, stimulusId);
  return present(row, designOfRow(row));
}

export async function listStimuliPage(deps: AppDeps, organisationId: string, query: { limit: number; cursor?: string }): Promise<Page<Stimulus>> {
  const binding = { list: 'stimuli', organisationId };
  const after = decodeCursor(deps, binding, query.cursor);
  const rows = await listStimuli(deps.db, organisationId, { limit: query.limit, after });
  return toPage(deps, binding, rows, query.limit, (row) => row, (row) => present(row, designOfRow(row)));
}

/**
 * The WAV, regenerated from the parameters. The ETag names everything the bytes depend on (engine version, type,
 * parameters, encoding), so a cached copy stays valid exactly as long as it would be regenerated identically.
 */
export function stimulusAudioTag(row: StimulusRow, encoding: WavWriteEncoding): string {
  const identity = JSON.stringify([row.engineVersion, ENGINE_VERSION, row.type, row.parameters, encoding]);
  return `"${createHash('sha256').update(identity).digest('hex').slice(0, 32)}"`;
}

export function renderStimulusAudio(row: StimulusRow, encoding: WavWriteEncoding): Uint8Array {
  const design = designOfRow(row);
  return writeWav({ sampleRateHz: design.sampleRateHz, channels: [design.render()], encoding });
}
