import { bandMeanLevelDb, ENGINE_VERSION, EngineError, headphoneSensitivity, loudspeakerSensitivity, type AnalysisResult } from '@shared/dsp';
import { DEFAULT_SENSITIVITY_BAND_HZ, type EngineTask } from './job-spec';

/**
 * Loudspeaker or headphone sensitivity from the calibrated curve of a stored response analysis: the power mean
 * of the curve over the band, uniform in log frequency (dB SPL at the source's distance for the source's drive),
 * then per 2.83 V and per 1 W into the nominal impedance at 1 m (inverse-square law, linear system), or per volt
 * and per milliwatt for headphones. The curve is carried through, so the result plots like the source.
 */
export function sensitivityFromResponse(task: EngineTask): AnalysisResult {
  const request = task.spec.sensitivity!;
  const source = request.source!;
  const [lowHz, highHz] = request.bandHz ?? DEFAULT_SENSITIVITY_BAND_HZ;
  const curve = { frequencyHz: Float64Array.from(source.frequencyHz), magnitudeDb: Float64Array.from(source.magnitudeDb) };
  const measuredLevelDbSpl = bandMeanLevelDb(curve, lowHz, highHz, 'power', 'sensitivity.bandHz');
  const { driveVoltageVrms, nominalImpedanceOhm } = task.spec.conditions;
  if (driveVoltageVrms === undefined || nominalImpedanceOhm === undefined) {
    throw new EngineError('sensitivity_conditions_missing', 'Sensitivity needs conditions.driveVoltageVrms and conditions.nominalImpedanceOhm.', { field: 'conditions.driveVoltageVrms' });
  }
  const band = `power mean (10·log10 of the mean of 10^(L/10), uniform in log frequency) of the calibrated response of ${source.analysisId} over ${lowHz}–${highHz} Hz`;
  const distance = source.distanceStated ? `measured at ${source.distanceM} m` : 'measured at a distance the source does not state, taken as 1 m';
  const loudspeaker = request.deviceType === 'loudspeaker';
  const figures = loudspeaker
    ? loudspeakerSensitivity({ measuredLevelDbSpl, measuredDistanceM: source.distanceM, driveVoltsRms: driveVoltageVrms, nominalImpedanceOhms: nominalImpedanceOhm })
    : headphoneSensitivity({ measuredLevelDbSpl, driveVoltsRms: driveVoltageVrms, impedanceOhms: nominalImpedanceOhm });
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
