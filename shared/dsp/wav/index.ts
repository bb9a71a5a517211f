export { readWav, readWavInfo } from './read-wav';
export { pcmCode, writeWav } from './write-wav';
export { DEFAULT_WAV_LIMITS, resolveWavLimits } from './wav-limits';
export type { WavLimits } from './wav-limits';
export type { DecodedWav, WavInfo, WavSampleEncoding, WavWriteEncoding, WavWriteInput } from './wav-types';
