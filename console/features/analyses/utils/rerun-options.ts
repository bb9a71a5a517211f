import type { Analysis, AnalysisKind } from '@shared/schemas/analyses';
import type { RerunAnalysisInput } from '../api/rerun-analysis';

export type OctaveFractionChoice = 'none' | number;

export interface RerunChoice {
  octaveFraction?: OctaveFractionChoice;
  /** Gate length after the IR peak in ms; null removes the gate. */
  gateMs?: number | null;
  maxOrder?: number;
}

type Json = Record<string, unknown>;
const objectOr = (value: unknown): Json => (typeof value === 'object' && value !== null && !Array.isArray(value) ? (value as Json) : {});

/** Which choices a kind takes. */
export function rerunChoicesFor(kind: AnalysisKind): { smoothing: boolean; gate: boolean; orders: boolean } {
  const sweepResponse = kind === 'frequency_response' || kind === 'response_and_distortion' || kind === 'sensitivity';
  return {
    smoothing: sweepResponse || kind === 'spectrum',
    gate: sweepResponse,
    orders: kind === 'distortion' || kind === 'response_and_distortion',
  };
}

const withSmoothing = (options: Json, octaveFraction: OctaveFractionChoice) => ({ ...options, smoothing: { ...objectOr(options.smoothing), octaveFraction } });

/**
 * The re-run request for the chosen options: members given replace the original's whole member, so the
 * original options and conditions are copied and only the chosen values changed.
 */
export function rerunInput(analysis: Pick<Analysis, 'kind' | 'request'>, choice: RerunChoice): RerunAnalysisInput {
  const original = objectOr(analysis.request.options);
  let options: Json = { ...original };
  if (analysis.kind === 'response_and_distortion') {
    let response = objectOr(original.response);
    let distortion = objectOr(original.distortion);
    if (choice.octaveFraction !== undefined) response = withSmoothing(response, choice.octaveFraction);
    if (choice.maxOrder !== undefined) distortion = { ...distortion, maxOrder: choice.maxOrder };
    options = { ...original, response, distortion };
  } else {
    if (choice.octaveFraction !== undefined) options = withSmoothing(options, choice.octaveFraction);
    if (choice.maxOrder !== undefined) options = { ...options, maxOrder: choice.maxOrder };
  }
  const input: RerunAnalysisInput = { options };
  if (choice.gateMs !== undefined) {
    const conditions = { ...(analysis.request.conditions ?? {}) };
    if (choice.gateMs === null) {
      // "gated" needs a gate; without one the measurement is read as whatever the window allows.
      delete conditions.gate;
      if (conditions.environment === 'gated') delete conditions.environment;
    } else conditions.gate = { ...(conditions.gate ?? {}), lengthSeconds: choice.gateMs / 1000 };
    input.conditions = conditions;
  }
  return input;
}

/** The smoothing the original asked for (for the form's starting value). */
export function originalOctaveFraction(analysis: Pick<Analysis, 'kind' | 'request'>): OctaveFractionChoice | undefined {
  const options = objectOr(analysis.request.options);
  const source = analysis.kind === 'response_and_distortion' ? objectOr(options.response) : options;
  const value = objectOr(source.smoothing).octaveFraction;
  return value === 'none' || typeof value === 'number' ? value : undefined;
}
