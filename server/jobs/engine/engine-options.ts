import type { AnalysisJobSpec, JobCalibration } from './job-spec';

/** The engine's conditions option from the API's measurement conditions (SI names → engine names). */
export function engineConditions(spec: AnalysisJobSpec): Record<string, number> {
  const { distanceM, driveVoltageVrms, temperatureC } = spec.conditions;
  return {
    ...(distanceM !== undefined ? { distanceMetres: distanceM } : {}),
    ...(driveVoltageVrms !== undefined ? { driveVoltageRms: driveVoltageVrms } : {}),
    ...(temperatureC !== undefined ? { temperatureCelsius: temperatureC } : {}),
  };
}

function calibrationOption(calibration: JobCalibration | null) {
  return calibration ? { calibration: { dbfsAtOnePascal: calibration.dbfsAtOnePascal } } : {};
}

/** Options of the sweep response analysis: the request's options plus channels, gate, conditions and calibration. */
export function sweepResponseOptions(spec: AnalysisJobSpec, options: Record<string, unknown>, calibration: JobCalibration | null) {
  return {
    ...options,
    measurementChannel: spec.channels.measurement,
    referenceChannel: spec.channels.reference,
    ...(spec.conditions.gate ? { gate: spec.conditions.gate } : {}),
    conditions: { ...engineConditions(spec), ...((options.conditions as object | undefined) ?? {}) },
    ...calibrationOption(calibration),
  };
}

export function sweepDistortionOptions(spec: AnalysisJobSpec, options: Record<string, unknown>) {
  return { ...options, measurementChannel: spec.channels.measurement, loopbackChannel: spec.channels.reference };
}

export function steppedResponseOptions(spec: AnalysisJobSpec, calibration: JobCalibration | null) {
  return {
    ...spec.options,
    measurementChannel: spec.channels.measurement,
    referenceChannel: spec.channels.reference,
    conditions: { ...engineConditions(spec), ...((spec.options.conditions as object | undefined) ?? {}) },
    ...calibrationOption(calibration),
  };
}

export function responseAndDistortionOptions(spec: AnalysisJobSpec, calibration: JobCalibration | null) {
  const response = (spec.options.response as Record<string, unknown> | undefined) ?? {};
  const distortion = (spec.options.distortion as Record<string, unknown> | undefined) ?? {};
  return { response: sweepResponseOptions(spec, response, calibration), distortion: sweepDistortionOptions(spec, distortion) };
}

export function spectrumOptions(spec: AnalysisJobSpec) {
  const { distanceM, driveVoltageVrms, nominalImpedanceOhm } = spec.conditions;
  const conditions = {
    ...(distanceM !== undefined ? { distanceMetres: distanceM } : {}),
    ...(driveVoltageVrms !== undefined ? { driveVoltageRms: driveVoltageVrms } : {}),
    ...(nominalImpedanceOhm !== undefined ? { nominalImpedanceOhms: nominalImpedanceOhm } : {}),
  };
  return { ...spec.options, ...(Object.keys(conditions).length ? { conditions } : {}) };
}

/** Options of the single-tone distortion analysis: a calibrator_check stimulus's frequency is the default tone, a calibration sets the level in dB SPL. */
export function toneDistortionOptions(spec: AnalysisJobSpec, calibration: JobCalibration | null) {
  const stimulusFrequencyHz = spec.stimulus?.type === 'calibrator_check' ? (spec.stimulus.parameters.frequencyHz as number | undefined) : undefined;
  return {
    ...spec.options,
    ...(spec.options.toneFrequencyHz === undefined && stimulusFrequencyHz !== undefined ? { toneFrequencyHz: stimulusFrequencyHz } : {}),
    ...(calibration ? { levelCalibration: { dbfsAtOnePascal: calibration.dbfsAtOnePascal } } : {}),
  };
}
