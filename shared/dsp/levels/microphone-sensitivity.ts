import { amplitudeRatioFromDb, dbvFromVolts, pascalsFromDbSpl } from '@shared/units/levels';
import { EngineError } from '../errors';
import { requireFinite, requirePositiveFinite } from './require-positive';

/**
 * Microphone sensitivity M = V_rms / p_rms in mV/Pa and L_M = 20·log10(M / 1 V/Pa) in dBV/Pa (IEC 60268-4 terms,
 * from memory), from a calibrator reading in dBFS and the converter's full-scale voltage.
 *
 * Full-scale conventions (dBFS per AES17, full-scale sine = 0 dBFS):
 * - adcFullScaleVoltsRms: the RMS voltage of a sine that just reaches full scale (how interface datasheets quote
 *   "maximum input level", common practice). Tone voltage V = V_FS,rms·10^(L_dBFS/20).
 * - adcFullScaleVoltsPeak: the peak voltage that reaches full scale. V = (V_FS,peak/√2)·10^(L_dBFS/20).
 * Example: 1.0 V RMS full scale, −26.00 dBFS at 94.0 dB SPL → 50.0 mV/Pa (−26.02 dBV/Pa); the same 1.0 V read as
 * a peak value gives 35.4 mV/Pa. The figure includes every gain between capsule and converter (preamp, interface
 * gain), so it is the capsule's open-circuit sensitivity only when that gain is 0 dB.
 */
export type MicrophoneSensitivityInput = {
  /** Level the calibrator tone read, dBFS AES17 (full-scale sine = 0 dBFS). */
  toneLevelDbfs: number;
  /** The calibrator's stated level, dB SPL re 20 µPa. */
  statedLevelDbSpl: number;
} & (
  | { /** RMS voltage of a sine that just reaches full scale (0 dBFS), V. */ adcFullScaleVoltsRms: number; adcFullScaleVoltsPeak?: undefined }
  | { /** Peak input voltage that reaches digital full scale, V. */ adcFullScaleVoltsPeak: number; adcFullScaleVoltsRms?: undefined }
);

export interface MicrophoneSensitivityResult {
  /** Sensitivity of the chain up to the converter input, mV/Pa. */
  millivoltsPerPascal: number;
  /** 20·log10(M / 1 V/Pa), dBV/Pa. */
  dbvPerPascal: number;
  /** RMS voltage of the calibrator tone at the converter input, V. */
  toneVoltsRms: number;
  /** Which full-scale convention the voltage was given in. */
  fullScaleConvention: 'rms_of_full_scale_sine' | 'peak';
}

/** Microphone (chain) sensitivity in mV/Pa and dBV/Pa from a calibrator reading in dBFS (AES17) and the ADC full-scale voltage (IEC 60268-4 terms). */
export function microphoneSensitivity(input: MicrophoneSensitivityInput): MicrophoneSensitivityResult {
  requireFinite(input.toneLevelDbfs, 'toneLevelDbfs');
  requireFinite(input.statedLevelDbSpl, 'statedLevelDbSpl');
  const hasRms = input.adcFullScaleVoltsRms !== undefined;
  const hasPeak = input.adcFullScaleVoltsPeak !== undefined;
  if (hasRms === hasPeak) {
    throw new EngineError('level_input_invalid', 'Give exactly one of adcFullScaleVoltsRms (RMS of a full-scale sine) or adcFullScaleVoltsPeak.', {
      field: 'adcFullScaleVoltsRms',
    });
  }
  let fullScaleVoltsRms: number;
  if (hasRms) {
    requirePositiveFinite(input.adcFullScaleVoltsRms!, 'adcFullScaleVoltsRms');
    fullScaleVoltsRms = input.adcFullScaleVoltsRms!;
  } else {
    requirePositiveFinite(input.adcFullScaleVoltsPeak!, 'adcFullScaleVoltsPeak');
    fullScaleVoltsRms = input.adcFullScaleVoltsPeak! / Math.SQRT2;
  }
  const toneVoltsRms = fullScaleVoltsRms * amplitudeRatioFromDb(input.toneLevelDbfs);
  const voltsPerPascal = toneVoltsRms / pascalsFromDbSpl(input.statedLevelDbSpl);
  return {
    millivoltsPerPascal: 1000 * voltsPerPascal,
    dbvPerPascal: dbvFromVolts(voltsPerPascal),
    toneVoltsRms,
    fullScaleConvention: hasRms ? 'rms_of_full_scale_sine' : 'peak',
  };
}
