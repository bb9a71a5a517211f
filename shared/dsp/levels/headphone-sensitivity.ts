import { dbFromAmplitudeRatio, dbFromPowerRatio } from '@shared/units/levels';
import { requireFinite, requirePositiveFinite } from './require-positive';

/**
 * Headphone sensitivity in dB SPL/mW and dB SPL/V (IEC 60268-7 terms, from memory), measured on an ear simulator
 * or coupler that the result must name. P = V²/|Z| at the stated impedance (nominal, or |Z| at the test
 * frequency: the caller states which), so S[dB SPL/V] = S[dB SPL/mW] + 10·log10(1000 Ω / Z).
 */

/** dB SPL/V from dB SPL/mW at `impedanceOhms`: + 10·log10(1000/Z) (100 dB SPL/mW at 32 Ω = 114.95 dB SPL/V). */
export function dbSplPerVoltFromPerMilliwatt(levelDbSplPerMilliwatt: number, impedanceOhms: number): number {
  requireFinite(levelDbSplPerMilliwatt, 'levelDbSplPerMilliwatt');
  requirePositiveFinite(impedanceOhms, 'impedanceOhms');
  return levelDbSplPerMilliwatt + dbFromPowerRatio(1000 / impedanceOhms);
}

/** dB SPL/mW from dB SPL/V at `impedanceOhms`: − 10·log10(1000/Z). */
export function dbSplPerMilliwattFromPerVolt(levelDbSplPerVolt: number, impedanceOhms: number): number {
  requireFinite(levelDbSplPerVolt, 'levelDbSplPerVolt');
  requirePositiveFinite(impedanceOhms, 'impedanceOhms');
  return levelDbSplPerVolt - dbFromPowerRatio(1000 / impedanceOhms);
}

export interface HeadphoneSensitivityInput {
  /** Level on the ear simulator or coupler, dB SPL re 20 µPa. */
  measuredLevelDbSpl: number;
  /** Drive voltage at the headphone terminals, V RMS. */
  driveVoltsRms: number;
  /** Impedance used for the power figure, Ω. */
  impedanceOhms: number;
}

export interface HeadphoneSensitivity {
  dbSplPerVolt: number;
  dbSplPerMilliwatt: number;
  /** Power the drive delivers into the stated impedance, mW. */
  driveMilliwatts: number;
}

/** Sensitivity per volt and per milliwatt from one reading (linear-system assumption: level scales 20·log10 with voltage). */
export function headphoneSensitivity(input: HeadphoneSensitivityInput): HeadphoneSensitivity {
  requireFinite(input.measuredLevelDbSpl, 'measuredLevelDbSpl');
  requirePositiveFinite(input.driveVoltsRms, 'driveVoltsRms');
  requirePositiveFinite(input.impedanceOhms, 'impedanceOhms');
  const dbSplPerVolt = input.measuredLevelDbSpl - dbFromAmplitudeRatio(input.driveVoltsRms);
  return {
    dbSplPerVolt,
    dbSplPerMilliwatt: dbSplPerMilliwattFromPerVolt(dbSplPerVolt, input.impedanceOhms),
    driveMilliwatts: (1000 * input.driveVoltsRms * input.driveVoltsRms) / input.impedanceOhms,
  };
}
