import { realFft } from '../fft';

/**
 * Expected noise power in each bin of the windowed response spectrum, from a stretch of the capture that holds
 * only noise (the stimulus's leading silence). The stretch's power spectrum per sample, S(f) = |DFT(w·y)|²/Σw²
 * (Hann w), passes through the deconvolution gain |G(f)|² and lands, spread over the N-point circular buffer from a
 * capture of Ly samples, in the analysis window W:
 *   E|N_W(f)|² = S(f) · |G(f)|² · (Ly/N) · Σ w_W²,
 * with |G(f)|² = |X̃(f)|²/(fs·A)² = 4f/(L·fs²·A²) for the analytic inverse (Novak et al. 2015) and the same with the
 * loopback's sweep amplitude for reference division (assumes a roughly flat loopback). Stationary noise is assumed.
 */
export interface NoiseTransfer {
  sampleRateHz: number;
  rateConstantSeconds: number;
  /** Peak amplitude of the sweep the deconvolution divides by (stimulus or loopback), full-scale units. */
  driveAmplitude: number;
  usedCaptureSampleCount: number;
  deconvolutionFftSize: number;
  windowSumOfSquares: number;
}

export function deconvolvedNoisePower(noise: Float64Array, spectrumFftSize: number, transfer: NoiseTransfer): Float64Array {
  const length = Math.min(noise.length, spectrumFftSize);
  const segment = new Float64Array(length);
  let hannSquares = 0;
  for (let i = 0; i < length; i++) {
    const w = 0.5 - 0.5 * Math.cos((2 * Math.PI * i) / length);
    segment[i] = noise[i] * w;
    hannSquares += w * w;
  }
  const spectrum = realFft(segment, spectrumFftSize);
  const { sampleRateHz: fs, rateConstantSeconds: L, driveAmplitude: A } = transfer;
  const spread = (transfer.usedCaptureSampleCount / transfer.deconvolutionFftSize) * transfer.windowSumOfSquares;
  const binHz = fs / spectrumFftSize;
  const power = new Float64Array(spectrum.re.length);
  for (let k = 0; k < power.length; k++) {
    const gain = (4 * k * binHz) / (L * fs * fs * A * A);
    power[k] = ((spectrum.re[k] ** 2 + spectrum.im[k] ** 2) / hannSquares) * gain * spread;
  }
  return power;
}
