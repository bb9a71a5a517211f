export * from './sweep';
export * from './stepped-sine';
export * from './steady-tone';
export { STIMULUS_CAUTIONS, stimulusCautions } from './cautions';
export { halfHannRiseGain, applyHalfHannFades } from './fades';
