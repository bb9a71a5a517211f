import { evaluateMask, levelAtFrequencyDb, referenceLevel, type AnalysisResult, type MagnitudeCurve, type MaskVerdict } from '@shared/dsp';
import type { EngineTask } from './job-spec';

/** The magnitude curve a mask is judged against, for kinds that have one. */
function responseCurve(result: AnalysisResult): MagnitudeCurve | null {
  const curves = result.curves as { frequencyHz?: number[]; magnitudeDb?: number[] };
  if (!Array.isArray(curves.frequencyHz) || !Array.isArray(curves.magnitudeDb) || curves.frequencyHz.length < 2) return null;
  const points = curves.frequencyHz.map((f, i) => [f, curves.magnitudeDb![i]] as const).filter(([f, m]) => Number.isFinite(f) && Number.isFinite(m));
  return { frequencyHz: Float64Array.from(points, (p) => p[0]), magnitudeDb: Float64Array.from(points, (p) => p[1]) };
}

/**
 * A relative mask is read against the mask's own reference level when it states one, else the curve's normalisation reference (0 dB when the curve is normalised) or,
 * without normalisation, against the curve's level at 1 kHz (common practice, no source).
 */
function referenceLevelDb(result: AnalysisResult, curve: MagnitudeCurve, task: EngineTask): number {
  if (task.mask?.referenceLevel) return referenceLevel(curve, task.mask.referenceLevel, 'mask.referenceLevel').levelDb;
  const figures = result.figures as { normalisationReferenceLevelDb?: number | null };
  if (figures.normalisationReferenceLevelDb !== undefined && figures.normalisationReferenceLevelDb !== null) return 0;
  return levelAtFrequencyDb(curve, 1000);
}

/** Adds `figures.mask` (the verdict) and `conventions.mask` when the analysis names a mask. */
export function applyMaskVerdict(result: AnalysisResult, task: EngineTask): { result: AnalysisResult; verdict: MaskVerdict['verdict'] | null } {
  if (!task.mask) return { result, verdict: null };
  const existing = (result.figures as { mask?: MaskVerdict | null }).mask;
  if (existing) return { result, verdict: existing.verdict };
  const curve = responseCurve(result);
  if (!curve) return { result, verdict: null };
  const options = task.mask.mask.levelReference === 'relative' ? { referenceLevelDb: referenceLevelDb(result, curve, task) } : {};
  const verdict = evaluateMask(curve, task.mask.mask, options);
  return {
    result: {
      ...result,
      figures: { ...result.figures, mask: { id: task.mask.id, version: task.mask.version, ...verdict } },
      conventions: { ...result.conventions, mask: `${task.mask.id} v${task.mask.version}: ${verdict.description}` },
    },
    verdict: verdict.verdict,
  };
}
