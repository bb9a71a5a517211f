/**
 * An invented loudspeaker-and-rig model for demos and CLI checks (the "KB-65 woofer in a test baffle" of the demo
 * scenario): not a model of any real product. Chain: optional memoryless 2nd/3rd-order nonlinearity, a 2nd-order
 * high-pass at 55 Hz (Q 0.9, the box resonance), a +4 dB peak at 1.8 kHz (Q 4, cone break-up), a 1st-order
 * low-pass at 12 kHz, a gain, the acoustic delay, then the interface latency and noise. Biquads from the RBJ
 * Audio EQ Cookbook; the low-pass by the bilinear transform.
 */
import { cascade, firstOrderLowPass, rbjHighPass, rbjPeaking } from '@shared/dsp/response/biquad';
import { whiteNoise } from '@shared/dsp/seeded-noise';

export interface LoudspeakerModel {
  highPassHz: number;
  highPassQ: number;
  peakHz: number;
  peakGainDb: number;
  peakQ: number;
  lowPassHz: number;
  gainDb: number;
  acousticDelaySeconds: number;
  secondHarmonic: number;
  thirdHarmonic: number;
}

export const DEFAULT_MODEL: Omit<LoudspeakerModel, 'acousticDelaySeconds'> = {
  highPassHz: 55,
  highPassQ: 0.9,
  peakHz: 1800,
  peakGainDb: 4,
  peakQ: 4,
  lowPassHz: 12000,
  gainDb: -10,
  secondHarmonic: 0,
  thirdHarmonic: 0,
};

/** Delay by a whole number of samples (the fraction is rounded; the demo does not need more). */
export function delayed(x: Float64Array, samples: number): Float64Array {
  const out = new Float64Array(x.length);
  out.set(x.subarray(0, Math.max(0, x.length - samples)), samples);
  return out;
}

/** The loudspeaker's acoustic output at the microphone (before the interface). */
export function simulateLoudspeaker(drive: Float64Array, sampleRateHz: number, model: LoudspeakerModel): Float64Array {
  const y = Float64Array.from(drive, (v) => v + model.secondHarmonic * v * v + model.thirdHarmonic * v * v * v);
  const filtered = cascade(y, [
    rbjHighPass(model.highPassHz, model.highPassQ, sampleRateHz),
    rbjPeaking(model.peakHz, model.peakGainDb, model.peakQ, sampleRateHz),
    firstOrderLowPass(model.lowPassHz, sampleRateHz),
  ]);
  const gain = 10 ** (model.gainDb / 20);
  for (let n = 0; n < filtered.length; n++) filtered[n] *= gain;
  return delayed(filtered, Math.round(model.acousticDelaySeconds * sampleRateHz));
}

/** Deterministic Gaussian noise (mulberry32 + Box–Muller) at an RMS level in dBFS (AES17: RMS·√2). */
export function noise(length: number, levelDbfs: number, seed: number): Float64Array {
  return whiteNoise(length, 10 ** (levelDbfs / 20) / Math.SQRT2, seed);
}
