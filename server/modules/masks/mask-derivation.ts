import { deriveMaskFromGolden, isEngineError, type MagnitudeCurve, type ReferenceLevelSpec } from '@shared/dsp';
import type { DeriveMaskRequest, Mask } from '@shared/schemas/masks';
import type { AppDeps } from '@server/deps';
import { ApiProblem } from '@server/http/api-problem';
import { getAnalysisResults } from '@server/modules/analyses/analyses.service';
import { problemFromEngineError } from '@server/modules/analyses/engine-problem';
import type { Actor } from '@server/http/principal';
import { addMaskVersion, createMaskWithVersion, getMask } from './masks.service';
import { responseCurveOf } from './result-curve';

function unusable(detail: string, analysisIds: string[]): ApiProblem {
  return new ApiProblem('golden_analyses_unusable', detail, {
    extensions: { analysisIds },
    errors: [{ in: 'body', pointer: '#/analysisIds', detail }],
  });
}

/** The golden units' response curves, in the order asked; 422 naming every analysis that cannot serve. */
async function goldenCurves(deps: AppDeps, orgId: string, analysisIds: string[]): Promise<MagnitudeCurve[]> {
  const entries = await getAnalysisResults(deps, orgId, analysisIds);
  const notSucceeded = entries.filter((entry) => entry.status !== 'succeeded').map((entry) => entry.id);
  if (notSucceeded.length > 0) throw unusable(`These analyses have not succeeded: ${notSucceeded.join(', ')}.`, notSucceeded);
  const curves = entries.map((entry) => ({ id: entry.id, curve: responseCurveOf(entry.result) }));
  const withoutCurve = curves.filter((entry) => entry.curve === null).map((entry) => entry.id);
  if (withoutCurve.length > 0) throw unusable(`These analyses have no frequency-response curve: ${withoutCurve.join(', ')}.`, withoutCurve);
  return curves.map((entry) => entry.curve!);
}

/**
 * A mask from golden units: mean ± max(k·σ, minimum half-width) of their response curves at each frequency
 * (σ the sample standard deviation, n − 1), as a new mask or a new version of an existing one.
 */
export async function deriveMask(deps: AppDeps, orgId: string, input: DeriveMaskRequest, actor?: Actor): Promise<Mask> {
  if (input.referenceLevel?.kind === 'band_mean' && !(input.referenceLevel.toHz > input.referenceLevel.fromHz)) {
    throw new ApiProblem('mask_invalid', 'referenceLevel.toHz must be above fromHz.', {
      errors: [{ in: 'body', pointer: '#/referenceLevel/toHz', detail: 'Must be above fromHz.' }],
    });
  }
  if (input.maskId) await getMask(deps, orgId, input.maskId);
  const curves = await goldenCurves(deps, orgId, input.analysisIds);
  const normalisation = input.referenceLevel as ReferenceLevelSpec | undefined;
  let derived;
  try {
    derived = deriveMaskFromGolden(curves, { coverageFactor: input.k, minHalfWidthDb: input.minHalfWidthDb, normalisation });
  } catch (error) {
    if (isEngineError(error)) throw problemFromEngineError(error, { code: 'golden_analyses_unusable', rewrite: () => ['analysisIds'] });
    throw error;
  }
  const content = {
    levelReference: derived.mask.levelReference,
    ...(input.referenceLevel ? { referenceLevel: input.referenceLevel } : {}),
    upper: derived.mask.upper,
    lower: derived.mask.lower,
    note: `Derived from ${derived.curveCount} golden analyses`,
    derivation: {
      analysisIds: input.analysisIds,
      k: input.k,
      minHalfWidthDb: input.minHalfWidthDb,
      curveCount: derived.curveCount,
      description: derived.description,
      frequencyHz: Array.from(derived.frequencyHz),
      meanDb: Array.from(derived.meanDb),
      standardDeviationDb: Array.from(derived.standardDeviationDb),
      halfWidthDb: Array.from(derived.halfWidthDb),
      warnings: derived.warnings,
    },
  };
  if (input.maskId) {
    await addMaskVersion(deps, orgId, input.maskId, content, actor);
    return getMask(deps, orgId, input.maskId);
  }
  return createMaskWithVersion(deps, orgId, input.name, content, actor);
}
