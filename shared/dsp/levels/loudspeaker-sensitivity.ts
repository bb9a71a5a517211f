import { dbFromAmplitudeRatio, inverseSquareCorrectionDb, voltsFromWatts, wattsFromVolts } from '@shared/units/levels';
import { requireFinite, requirePositiveFinite } from './require-positive';

/**
 * Loudspeaker sensitivity on the reference axis at 1 m, for 2.83 V and for 1 W into the nominal impedance
 * (IEC 60268-5 terms, from memory). 1 W means V = √(P·Z_nom) across the nominal impedance, not the power the
 * speaker actually draws; "@ 2.83 V" equals "@ 1 W" only for an 8 Ω nominal speaker (√8 = 2.828 V).
 */

/** Reference drive voltage of the "per 2.83 V" rating, V RMS (common practice, no source). */
export const REFERENCE_DRIVE_VOLTS_RMS = 2.83;

/** Reference distance of sensitivity ratings, m. */
export const REFERENCE_DISTANCE_M = 1;

/** Stated with every distance-corrected level. */
export const FAR_FIELD_CAVEAT =
  'Distance correction uses the inverse-square law (point source, free field): valid only in the far field, where the distance is large compared with the radiator size, with λ/(2π) and, for multi-way systems, with the driver spacing (a common rule is at least 3× the largest dimension). Near-field, ground-plane (2π) or baffled data cannot be scaled this way without saying so.';

/** Level in dB SPL referred from `measuredDistanceM` to `referenceDistanceM` (default 1 m) by the inverse-square law; far field only. */
export function splAtReferenceDistanceDbSpl(
  measuredLevelDbSpl: number,
  measuredDistanceM: number,
  referenceDistanceM = REFERENCE_DISTANCE_M,
): number {
  requireFinite(measuredLevelDbSpl, 'measuredLevelDbSpl');
  requirePositiveFinite(measuredDistanceM, 'measuredDistanceM');
  requirePositiveFinite(referenceDistanceM, 'referenceDistanceM');
  return measuredLevelDbSpl + inverseSquareCorrectionDb(measuredDistanceM, referenceDistanceM);
}

/** Power in W that `voltsRms` delivers into the nominal impedance (P = V²/Z_nom); 2.83 V into 8 Ω = 1.0011 W. */
export function nominalDriveWatts(voltsRms: number, nominalImpedanceOhms: number): number {
  requirePositiveFinite(voltsRms, 'driveVoltsRms');
  requirePositiveFinite(nominalImpedanceOhms, 'nominalImpedanceOhms');
  return wattsFromVolts(voltsRms, nominalImpedanceOhms);
}

/** RMS voltage that delivers 1 W into the nominal impedance, V = √(1 W·Z_nom). */
export function voltsForOneWatt(nominalImpedanceOhms: number): number {
  requirePositiveFinite(nominalImpedanceOhms, 'nominalImpedanceOhms');
  return voltsFromWatts(1, nominalImpedanceOhms);
}

/** dB SPL/1 W/1 m from dB SPL/2.83 V/1 m at a nominal impedance: + 20·log10(√Z / 2.83). */
export function sensitivityPerWattFromPer2p83Volts(levelDbSplAt2p83Volts: number, nominalImpedanceOhms: number): number {
  requireFinite(levelDbSplAt2p83Volts, 'levelDbSplAt2p83Volts');
  return levelDbSplAt2p83Volts + dbFromAmplitudeRatio(voltsForOneWatt(nominalImpedanceOhms) / REFERENCE_DRIVE_VOLTS_RMS);
}

/** dB SPL/2.83 V/1 m from dB SPL/1 W/1 m at a nominal impedance: + 20·log10(2.83 / √Z). */
export function sensitivityPer2p83VoltsFromPerWatt(levelDbSplAtOneWatt: number, nominalImpedanceOhms: number): number {
  requireFinite(levelDbSplAtOneWatt, 'levelDbSplAtOneWatt');
  return levelDbSplAtOneWatt + dbFromAmplitudeRatio(REFERENCE_DRIVE_VOLTS_RMS / voltsForOneWatt(nominalImpedanceOhms));
}

export interface LoudspeakerSensitivityInput {
  /** Level measured on the reference axis, dB SPL re 20 µPa. */
  measuredLevelDbSpl: number;
  /** Microphone distance from the reference point, m. */
  measuredDistanceM: number;
  /** Drive voltage measured at the speaker terminals, V RMS. */
  driveVoltsRms: number;
  /** Nominal impedance used for "1 W", Ω. */
  nominalImpedanceOhms: number;
}

export interface LoudspeakerSensitivity {
  /** Level referred to 1 m at the actual drive, dB SPL. */
  levelAtOneMetreDbSpl: number;
  /** dB SPL at 1 m for 2.83 V RMS. */
  dbSplAt2p83VoltsOneMetre: number;
  /** dB SPL at 1 m for 1 W into the nominal impedance. */
  dbSplAtOneWattOneMetre: number;
  /** Power the drive voltage delivers into the nominal impedance, W. */
  driveWattsIntoNominal: number;
  distanceCorrectionDb: number;
  caveat: string;
}

/** Sensitivity at 1 m for 2.83 V and for 1 W into Z_nom from one reading (levels scale 20·log10 with voltage: linear-system assumption). */
export function loudspeakerSensitivity(input: LoudspeakerSensitivityInput): LoudspeakerSensitivity {
  const levelAtOneMetreDbSpl = splAtReferenceDistanceDbSpl(input.measuredLevelDbSpl, input.measuredDistanceM);
  const driveWattsIntoNominal = nominalDriveWatts(input.driveVoltsRms, input.nominalImpedanceOhms);
  return {
    levelAtOneMetreDbSpl,
    dbSplAt2p83VoltsOneMetre: levelAtOneMetreDbSpl + dbFromAmplitudeRatio(REFERENCE_DRIVE_VOLTS_RMS / input.driveVoltsRms),
    dbSplAtOneWattOneMetre:
      levelAtOneMetreDbSpl + dbFromAmplitudeRatio(voltsForOneWatt(input.nominalImpedanceOhms) / input.driveVoltsRms),
    driveWattsIntoNominal,
    distanceCorrectionDb: levelAtOneMetreDbSpl - input.measuredLevelDbSpl,
    caveat: FAR_FIELD_CAVEAT,
  };
}
