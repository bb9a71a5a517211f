import type { MagnitudeCurve } from '../curves/curve';
import { bandMeanLevelDb } from '../curves/reference-level';
import { levelAtFrequencyDb } from '../curves/interpolate';
import { FAR_FIELD_CAVEAT, REFERENCE_DRIVE_VOLTS_RMS, loudspeakerSensitivity } from '../levels/loudspeaker-sensitivity';
import { dbFromAmplitudeRatio, inverseSquareCorrectionDb, wattsFromVolts } from '@shared/units/levels';
import type { ResolvedSpectrumOptions } from './spectrum-options';

export interface SensitivityFigure {
  /** The curve's level (dB SPL) that the figure starts from, at the measured distance and drive. */
  measuredLevelDbSpl: number;
  dbSplAt2p83VoltsOneMetre: number;
  /** null without a nominal impedance. */
  dbSplAtOneWattOneMetre: number | null;
}

export interface SpectrumSensitivity {
  atOneKilohertz: SensitivityFigure | null;
  /** Band-mean ("characteristic") sensitivity over the stated band; null when the band is not inside the curve. */
  bandMean: (SensitivityFigure & { fromHz: number; toHz: number; average: 'db' | 'power' }) | null;
  distanceCorrectionDb: number;
  driveWattsIntoNominal: number | null;
  description: string;
}

function figureFrom(levelDbSpl: number, distanceMetres: number, driveVoltageRms: number, nominalImpedanceOhms: number | null): SensitivityFigure {
  if (nominalImpedanceOhms !== null) {
    const s = loudspeakerSensitivity({
      measuredLevelDbSpl: levelDbSpl,
      measuredDistanceM: distanceMetres,
      driveVoltsRms: driveVoltageRms,
      nominalImpedanceOhms,
    });
    return {
      measuredLevelDbSpl: levelDbSpl,
      dbSplAt2p83VoltsOneMetre: s.dbSplAt2p83VoltsOneMetre,
      dbSplAtOneWattOneMetre: s.dbSplAtOneWattOneMetre,
    };
  }
  const atOneMetre = levelDbSpl + inverseSquareCorrectionDb(distanceMetres, 1);
  return {
    measuredLevelDbSpl: levelDbSpl,
    dbSplAt2p83VoltsOneMetre: atOneMetre + dbFromAmplitudeRatio(REFERENCE_DRIVE_VOLTS_RMS / driveVoltageRms),
    dbSplAtOneWattOneMetre: null,
  };
}

/**
 * Loudspeaker sensitivity of a dB SPL curve measured at a stated distance and drive voltage: at 1 kHz and as the
 * band mean, referred to 1 m (inverse-square law, far field only) and to 2.83 V and to 1 W into the nominal
 * impedance (levels scale with 20·log10 of the voltage: a linear system is assumed). Returns null when the
 * distance or the voltage is not stated.
 */
export function spectrumSensitivity(curve: MagnitudeCurve, options: ResolvedSpectrumOptions): SpectrumSensitivity | null {
  const { distanceMetres, driveVoltageRms, nominalImpedanceOhms } = options.conditions;
  if (distanceMetres === null || driveVoltageRms === null) return null;
  const first = curve.frequencyHz[0];
  const last = curve.frequencyHz[curve.frequencyHz.length - 1];
  const atOneKilohertz =
    first <= 1000 && last >= 1000
      ? figureFrom(levelAtFrequencyDb(curve, 1000), distanceMetres, driveVoltageRms, nominalImpedanceOhms)
      : null;
  const band = options.sensitivityBand;
  const bandInside = band.fromHz >= first && band.toHz <= last;
  // A band the caller stated must fit (bandMeanLevelDb throws with the field); the default is skipped if it does not.
  const bandMean =
    bandInside || band.stated
      ? {
          ...figureFrom(
            bandMeanLevelDb(curve, band.fromHz, band.toHz, band.average, 'options.sensitivityBand'),
            distanceMetres,
            driveVoltageRms,
            nominalImpedanceOhms,
          ),
          fromHz: band.fromHz,
          toHz: band.toHz,
          average: band.average,
        }
      : null;
  const averageText = band.average === 'db' ? 'mean of dB values' : 'power mean';
  return {
    atOneKilohertz,
    bandMean,
    distanceCorrectionDb: inverseSquareCorrectionDb(distanceMetres, 1),
    driveWattsIntoNominal: nominalImpedanceOhms === null ? null : wattsFromVolts(driveVoltageRms, nominalImpedanceOhms),
    description:
      `loudspeaker sensitivity from the output curve: measured at ${distanceMetres} m with ${driveVoltageRms} V RMS, ` +
      `referred to 1 m by +20·log10(r/1 m) and to 2.83 V by +20·log10(2.83 V/V_drive)` +
      (nominalImpedanceOhms === null
        ? '; no nominal impedance stated, so no 1 W figure'
        : `, and to 1 W into the nominal ${nominalImpedanceOhms} Ω (V = √(1 W·Z_nom))`) +
      `; band mean = ${averageText} over ${band.fromHz}–${band.toHz} Hz, uniform in log frequency; ${FAR_FIELD_CAVEAT}`,
  };
}
