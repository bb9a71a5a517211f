import { bandMeanLevelDb } from '@shared/dsp';
import type { CreateAnalysisRequest, MeasurementConditions } from '@shared/schemas/analyses';
import type { AppDeps } from '@server/deps';
import { ApiProblem, invalidField } from '@server/http/api-problem';
import { DEFAULT_SENSITIVITY_BAND_HZ, type AnalysisJobSpec, type SensitivitySource } from '@server/jobs/engine/job-spec';
import { findAnalysis } from './analyses.repo';
import { withEngineErrors } from './engine-problem';

/** Kinds whose result is one magnitude curve that a calibration turns into dB SPL. */
const RESPONSE_KINDS = ['frequency_response', 'stepped_sine'];
const POINTER = '#/sensitivity/responseAnalysisId';

export type SourceRefusal = 'not_found' | 'not_a_response' | 'not_succeeded' | 'uncalibrated' | 'normalised' | 'referred' | 'conditions_conflict';

function unusable(reason: SourceRefusal, detail: string, extra: Record<string, unknown> = {}): ApiProblem {
  return new ApiProblem('source_analysis_unusable', detail, { extensions: { reason, ...extra }, errors: [{ in: 'body', pointer: POINTER, detail }] });
}

interface StoredSpec {
  spec: AnalysisJobSpec;
}

interface ResponseResult {
  conventions?: { magnitudeReference?: string };
  figures?: { normalisationReferenceLevelDb?: number | null };
  curves?: { frequencyHz?: number[]; magnitudeDb?: number[] };
}

/** Distance and drive the source's curve holds for: its conditions, as overridden by its engine options. */
function sourceConditions(spec: AnalysisJobSpec): { distanceM?: number; driveVoltageVrms?: number } {
  const engine = (spec.options.conditions as { distanceMetres?: number; driveVoltageRms?: number } | undefined) ?? {};
  return { distanceM: engine.distanceMetres ?? spec.conditions.distanceM, driveVoltageVrms: engine.driveVoltageRms ?? spec.conditions.driveVoltageVrms };
}

function checkRequestShape(request: CreateAnalysisRequest) {
  const deviceType = request.sensitivity!.deviceType;
  if (deviceType === 'microphone') throw invalidField('#/sensitivity/deviceType', 'Microphone sensitivity comes from a calibrator capture, not from a response analysis.');
  if (request.captureId) throw invalidField('#/captureId', 'A sensitivity derived from responseAnalysisId takes no capture.');
  if (request.stimulusId || request.stimulus) throw invalidField(request.stimulusId ? '#/stimulusId' : '#/stimulus', 'A sensitivity derived from responseAnalysisId takes no stimulus.');
  if (request.calibration) throw invalidField('#/calibration', 'The source analysis\'s calibration applies; remove calibration.');
  if (request.mask) throw invalidField('#/mask', 'Judge the source analysis against the mask instead.');
}

/**
 * The response analysis a sensitivity request names, checked and frozen into the job: a succeeded, calibrated,
 * un-normalised frequency_response or stepped_sine of the same organisation. Its distance and drive voltage are
 * the conditions the curve holds for; the request may repeat them but not contradict them. Returns the spec's
 * source and the effective conditions.
 */
export async function resolveSensitivitySource(
  deps: AppDeps,
  organisationId: string,
  request: CreateAnalysisRequest,
): Promise<{ source: SensitivitySource; conditions: MeasurementConditions }> {
  checkRequestShape(request);
  const analysisId = request.sensitivity!.responseAnalysisId!;
  const row = await findAnalysis(deps.db, organisationId, analysisId);
  if (!row) throw unusable('not_found', `No analysis ${analysisId} exists in the active organisation.`);
  if (!RESPONSE_KINDS.includes(row.kind)) throw unusable('not_a_response', `Analysis ${analysisId} is a ${row.kind} analysis; name a frequency_response or stepped_sine analysis.`, { sourceKind: row.kind });
  if (row.status !== 'succeeded' || !row.resultJson) {
    throw unusable('not_succeeded', `Analysis ${analysisId} is ${row.status}; only a succeeded response has a curve to read.`, { sourceStatus: row.status });
  }
  const calibration = row.calibration as SensitivitySource['calibration'] | null;
  if (!calibration) {
    throw unusable('uncalibrated', `Analysis ${analysisId} was run without a calibration: its curve is relative (dB re the stimulus), not dB SPL. Re-run it with a calibration first.`);
  }
  const result = JSON.parse(row.resultJson) as ResponseResult;
  const normalisedAt = result.figures?.normalisationReferenceLevelDb;
  if (normalisedAt !== undefined && normalisedAt !== null) {
    throw unusable('normalised', `Analysis ${analysisId} is normalised (0 dB at its reference), so its curve is no longer dB SPL. Re-run it without normalisation.`);
  }
  const stored = row.request as unknown as StoredSpec;
  if (stored.spec.options.referTo !== undefined && stored.spec.options.referTo !== null) {
    throw unusable('referred', `Analysis ${analysisId} was referred to another distance or drive (options.referTo); name one measured as is.`);
  }
  const { frequencyHz, magnitudeDb } = result.curves ?? {};
  if (!Array.isArray(frequencyHz) || !Array.isArray(magnitudeDb) || frequencyHz.length < 2) throw unusable('not_a_response', `Analysis ${analysisId} has no magnitude curve.`);

  const measured = sourceConditions(stored.spec);
  const asked = request.conditions ?? {};
  for (const name of ['distanceM', 'driveVoltageVrms'] as const) {
    if (asked[name] !== undefined && measured[name] !== undefined && asked[name] !== measured[name]) {
      throw unusable('conditions_conflict', `conditions.${name} is ${asked[name]} but the source was measured with ${measured[name]}; leave it out or give the same value.`, { field: name });
    }
  }
  const conditions: MeasurementConditions = {
    ...stored.spec.conditions,
    ...asked,
    ...(measured.distanceM !== undefined ? { distanceM: measured.distanceM } : {}),
    ...(measured.driveVoltageVrms !== undefined ? { driveVoltageVrms: measured.driveVoltageVrms } : {}),
  };
  if (conditions.driveVoltageVrms === undefined) throw invalidField('#/conditions/driveVoltageVrms', 'The source states no drive voltage: give the voltage at the terminals while it was measured.');
  if (conditions.nominalImpedanceOhm === undefined) throw invalidField('#/conditions/nominalImpedanceOhm', 'Sensitivity needs the nominal impedance.');
  const [lowHz, highHz] = request.sensitivity!.bandHz ?? DEFAULT_SENSITIVITY_BAND_HZ;
  // The band must lie on the stored curve: checked now rather than failing the job.
  withEngineErrors(() => bandMeanLevelDb({ frequencyHz: Float64Array.from(frequencyHz), magnitudeDb: Float64Array.from(magnitudeDb) }, lowHz, highHz, 'power', 'sensitivity.bandHz'));
  return {
    conditions,
    source: {
      analysisId,
      kind: row.kind,
      frequencyHz,
      magnitudeDb,
      magnitudeReference: result.conventions?.magnitudeReference ?? 'dB SPL re 20 µPa',
      distanceM: conditions.distanceM ?? 1,
      distanceStated: conditions.distanceM !== undefined,
      calibration,
    },
  };
}
