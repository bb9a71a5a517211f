import { EngineError } from '../errors';

export interface CalibratorToneStated {
  /** The calibrator's stated level at its stated frequency, dB SPL re 20 µPa (e.g. 94.0 or 114.0). */
  statedLevelDbSpl: number;
  /** The calibrator's stated frequency, Hz (e.g. 1000 or 250). */
  statedFrequencyHz: number;
}

/** Thresholds of the steady-single-tone checks; every default is common practice, no source. */
export interface CalibratorToneOptions {
  /** Largest |measured − stated| frequency accepted, fraction of the stated frequency (default 0.05). */
  maxFrequencyDeviationFraction?: number;
  /** Largest max − min of the short-block tone levels accepted, dB (default 1.0). */
  maxLevelSpreadDb?: number;
  /** Block level spread above this gives a tone_not_steady warning, dB (default 0.2). */
  warnLevelSpreadDb?: number;
  /** Length of the blocks of the stability figure, s (default 0.1; at least 3 whole blocks are needed). */
  stabilityBlockSeconds?: number;
  /** Smallest tone-to-everything-else ratio accepted, dB (default 10). */
  minSignalToNoiseDb?: number;
  /** Tone-to-everything-else ratio below this gives a low_snr warning, dB (default 30). */
  warnSignalToNoiseDb?: number;
  /** Weakest tone accepted, dBFS AES17 (default −90). */
  minToneLevelDbfs?: number;
  /** Strongest other spectral line accepted, dB relative to the tone (default −20): above it the capture holds several tones. */
  maxOtherToneRelativeDb?: number;
  /** How far a spectral line must stand above the local noise per bin to count as a tone, dB (default 20). */
  minLineProminenceDb?: number;
}

export const DEFAULT_CALIBRATOR_TONE_OPTIONS: Readonly<Required<CalibratorToneOptions>> = Object.freeze({
  maxFrequencyDeviationFraction: 0.05,
  maxLevelSpreadDb: 1.0,
  warnLevelSpreadDb: 0.2,
  stabilityBlockSeconds: 0.1,
  minSignalToNoiseDb: 10,
  warnSignalToNoiseDb: 30,
  minToneLevelDbfs: -90,
  maxOtherToneRelativeDb: -20,
  minLineProminenceDb: 20,
});

function invalid(field: string, message: string): EngineError {
  return new EngineError('calibrator_input_invalid', message, { field });
}

/** Validate the capture, the stated calibrator values and the options; returns the options with defaults filled in. */
export function resolveCalibratorInputs(
  samples: Float64Array,
  sampleRateHz: number,
  stated: CalibratorToneStated,
  options: CalibratorToneOptions,
): Required<CalibratorToneOptions> {
  if (!(samples instanceof Float64Array)) throw invalid('samples', 'samples must be a Float64Array (full scale ±1).');
  if (!(Number.isFinite(sampleRateHz) && sampleRateHz > 0)) throw invalid('sampleRateHz', `sampleRateHz must be a positive number, got ${sampleRateHz}.`);
  if (typeof stated !== 'object' || stated === null) throw invalid('stated', 'The calibrator’s stated level and frequency are required.');
  const { statedLevelDbSpl, statedFrequencyHz } = stated;
  if (!(Number.isFinite(statedLevelDbSpl) && statedLevelDbSpl > 0 && statedLevelDbSpl < 200)) {
    throw invalid('statedLevelDbSpl', `statedLevelDbSpl must be a level between 0 and 200 dB SPL, got ${statedLevelDbSpl}.`);
  }
  if (!(Number.isFinite(statedFrequencyHz) && statedFrequencyHz > 0 && statedFrequencyHz < sampleRateHz / 2)) {
    throw invalid('statedFrequencyHz', `statedFrequencyHz must lie between 0 and the Nyquist frequency ${sampleRateHz / 2} Hz, got ${statedFrequencyHz}.`);
  }
  const resolved = { ...DEFAULT_CALIBRATOR_TONE_OPTIONS, ...options };
  for (const [key, value] of Object.entries(resolved)) {
    if (!Number.isFinite(value)) throw invalid(`options.${key}`, `options.${key} must be a finite number, got ${String(value)}.`);
  }
  if (!(resolved.stabilityBlockSeconds > 0) || !(resolved.maxFrequencyDeviationFraction > 0) || !(resolved.maxLevelSpreadDb > 0)) {
    throw invalid('options', 'stabilityBlockSeconds, maxFrequencyDeviationFraction and maxLevelSpreadDb must be greater than 0.');
  }
  const blockLength = Math.round(resolved.stabilityBlockSeconds * sampleRateHz);
  if (blockLength < 64 || samples.length < 3 * blockLength) {
    throw new EngineError(
      'calibrator_capture_too_short',
      `The calibrator capture lasts ${(samples.length / sampleRateHz).toFixed(3)} s; at least three ${resolved.stabilityBlockSeconds} s blocks (of ≥ 64 samples) are needed.`,
      { field: 'samples', details: { durationSeconds: samples.length / sampleRateHz, minimumSeconds: (3 * blockLength) / sampleRateHz } },
    );
  }
  for (let n = 0; n < samples.length; n++) {
    if (samples[n] - samples[n] !== 0) throw invalid('samples', `Sample ${n} is ${String(samples[n])}; captures must hold finite numbers.`);
  }
  return resolved;
}
