import { dbFromPowerRatio, dbSplFromPascals, dbfsFromRms, pascalsFromDbSpl } from '@shared/units/levels';
import { EngineError } from '../errors';
import { warning } from '../result/warnings';
import type { EngineWarning } from '../result/warnings';
import { channelStats } from '../signal-stats';
import { resolveCalibratorInputs } from './calibrator-options';
import type { CalibratorToneOptions, CalibratorToneStated } from './calibrator-options';
import { otherLines, readBlocks, strongestLine } from './tone-lines';
import { tonePowerSpectrum } from './tone-power-spectrum';

export type { CalibratorToneOptions, CalibratorToneStated } from './calibrator-options';
export { DEFAULT_CALIBRATOR_TONE_OPTIONS } from './calibrator-options';

/**
 * Calibrator capture → chain sensitivity. The tone level is the flat-top (D'Antona & Ferrero 2006 coefficients)
 * main-lobe power sum over the whole capture, minus the local noise in the lobe, so hum, noise and a small
 * frequency offset do not bias it (Harris, Proc. IEEE 66(1), 1978). Then, with p_cal = 20 µPa·10^(L_cal/20)
 * (ISO 1683 reference): k = x_rms / p_cal and the chain reads L_dBFS − (L_cal − 93.98 dB) at 1 Pa.
 */
export interface CalibratorToneResult {
  measuredFrequencyHz: number;
  /** Tone level, dBFS AES17 (full-scale sine = 0 dBFS). */
  toneLevelDbfs: number;
  /** Level a 1 Pa RMS tone reads through this chain, dBFS AES17: toneLevelDbfs − (statedLevelDbSpl − 20·log10(1 Pa/20 µPa)). */
  chainSensitivityDbfsAtOnePascal: number;
  /** RMS pressure per unit RMS of the digital signal (full scale = peak 1), Pa: p_rms = x_rms · this. A 0 dBFS sine is this/√2 Pa. */
  pascalsPerFullScaleRms: number;
  /** The chain factor k: RMS of the digital signal (full scale = peak 1) per pascal RMS. */
  fullScaleRmsPerPascal: number;
  /** Max − min of the tone level over the short blocks, dB. */
  levelStabilityDb: number;
  blockCount: number;
  blockSeconds: number;
  /** Tone power over everything else below Nyquist (noise, hum, harmonics), dB. */
  signalToNoiseDb: number;
  /** The stated calibrator pressure, Pa RMS. */
  statedPressurePa: number;
  method: string;
  warnings: EngineWarning[];
}

const METHOD =
  'Flat-top window over the whole capture, main-lobe power sum minus local noise; level stability from non-overlapping blocks; dBFS per AES17 (full-scale sine = 0 dBFS).';

function refuseWithoutLine(readings: ReturnType<typeof readBlocks>, blockSeconds: number): never {
  const lineFrequencies = readings.map((r) => r.lineFrequencyHz).filter((f): f is number => f !== null);
  if (lineFrequencies.length >= readings.length / 2) {
    const lowest = lineFrequencies.reduce((a, b) => Math.min(a, b));
    const highest = lineFrequencies.reduce((a, b) => Math.max(a, b));
    throw new EngineError(
      'calibrator_tone_not_steady',
      `The capture holds a tone whose frequency moves between ${lowest.toFixed(1)} and ${highest.toFixed(1)} Hz (a sweep?), not a steady calibrator tone.`,
      { details: { lowestBlockFrequencyHz: lowest, highestBlockFrequencyHz: highest, blockSeconds } },
    );
  }
  throw new EngineError('calibrator_tone_not_found', 'No steady tone stands out of the capture: it looks like noise or silence.', {
    details: { blocksWithTone: lineFrequencies.length, blockCount: readings.length },
  });
}

/** Analyse a calibrator capture (full scale ±1) → tone level, chain sensitivity at 1 Pa, stability and SNR; refuses a capture that is not a steady single tone at about the stated frequency (EngineError). */
export function analyzeCalibratorTone(
  samples: Float64Array,
  sampleRateHz: number,
  stated: CalibratorToneStated,
  options: CalibratorToneOptions = {},
): CalibratorToneResult {
  const o = resolveCalibratorInputs(samples, sampleRateHz, stated, options);
  const blockLength = Math.round(o.stabilityBlockSeconds * sampleRateHz);
  const spectrum = tonePowerSpectrum(samples, sampleRateHz, 'flat_top');
  const line = strongestLine(spectrum, o.minLineProminenceDb);
  if (!line) refuseWithoutLine(readBlocks(samples, sampleRateHz, blockLength, null, o.minLineProminenceDb), o.stabilityBlockSeconds);

  const toneLevelDbfs = dbfsFromRms(Math.sqrt(line.meanSquare));
  if (toneLevelDbfs < o.minToneLevelDbfs) {
    throw new EngineError('calibrator_tone_not_found', `The strongest tone is at ${toneLevelDbfs.toFixed(1)} dBFS, below the ${o.minToneLevelDbfs} dBFS needed.`, {
      details: { toneLevelDbfs, minToneLevelDbfs: o.minToneLevelDbfs },
    });
  }
  const others = otherLines(spectrum, line, o.maxOtherToneRelativeDb, o.minLineProminenceDb);
  if (others.length > 0) {
    const other = others[0];
    throw new EngineError(
      'calibrator_multiple_tones',
      `Besides ${line.frequencyHz.toFixed(1)} Hz the capture holds a tone at ${other.frequencyHz.toFixed(1)} Hz only ${(-dbFromPowerRatio(line.meanSquare / other.meanSquare)).toFixed(1)} dB below it: not a single calibrator tone.`,
      { details: { toneFrequencyHz: line.frequencyHz, otherFrequencyHz: other.frequencyHz, otherRelativeDb: dbFromPowerRatio(other.meanSquare / line.meanSquare) } },
    );
  }
  const deviation = Math.abs(line.frequencyHz - stated.statedFrequencyHz) / stated.statedFrequencyHz;
  if (deviation > o.maxFrequencyDeviationFraction) {
    throw new EngineError(
      'calibrator_frequency_mismatch',
      `The tone is at ${line.frequencyHz.toFixed(1)} Hz but the calibrator is stated as ${stated.statedFrequencyHz} Hz (more than ${(100 * o.maxFrequencyDeviationFraction).toFixed(1)} % apart).`,
      { details: { measuredFrequencyHz: line.frequencyHz, statedFrequencyHz: stated.statedFrequencyHz } },
    );
  }
  let totalMeanSquare = 0;
  for (let k = 1; k < spectrum.power.length; k++) totalMeanSquare += spectrum.power[k];
  const signalToNoiseDb = Math.min(200, dbFromPowerRatio(line.meanSquare / Math.max(totalMeanSquare - line.meanSquare, line.meanSquare * 1e-20)));
  if (signalToNoiseDb < o.minSignalToNoiseDb) {
    throw new EngineError('calibrator_tone_not_found', `The tone is only ${signalToNoiseDb.toFixed(1)} dB above the rest of the capture; at least ${o.minSignalToNoiseDb} dB is needed.`, {
      details: { signalToNoiseDb, minSignalToNoiseDb: o.minSignalToNoiseDb },
    });
  }
  const readings = readBlocks(samples, sampleRateHz, blockLength, line.frequencyHz, o.minLineProminenceDb);
  const blockLevelsDb = readings.map((r) => 10 * Math.log10(Math.max(r.toneMeanSquare, Number.MIN_VALUE)));
  const levelStabilityDb = blockLevelsDb.reduce((a, b) => Math.max(a, b)) - blockLevelsDb.reduce((a, b) => Math.min(a, b));
  if (levelStabilityDb > o.maxLevelSpreadDb) {
    throw new EngineError(
      'calibrator_tone_not_steady',
      `The tone level varies by ${levelStabilityDb.toFixed(2)} dB across ${o.stabilityBlockSeconds} s blocks (limit ${o.maxLevelSpreadDb} dB): hold the calibrator steadily on the microphone.`,
      { details: { levelStabilityDb, maxLevelSpreadDb: o.maxLevelSpreadDb } },
    );
  }

  const statedPressurePa = pascalsFromDbSpl(stated.statedLevelDbSpl);
  const toneRms = Math.sqrt(line.meanSquare);
  const warnings: EngineWarning[] = [];
  if (signalToNoiseDb < o.warnSignalToNoiseDb) {
    warnings.push(warning('low_snr', `The calibrator tone is only ${signalToNoiseDb.toFixed(1)} dB above noise, hum and harmonics.`, { signalToNoiseDb }));
  }
  if (levelStabilityDb > o.warnLevelSpreadDb) {
    warnings.push(warning('tone_not_steady', `The calibrator level varied by ${levelStabilityDb.toFixed(2)} dB during the capture.`, { levelStabilityDb }));
  }
  const stats = channelStats(samples);
  if (stats.clippedSampleCount > 0 || stats.flatTopRunCount > 0) {
    warnings.push(warning('clipping', 'The calibrator capture reaches full scale or has flat-topped peaks: lower the input gain and capture again.', {
      clippedSampleCount: stats.clippedSampleCount,
      flatTopRunCount: stats.flatTopRunCount,
    }));
  }
  return {
    measuredFrequencyHz: line.frequencyHz,
    toneLevelDbfs,
    chainSensitivityDbfsAtOnePascal: toneLevelDbfs - (stated.statedLevelDbSpl - dbSplFromPascals(1)),
    pascalsPerFullScaleRms: statedPressurePa / toneRms,
    fullScaleRmsPerPascal: toneRms / statedPressurePa,
    levelStabilityDb,
    blockCount: readings.length,
    blockSeconds: blockLength / sampleRateHz,
    signalToNoiseDb,
    statedPressurePa,
    method: METHOD,
    warnings,
  };
}
