import {
  analyzeCalibratorCapture,
  analyzeSweepResponse,
  bandMeanLevelDb,
  EngineError,
  headphoneSensitivity,
  loudspeakerSensitivity,
  microphoneSensitivity,
  type AnalysisResult,
  type CaptureInput,
  type SweepParameters,
} from '@shared/dsp';
import { sweepResponseOptions } from './engine-options';
import { DEFAULT_SENSITIVITY_BAND_HZ, type EngineTask } from './job-spec';

function microphone(capture: CaptureInput, task: EngineTask): AnalysisResult {
  const request = task.spec.sensitivity!;
  const tone = analyzeCalibratorCapture(capture, {
    channel: task.spec.channels.measurement,
    statedLevelDbSpl: request.statedLevelDbSpl!,
    ...(request.statedFrequencyHz !== undefined ? { statedFrequencyHz: request.statedFrequencyHz } : {}),
  });
  const figures = microphoneSensitivity({
    toneLevelDbfs: tone.figures.toneLevelDbfs,
    statedLevelDbSpl: request.statedLevelDbSpl!,
    adcFullScaleVoltsRms: request.adcFullScaleVoltsRms!,
  });
  return {
    ...tone,
    kind: 'sensitivity',
    conventions: {
      ...tone.conventions,
      sensitivity: `microphone chain sensitivity M = V_rms/p_rms (mV/Pa) and 20·log10(M / 1 V/Pa) (dBV/Pa), from the calibrator tone level and the ADC full scale ${request.adcFullScaleVoltsRms} V RMS for a full-scale sine; includes every gain between capsule and converter`,
    },
    figures: { deviceType: 'microphone', ...figures, calibrator: tone.figures },
  } as AnalysisResult;
}

/**
 * The band level of a calibrated curve and the per-drive figures derived from it, for both loudspeaker and
 * headphone paths (a fresh sweep response, or the stored curve of an earlier analysis): the power mean over the band
 * (dB SPL at `measuredDistanceM` for the stated drive), then per 2.83 V and per 1 W into the nominal impedance at
 * 1 m (inverse-square law) or per volt and per milliwatt (headphones), linear-system assumption.
 */
export function curveSensitivity(frequencyHz: ArrayLike<number>, magnitudeDb: ArrayLike<number>, task: EngineTask, measuredDistanceM: number) {
  const request = task.spec.sensitivity!;
  const [lowHz, highHz] = request.bandHz ?? DEFAULT_SENSITIVITY_BAND_HZ;
  const curve = { frequencyHz: Float64Array.from(frequencyHz), magnitudeDb: Float64Array.from(magnitudeDb) };
  const measuredLevelDbSpl = bandMeanLevelDb(curve, lowHz, highHz, 'power', 'sensitivity.bandHz');
  const { driveVoltageVrms, nominalImpedanceOhm } = task.spec.conditions;
  if (driveVoltageVrms === undefined || nominalImpedanceOhm === undefined) {
    throw new EngineError('sensitivity_conditions_missing', 'Sensitivity needs conditions.driveVoltageVrms and conditions.nominalImpedanceOhm.', { field: 'conditions.driveVoltageVrms' });
  }
  const perDrive =
    request.deviceType === 'loudspeaker'
      ? loudspeakerSensitivity({ measuredLevelDbSpl, measuredDistanceM, driveVoltsRms: driveVoltageVrms, nominalImpedanceOhms: nominalImpedanceOhm })
      : headphoneSensitivity({ measuredLevelDbSpl, driveVoltsRms: driveVoltageVrms, impedanceOhms: nominalImpedanceOhm });
  return { lowHz, highHz, measuredLevelDbSpl, driveVoltageVrms, nominalImpedanceOhm, perDrive };
}

/** Loudspeaker and headphone sensitivity from a calibrated sweep response (see curveSensitivity). */
export function sensitivityResult(capture: CaptureInput, task: EngineTask): AnalysisResult {
  const request = task.spec.sensitivity!;
  if (request.deviceType === 'microphone') return microphone(capture, task);
  const response = analyzeSweepResponse(capture, task.spec.stimulus!.parameters as unknown as SweepParameters, sweepResponseOptions(task.spec, task.spec.options, task.calibration) as never);
  const { lowHz, highHz, measuredLevelDbSpl, nominalImpedanceOhm, perDrive } = curveSensitivity(
    response.curves.frequencyHz,
    response.curves.magnitudeDb,
    task,
    task.spec.conditions.distanceM ?? 1,
  );
  const band = `power mean of the calibrated response over ${lowHz}–${highHz} Hz`;
  const loudspeaker = request.deviceType === 'loudspeaker';
  return {
    ...response,
    kind: 'sensitivity',
    conventions: {
      ...response.conventions,
      sensitivity: loudspeaker
        ? `${band}, referred to 1 m by the inverse-square law and to 2.83 V and to 1 W into ${nominalImpedanceOhm} Ω (linear system)`
        : `${band} on the ear simulator or coupler, per volt and per milliwatt into ${nominalImpedanceOhm} Ω (linear system)`,
    },
    figures: { deviceType: loudspeaker ? 'loudspeaker' : 'headphone', bandHz: [lowHz, highHz], measuredLevelDbSpl, ...perDrive, response: response.figures },
  } as unknown as AnalysisResult;
}
