import {
  designSteadyTone,
  designSteppedSine,
  designSynchronizedSweep,
  renderSteadyTone,
  renderSteppedSine,
  renderSweep,
  type SteadyToneParameters,
  type SteppedSineParameters,
  type SweepParameters,
} from '@shared/dsp';
import type { StimulusType } from '@shared/schemas/stimuli';

/** What every stimulus type offers the API: its design (validated, defaults applied) and its samples. */
export interface StimulusDesign {
  type: StimulusType;
  parameters: Record<string, unknown>;
  sampleRateHz: number;
  totalSampleCount: number;
  totalDurationSeconds: number;
  formula: string;
  cautions: string[];
  /** Derived figures worth showing (everything of the engine design but the bulky or repeated members). */
  summary: Record<string, unknown>;
  render(): Float64Array;
}

function summaryOf(design: object): Record<string, unknown> {
  const { parameters: _p, formula: _f, cautions: _c, kind: _k, ...rest } = design as Record<string, unknown>;
  return rest;
}

/**
 * Designs a stimulus with the engine (which throws EngineError with a field path such as "parameters.stopHz").
 * The same parameters give the same samples, bit for bit, so files are regenerated instead of stored.
 */
export function designStimulus(type: StimulusType, parameters: Record<string, unknown>): StimulusDesign {
  switch (type) {
    case 'sweep': {
      const design = designSynchronizedSweep(parameters as unknown as SweepParameters, 'parameters');
      return { type, parameters: design.parameters, ...common(design), summary: summaryOf(design), render: () => renderSweep(design) };
    }
    case 'stepped_sine': {
      const plan = designSteppedSine(parameters as unknown as SteppedSineParameters, 'parameters');
      return { type, parameters: plan.parameters, ...common(plan), summary: summaryOf(plan), render: () => renderSteppedSine(plan) };
    }
    case 'calibrator_check': {
      const design = designSteadyTone(parameters as unknown as SteadyToneParameters, 'parameters');
      return { type, parameters: design.parameters, ...common(design), summary: summaryOf(design), render: () => renderSteadyTone(design) };
    }
  }
}

function common(design: { sampleRateHz: number; totalSampleCount: number; totalDurationSeconds: number; formula: string; cautions: string[] }) {
  return {
    sampleRateHz: design.sampleRateHz,
    totalSampleCount: design.totalSampleCount,
    totalDurationSeconds: design.totalDurationSeconds,
    formula: design.formula,
    cautions: design.cautions,
  };
}
