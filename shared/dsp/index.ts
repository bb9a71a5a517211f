/**
 * Public entry point of the measurement engine (pure TypeScript, float64, no I/O): everything the API workers,
 * the console and the CLI use. Each line re-exports one module; add a line when you add one.
 */
export * from './errors';
export * from './result/types';
export * from './result/warnings';
export * from './result/engine-version';
export * from './fft';
export * from './windows';
export * from './signal-stats';
export * from './wav';
export * from './levels';
export * from './curves';
export * from './masks';
export * from './stimuli';
export * from './response';
export * from './analyses';
export * from './distortion';
export * from './analyses/tone-distortion';
export * from './analyses/sweep-distortion';
export * from './analyses/response-and-distortion';
export * from './analyses/stepped-distortion';
export * from '@shared/units';
