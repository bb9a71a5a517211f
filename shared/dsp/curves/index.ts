export * from './curve';
export { validateCurve } from './validate-curve';
export { levelAtFrequencyDb, resampleCurve, gridInsideCurve } from './interpolate';
export { smoothSpectrum, smoothCurve, SMOOTHING_FLOOR_DB } from './smoothing';
export { describeSmoothing } from './smoothing-options';
export { HANN_SUB_BANDS } from './smoothing-window';
export { logFrequencyGrid, describeLogGrid, gridNominalLabels, type LogGridOptions } from './grid';
export { thirdOctaveBandValues, thirdOctaveBandValuesFromSpectrum, type ThirdOctaveOptions } from './third-octave';
export { bandMeanLevelDb, referenceLevel, normaliseCurve } from './reference-level';
export {
  bandLimits,
  toleranceRange,
  DEFAULT_BAND_LIMIT_DROPS_DB,
  type BandLimitsOptions,
  type ToleranceRangeOptions,
} from './band-limits';
