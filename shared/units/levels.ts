/**
 * Level conversions with their references stated. Pure arithmetic, no imports, so both the engine and the
 * console can use it.
 */

/** Reference sound pressure for dB SPL, 20 µPa (ISO 1683). */
export const REFERENCE_PRESSURE_PA = 20e-6;

/** Reference voltage for dBu: √0.6 V ≈ 0.774597 V RMS, i.e. 1 mW into 600 Ω (common practice, no source). */
export const DBU_REFERENCE_VOLTS = Math.sqrt(0.6);

/** dB of an amplitude (field-quantity) ratio: 20·log10(ratio). */
export function dbFromAmplitudeRatio(ratio: number): number {
  return 20 * Math.log10(ratio);
}

/** Amplitude ratio of a level in dB: 10^(dB/20). */
export function amplitudeRatioFromDb(levelDb: number): number {
  return 10 ** (levelDb / 20);
}

/** dB of a power ratio: 10·log10(ratio). */
export function dbFromPowerRatio(ratio: number): number {
  return 10 * Math.log10(ratio);
}

/** Power ratio of a level in dB: 10^(dB/10). */
export function powerRatioFromDb(levelDb: number): number {
  return 10 ** (levelDb / 10);
}

/** dB SPL re 20 µPa of an RMS pressure in pascals (ISO 1683 reference). */
export function dbSplFromPascals(pressureRmsPa: number): number {
  return dbFromAmplitudeRatio(pressureRmsPa / REFERENCE_PRESSURE_PA);
}

/** RMS pressure in pascals of a level in dB SPL re 20 µPa (ISO 1683 reference). */
export function pascalsFromDbSpl(levelDbSpl: number): number {
  return REFERENCE_PRESSURE_PA * amplitudeRatioFromDb(levelDbSpl);
}

/** dBV (dB re 1 V RMS) of an RMS voltage. */
export function dbvFromVolts(voltsRms: number): number {
  return dbFromAmplitudeRatio(voltsRms);
}

/** RMS volts of a level in dBV (dB re 1 V RMS). */
export function voltsFromDbv(levelDbv: number): number {
  return amplitudeRatioFromDb(levelDbv);
}

/** dBu (dB re √0.6 V RMS) of an RMS voltage. */
export function dbuFromVolts(voltsRms: number): number {
  return dbFromAmplitudeRatio(voltsRms / DBU_REFERENCE_VOLTS);
}

/** RMS volts of a level in dBu (dB re √0.6 V RMS). */
export function voltsFromDbu(levelDbu: number): number {
  return DBU_REFERENCE_VOLTS * amplitudeRatioFromDb(levelDbu);
}

/** dBFS of an RMS value in full-scale units (full scale = peak 1), AES17: 20·log10(√2·rms), so a full-scale sine is 0 dBFS. */
export function dbfsFromRms(rmsFullScale: number): number {
  return dbFromAmplitudeRatio(Math.SQRT2 * rmsFullScale);
}

/** RMS in full-scale units (full scale = peak 1) of an AES17 dBFS level: 10^(L/20)/√2. */
export function rmsFromDbfs(levelDbfs: number): number {
  return amplitudeRatioFromDb(levelDbfs) / Math.SQRT2;
}

/** dBFS of a peak value in full-scale units: 20·log10(|peak|) (0 dBFS = the largest code; AES17 full scale). */
export function dbfsFromPeak(peakFullScale: number): number {
  return dbFromAmplitudeRatio(Math.abs(peakFullScale));
}

/** Power in watts of an RMS voltage across a resistance: P = V²/R. */
export function wattsFromVolts(voltsRms: number, ohms: number): number {
  return (voltsRms * voltsRms) / ohms;
}

/** RMS voltage that delivers `watts` into `ohms`: V = √(P·R). */
export function voltsFromWatts(watts: number, ohms: number): number {
  return Math.sqrt(watts * ohms);
}

/**
 * Inverse-square (point-source, far-field) correction in dB to refer a level measured at `measuredDistanceM`
 * to `referenceDistanceM`: +20·log10(r_measured / r_reference). Valid only in the far field of the source.
 */
export function inverseSquareCorrectionDb(measuredDistanceM: number, referenceDistanceM: number): number {
  return dbFromAmplitudeRatio(measuredDistanceM / referenceDistanceM);
}
