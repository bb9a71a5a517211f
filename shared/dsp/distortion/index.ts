/** Harmonic-distortion building blocks (definitions, tone records, sweep harmonic separation, summaries). */
export * from './thd';
export { realDft, windowedDtft } from './dft';
export { toneSpectrum, type ToneAnalysisMethod, type ToneWindowName, type ToneSpectrum } from './tone-spectrum';
export { analyzeToneRecord, type ToneRecordOptions, type ToneRecordAnalysis, type HarmonicReading } from './tone-record';
export { thdPlusNoise, type ThdPlusNoiseBand, type ResidualWeighting } from './thd-plus-noise';
export { classifyAgainstFloor, type ClassifiedLevel } from './noise-floor';
export { maximumInBand, valueAtFrequency, belowThreshold, type BelowThreshold, type MaximumInBand, type ValueAtFrequency } from './summaries';
export { planHarmonicWindows, type HarmonicWindow } from './harmonic-windows';
export { sweepHarmonics, type SweepHarmonics, type OrderCurve } from './sweep-harmonics';
export { type CommonDistortionOptions, type SummaryOptions, DEFAULT_SCREENING_ORDERS } from './options';
export { type ToneAnalysisOptions, type LevelCalibration } from './tone-options';
export { type SweepDistortionOptions } from './sweep-options';
