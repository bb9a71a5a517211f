import { EngineError } from '../errors';
import {
  rejectUnknownKeys,
  requireFiniteNumber,
  requireLevelDbfs,
  requireNumberInRange,
  requireObject,
  requireSampleRateHz,
} from './parameter-checks';
import type { ResolvedSweepParameters, SweepParameters } from './sweep';

export const SWEEP_PARAMETER_KEYS = [
  'startHz',
  'stopHz',
  'approximateDurationSeconds',
  'sampleRateHz',
  'levelDbfs',
  'fadeInSeconds',
  'fadeOutSeconds',
  'leadingSilenceSeconds',
  'trailingSilenceSeconds',
] as const;

export interface SynchronizedTiming {
  parameters: ResolvedSweepParameters;
  /** f1·L, an integer. */
  startCycles: number;
  rateConstantSeconds: number;
  sweepDurationSeconds: number;
}

/**
 * Validate sweep parameters (EngineError with field paths), apply the defaults and compute the synchronized timing
 * L = round(f1·T_approx/ln(f2/f1))/f1, T = L·ln(f2/f1) (Novak et al., JAES 63(10) 2015).
 */
export function resolveSweepParameters(params: SweepParameters, field: string): SynchronizedTiming {
  const raw = requireObject(params, field);
  rejectUnknownKeys(raw, field, SWEEP_PARAMETER_KEYS);
  const sampleRateHz = requireSampleRateHz(raw.sampleRateHz, `${field}.sampleRateHz`);
  const startHz = requireFiniteNumber(raw.startHz, `${field}.startHz`);
  const stopHz = requireFiniteNumber(raw.stopHz, `${field}.stopHz`);
  if (startHz <= 0) {
    throw new EngineError('sweep_start_not_positive', `${field}.startHz must be above 0 Hz, got ${startHz}.`, {
      field: `${field}.startHz`,
    });
  }
  if (startHz >= stopHz) {
    throw new EngineError('sweep_band_empty', `${field}.startHz (${startHz} Hz) must be below ${field}.stopHz (${stopHz} Hz).`, {
      field: `${field}.startHz`,
    });
  }
  if (stopHz > sampleRateHz / 2) {
    throw new EngineError(
      'sweep_stop_above_nyquist',
      `${field}.stopHz (${stopHz} Hz) must not exceed the Nyquist frequency ${sampleRateHz / 2} Hz at ${sampleRateHz} Hz.`,
      { field: `${field}.stopHz` },
    );
  }
  const approximateDurationSeconds = requireNumberInRange(
    raw.approximateDurationSeconds,
    `${field}.approximateDurationSeconds`,
    0.1,
    600,
    's',
    'sweep_duration_out_of_range',
  );
  const levelDbfs = requireLevelDbfs(raw.levelDbfs ?? -20, `${field}.levelDbfs`);

  const logRatio = Math.log(stopHz / startHz);
  const startCycles = Math.round((startHz * approximateDurationSeconds) / logRatio);
  if (startCycles < 1) {
    throw new EngineError(
      'sweep_too_short_for_start_frequency',
      `A ${approximateDurationSeconds} s sweep from ${startHz} Hz to ${stopHz} Hz is too short to synchronise (f1·L rounds to 0); lengthen it or raise startHz.`,
      { field: `${field}.approximateDurationSeconds` },
    );
  }
  const rateConstantSeconds = startCycles / startHz;
  const sweepDurationSeconds = rateConstantSeconds * logRatio;

  const fadeInSeconds = requireNumberInRange(
    raw.fadeInSeconds ?? Math.min(2 / startHz, sweepDurationSeconds / 10),
    `${field}.fadeInSeconds`,
    0,
    600,
    's',
  );
  const fadeOutSeconds = requireNumberInRange(
    raw.fadeOutSeconds ?? Math.min(0.005, sweepDurationSeconds / 10),
    `${field}.fadeOutSeconds`,
    0,
    600,
    's',
  );
  if (fadeInSeconds + fadeOutSeconds > sweepDurationSeconds) {
    throw new EngineError(
      'fades_longer_than_sweep',
      `Fade-in (${fadeInSeconds} s) plus fade-out (${fadeOutSeconds} s) exceed the sweep duration ${sweepDurationSeconds} s.`,
      { field: `${field}.fadeInSeconds` },
    );
  }
  const leadingSilenceSeconds = requireNumberInRange(raw.leadingSilenceSeconds ?? 0.1, `${field}.leadingSilenceSeconds`, 0, 60, 's');
  const trailingSilenceSeconds = requireNumberInRange(raw.trailingSilenceSeconds ?? 1, `${field}.trailingSilenceSeconds`, 0, 60, 's');

  return {
    parameters: {
      startHz,
      stopHz,
      approximateDurationSeconds,
      sampleRateHz,
      levelDbfs,
      fadeInSeconds,
      fadeOutSeconds,
      leadingSilenceSeconds,
      trailingSilenceSeconds,
    },
    startCycles,
    rateConstantSeconds,
    sweepDurationSeconds,
  };
}
