import { ENGINE_VERSION, type AnalysisResult } from '@shared/dsp';
import type { EngineTask } from './job-spec';
import { curveSensitivity } from './sensitivity';

/**
 * Loudspeaker or headphone sensitivity from the calibrated curve of a stored response analysis: the power mean
 * of the curve over the band, uniform in log frequency (dB SPL at the source's distance for the source's drive),
 * then per 2.83 V and per 1 W into the nominal impedance at 1 m (inverse-square law, linear system), or per volt
 * and per milliwatt for headphones. The curve is carried through, so the result plots like the source.
 */
export function sensitivityFromResponse(task: EngineTask): AnalysisResult {
  const request = task.spec.sensitivity!;
  const source = request.source!;
  const { lowHz, highHz, measuredLevelDbSpl, driveVoltageVrms, nominalImpedanceOhm, perDrive: figures } = curveSensitivity(
    source.frequencyHz,
    source.magnitudeDb,
    task,
    source.distanceM,
  );
  const band = `power mean (10·log10 of the mean of 10^(L/10), uniform in log frequency) of the calibrated response of ${source.analysisId} over ${lowHz}–${highHz} Hz`;
  const distance = source.distanceStated ? `measured at ${source.distanceM} m` : 'measured at a distance the source does not state, taken as 1 m';
  const loudspeaker = request.deviceType === 'loudspeaker';
  return {
    kind: 'sensitivity',
    engineVersion: ENGINE_VERSION,
    conventions: {
      magnitudeReference: source.magnitudeReference,
      source: `the stored curve of ${source.kind} analysis ${source.analysisId}, calibrated with ${source.calibration.id} (1 Pa reads ${source.calibration.dbfsAtOnePascal} dBFS, AES17)`,
      sensitivity: loudspeaker
        ? `${band}, ${distance} for ${driveVoltageVrms} V RMS at the terminals; referred to 1 m by the inverse-square law (far field only) and to 2.83 V RMS and to 1 W into ${nominalImpedanceOhm} Ω nominal (linear system)`
        : `${band} on the ear simulator or coupler for ${driveVoltageVrms} V RMS, per volt and per milliwatt into ${nominalImpedanceOhm} Ω (linear system)`,
    },
    figures: {
      deviceType: request.deviceType,
      bandHz: [lowHz, highHz],
      bandAverage: 'power',
      measuredLevelDbSpl,
      measuredDistanceM: source.distanceM,
      driveVoltageVrms,
      sourceAnalysisId: source.analysisId,
      ...figures,
    },
    curves: { frequencyHz: source.frequencyHz, magnitudeDb: source.magnitudeDb },
    warnings: [],
  } as unknown as AnalysisResult;
}
