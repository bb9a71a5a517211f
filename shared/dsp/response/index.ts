export * from './deconvolve';
export * from './impulse-peak';
export * from './impulse-noise';
export * from './time-window';
export * from './windowed-spectrum';
export * from './phase';
export * from './coherent-bin';
export { unitPhasor } from './unit-phasor';
export * from './capture-noise';
