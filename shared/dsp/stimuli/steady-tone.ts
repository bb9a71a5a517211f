import { EngineError } from '../errors';
import { stimulusCautions } from './cautions';
import { applyHalfHannFades } from './fades';
import {
  rejectUnknownKeys,
  requireLevelDbfs,
  requireNumberInRange,
  requireObject,
  requireSampleRateHz,
} from './parameter-checks';

/**
 * Calibrator-check tone: a steady sine for checking a chain (e.g. through a loopback, or to set a drive level).
 * x[n] = A·sin(2π·f·n/fs) with half-Hann fades, A = 10^(levelDbfs/20), after leading silence. The frequency is
 * used exactly as given; the phase is reduced through (f·n/fs) mod 1 before sin, so it stays accurate for long tones.
 */
export interface SteadyToneParameters {
  frequencyHz: number;
  durationSeconds: number;
  sampleRateHz: number;
  /** Peak level, dBFS (≤ 0). Default −20. */
  levelDbfs?: number;
  /** Half-Hann fade-in and fade-out, s. Default 0.01 each. */
  fadeSeconds?: number;
  leadingSilenceSeconds?: number;
  trailingSilenceSeconds?: number;
}

export interface SteadyToneDesign {
  kind: 'steady_tone';
  parameters: Required<SteadyToneParameters>;
  sampleRateHz: number;
  amplitude: number;
  toneSampleCount: number;
  fadeSampleCount: number;
  leadingSilenceSampleCount: number;
  totalSampleCount: number;
  totalDurationSeconds: number;
  fadeShape: 'half_hann';
  formula: string;
  cautions: string[];
}

const KEYS = ['frequencyHz', 'durationSeconds', 'sampleRateHz', 'levelDbfs', 'fadeSeconds', 'leadingSilenceSeconds', 'trailingSilenceSeconds'] as const;

export function designSteadyTone(params: SteadyToneParameters, field = 'tone'): SteadyToneDesign {
  const raw = requireObject(params, field);
  rejectUnknownKeys(raw, field, KEYS);
  const sampleRateHz = requireSampleRateHz(raw.sampleRateHz, `${field}.sampleRateHz`);
  const frequencyHz = requireNumberInRange(raw.frequencyHz, `${field}.frequencyHz`, 1, sampleRateHz / 2, 'Hz', 'tone_frequency_out_of_range');
  if (frequencyHz >= sampleRateHz / 2) {
    throw new EngineError('tone_frequency_out_of_range', `${field}.frequencyHz must be below the Nyquist frequency.`, { field: `${field}.frequencyHz` });
  }
  const durationSeconds = requireNumberInRange(raw.durationSeconds, `${field}.durationSeconds`, 0.1, 600, 's', 'tone_duration_out_of_range');
  const fadeSeconds = requireNumberInRange(raw.fadeSeconds ?? 0.01, `${field}.fadeSeconds`, 0, 60, 's');
  if (2 * fadeSeconds > durationSeconds) {
    throw new EngineError('fades_longer_than_tone', `Two fades of ${fadeSeconds} s do not fit a ${durationSeconds} s tone.`, { field: `${field}.fadeSeconds` });
  }
  const parameters: Required<SteadyToneParameters> = {
    frequencyHz,
    durationSeconds,
    sampleRateHz,
    levelDbfs: requireLevelDbfs(raw.levelDbfs ?? -20, `${field}.levelDbfs`),
    fadeSeconds,
    leadingSilenceSeconds: requireNumberInRange(raw.leadingSilenceSeconds ?? 0.1, `${field}.leadingSilenceSeconds`, 0, 60, 's'),
    trailingSilenceSeconds: requireNumberInRange(raw.trailingSilenceSeconds ?? 0.1, `${field}.trailingSilenceSeconds`, 0, 60, 's'),
  };
  const toneSampleCount = Math.round(durationSeconds * sampleRateHz);
  const leadingSilenceSampleCount = Math.round(parameters.leadingSilenceSeconds * sampleRateHz);
  const totalSampleCount = leadingSilenceSampleCount + toneSampleCount + Math.round(parameters.trailingSilenceSeconds * sampleRateHz);
  return {
    kind: 'steady_tone',
    parameters,
    sampleRateHz,
    amplitude: Math.pow(10, parameters.levelDbfs / 20),
    toneSampleCount,
    fadeSampleCount: Math.round(fadeSeconds * sampleRateHz),
    leadingSilenceSampleCount,
    totalSampleCount,
    totalDurationSeconds: totalSampleCount / sampleRateHz,
    fadeShape: 'half_hann',
    formula: 'x[n] = A·sin(2π·f·n/fs), half-Hann fades',
    cautions: stimulusCautions(),
  };
}

export function renderSteadyTone(design: SteadyToneDesign): Float64Array {
  const out = new Float64Array(design.totalSampleCount);
  const start = design.leadingSilenceSampleCount;
  const cyclesPerSample = design.parameters.frequencyHz / design.sampleRateHz;
  for (let n = 0; n < design.toneSampleCount; n++) {
    const cycles = cyclesPerSample * n;
    out[start + n] = design.amplitude * Math.sin(2 * Math.PI * (cycles - Math.floor(cycles)));
  }
  applyHalfHannFades(out, start, design.toneSampleCount, design.fadeSampleCount, design.fadeSampleCount);
  return out;
}
