import { dbSplFromPascals, dbFromAmplitudeRatio, inverseSquareCorrectionDb } from '@shared/units/levels';
import { warning, type EngineWarning } from '../result/warnings';
import type { ResolvedCurveOutputOptions } from './curve-output-options';

/**
 * What the dB numbers of a response mean. Without a calibration they are relative: dB re the stimulus (the
 * capture's amplitude over the stimulus amplitude, both in full-scale units: a unit-gain chain reads 0 dB) or
 * dB re the loopback reference channel. With { dbfsAtOnePascal } they become dB SPL re 20 µPa of the tone the
 * stimulus level produces at the microphone:
 *   L_SPL(f) = L_rel(f) + L_drive,dBFS − dbfsAtOnePascal + 20·log10(1 Pa / 20 µPa)
 * (L_drive = the sweep's level, or the loopback channel's sweep level when dividing by the loopback; AES17 dBFS),
 * optionally referred to another distance (inverse-square law, far field only) and drive voltage (linear system).
 */
export interface MagnitudeScale {
  offsetDb: number;
  calibrated: boolean;
  description: string;
  calibrationDescription: string;
  warnings: EngineWarning[];
}

export function magnitudeScale(
  options: ResolvedCurveOutputOptions,
  relativeTo: 'stimulus' | 'loopback',
  driveLevelDbfs: number,
  driveSource = relativeTo === 'stimulus' ? 'the stimulus level' : "the loopback channel's level",
): MagnitudeScale {
  const relative =
    relativeTo === 'stimulus'
      ? 'dB re the stimulus (capture amplitude over stimulus amplitude, both re full scale; a unit-gain chain reads 0 dB)'
      : 'dB re the loopback reference channel (the interface response and latency cancel)';
  const { calibration, conditions, referTo } = options;
  if (!calibration) {
    return { offsetDb: 0, calibrated: false, description: relative, calibrationDescription: 'none (relative result)', warnings: [] };
  }
  const warnings: EngineWarning[] = [];
  let offsetDb = driveLevelDbfs - calibration.dbfsAtOnePascal + dbSplFromPascals(1);
  let where = conditions.distanceMetres !== null ? ` at ${conditions.distanceMetres} m` : ' at the microphone';
  let drive =
    conditions.driveVoltageRms !== null ? `${conditions.driveVoltageRms} V RMS at the terminals` : `${driveLevelDbfs.toFixed(2)} dBFS drive`;
  if (referTo?.distanceMetres != null && conditions.distanceMetres !== null) {
    offsetDb += inverseSquareCorrectionDb(conditions.distanceMetres, referTo.distanceMetres);
    where = ` referred to ${referTo.distanceMetres} m by the inverse-square law (measured at ${conditions.distanceMetres} m)`;
    warnings.push(
      warning('far_field_assumption', 'The SPL was referred to another distance by the inverse-square law, which holds only in the far field.', {
        measuredDistanceMetres: conditions.distanceMetres,
        referenceDistanceMetres: referTo.distanceMetres,
      }),
    );
  }
  if (referTo?.driveVoltageRms != null && conditions.driveVoltageRms !== null) {
    offsetDb += dbFromAmplitudeRatio(referTo.driveVoltageRms / conditions.driveVoltageRms);
    drive = `${referTo.driveVoltageRms} V RMS (scaled from ${conditions.driveVoltageRms} V RMS, linear system assumed)`;
  }
  return {
    offsetDb,
    calibrated: true,
    description: `dB SPL re 20 µPa${where} for ${drive} (drive level = ${driveSource}, AES17 dBFS)`,
    calibrationDescription: `1 Pa reads ${calibration.dbfsAtOnePascal} dBFS (AES17) in this chain; absolute levels are only as good as this calibration and the gain settings at the time`,
    warnings,
  };
}
