/**
 * An invented loudspeaker-and-rig model for demos and CLI checks (the "KB-65 woofer in a test baffle" of the demo
 * scenario): not a model of any real product. Chain: optional memoryless 2nd/3rd-order nonlinearity, a 2nd-order
 * high-pass at 55 Hz (Q 0.9, the box resonance), a +4 dB peak at 1.8 kHz (Q 4, cone break-up), a 1st-order
 * low-pass at 12 kHz, a gain, the acoustic delay, then the interface latency and noise. Biquads from the RBJ
 * Audio EQ Cookbook; the low-pass by the bilinear transform.
 */
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

type Coefficients = [number, number, number, number, number, number];

function highPass(fHz: number, q: number, fs: number): Coefficients {
  const w0 = (2 * Math.PI * fHz) / fs;
  const alpha = Math.sin(w0) / (2 * q);
  const c = Math.cos(w0);
  return [(1 + c) / 2, -(1 + c), (1 + c) / 2, 1 + alpha, -2 * c, 1 - alpha];
}

function peaking(fHz: number, gainDb: number, q: number, fs: number): Coefficients {
  const A = 10 ** (gainDb / 40);
  const w0 = (2 * Math.PI * fHz) / fs;
  const alpha = Math.sin(w0) / (2 * q);
  const c = Math.cos(w0);
  return [1 + alpha * A, -2 * c, 1 - alpha * A, 1 + alpha / A, -2 * c, 1 - alpha / A];
}

function onePoleLowPass(fHz: number, fs: number): Coefficients {
  const k = Math.tan((Math.PI * fHz) / fs);
  return [k / (1 + k), k / (1 + k), 0, 1, (k - 1) / (k + 1), 0];
}

function filterInPlace(x: Float64Array, [b0, b1, b2, a0, a1, a2]: Coefficients): void {
  let x1 = 0;
  let x2 = 0;
  let y1 = 0;
  let y2 = 0;
  for (let n = 0; n < x.length; n++) {
    const x0 = x[n];
    const y0 = (b0 * x0 + b1 * x1 + b2 * x2 - a1 * y1 - a2 * y2) / a0;
    x2 = x1;
    x1 = x0;
    y2 = y1;
    y1 = y0;
    x[n] = y0;
  }
}

/** Delay by a whole number of samples (the fraction is rounded; the demo does not need more). */
export function delayed(x: Float64Array, samples: number): Float64Array {
  const out = new Float64Array(x.length);
  out.set(x.subarray(0, Math.max(0, x.length - samples)), samples);
  return out;
}

/** The loudspeaker's acoustic output at the microphone (before the interface). */
export function simulateLoudspeaker(drive: Float64Array, sampleRateHz: number, model: LoudspeakerModel): Float64Array {
  const y = Float64Array.from(drive, (v) => v + model.secondHarmonic * v * v + model.thirdHarmonic * v * v * v);
  filterInPlace(y, highPass(model.highPassHz, model.highPassQ, sampleRateHz));
  filterInPlace(y, peaking(model.peakHz, model.peakGainDb, model.peakQ, sampleRateHz));
  filterInPlace(y, onePoleLowPass(model.lowPassHz, sampleRateHz));
  const gain = 10 ** (model.gainDb / 20);
  for (let n = 0; n < y.length; n++) y[n] *= gain;
  return delayed(y, Math.round(model.acousticDelaySeconds * sampleRateHz));
}

/** Deterministic Gaussian noise (mulberry32 + Box–Muller) at an RMS level in dBFS (AES17: RMS·√2). */
export function noise(length: number, levelDbfs: number, seed: number): Float64Array {
  const rms = 10 ** (levelDbfs / 20) / Math.SQRT2;
  let state = seed >>> 0;
  const uniform = () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return (((t ^ (t >>> 14)) >>> 0) + 0.5) / 4294967296;
  };
  return Float64Array.from({ length }, () => rms * Math.sqrt(-2 * Math.log(uniform())) * Math.cos(2 * Math.PI * uniform()));
}
