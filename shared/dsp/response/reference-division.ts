import { EngineError } from '../errors';
import { inverseRealFft, realFft } from '../fft';
import type { SweepDesign } from '../stimuli/sweep';
import { buffer, planSegment, type CircularImpulseResponse, type DeconvolutionOptions } from './deconvolution-plan';

/**
 * Dual-channel deconvolution: H = Y·conj(X)/(|X|² + ε(f)) with X the captured loopback of the drive signal
 * (regularised inversion, Kirkeby et al., IEEE Trans. Speech Audio Proc. 6(2), 1998). Layout, time zero and FFT
 * size as in deconvolve.ts; the result is relative to the loopback channel.
 */

/** Weight 0 inside [f1, f2] rising to 1 one third of an octave outside (raised cosine in log2 f). */
function outOfBandWeight(frequencyHz: number, startHz: number, stopHz: number): number {
  const transitionOctaves = 1 / 3;
  let octavesOutside = 0;
  if (frequencyHz < startHz) octavesOutside = frequencyHz <= 0 ? Infinity : Math.log2(startHz / frequencyHz);
  else if (frequencyHz > stopHz) octavesOutside = Math.log2(frequencyHz / stopHz);
  if (octavesOutside <= 0) return 0;
  if (octavesOutside >= transitionOctaves) return 1;
  return 0.5 * (1 - Math.cos((Math.PI * octavesOutside) / transitionOctaves));
}

export const REFERENCE_REGULARISATION = { inBandRelative: 1e-10, outOfBandRelative: 1, transitionOctaves: 1 / 3 } as const;

/** Deconvolve a capture channel by its recorded loopback reference: H = Y·conj(X)/(|X|² + ε(f)). */
export function deconvolveWithReference(
  capture: Float64Array,
  reference: Float64Array,
  design: SweepDesign,
  options: DeconvolutionOptions = {},
): CircularImpulseResponse {
  if (reference.length !== capture.length) {
    throw new EngineError('reference_length_mismatch', 'The reference channel must have as many samples as the measurement channel.', {
      field: 'referenceChannel',
    });
  }
  const segment = planSegment(capture.length, design, options);
  const end = segment.start + segment.length;
  const y = realFft(capture.subarray(segment.start, end), segment.fftSize);
  const x = realFft(reference.subarray(segment.start, end), segment.fftSize);
  const binHz = design.sampleRateHz / segment.fftSize;
  const { startHz, stopHz } = design.parameters;
  let inBandPower = 0;
  let inBandBins = 0;
  for (let k = 0; k < x.re.length; k++) {
    const f = k * binHz;
    if (f >= startHz && f <= stopHz) {
      inBandPower += x.re[k] * x.re[k] + x.im[k] * x.im[k];
      inBandBins++;
    }
  }
  const meanPower = inBandBins > 0 ? inBandPower / inBandBins : 0;
  if (!(meanPower > 0)) {
    throw new EngineError('reference_channel_silent', 'The reference channel holds no signal inside the sweep band.', {
      field: 'referenceChannel',
    });
  }
  const logIn = Math.log(REFERENCE_REGULARISATION.inBandRelative * meanPower);
  const logOut = Math.log(REFERENCE_REGULARISATION.outOfBandRelative * meanPower);
  for (let k = 0; k < y.re.length; k++) {
    const w = outOfBandWeight(k * binHz, startHz, stopHz);
    const epsilon = Math.exp(logIn + (logOut - logIn) * w);
    const xr = x.re[k];
    const xi = x.im[k];
    const yr = y.re[k];
    const yi = y.im[k];
    const denominator = xr * xr + xi * xi + epsilon;
    y.re[k] = (yr * xr + yi * xi) / denominator;
    y.im[k] = (yi * xr - yr * xi) / denominator;
  }
  const samples = inverseRealFft(y, segment.fftSize);
  return buffer(
    samples,
    segment,
    design,
    'reference_division',
    'division by the loopback reference channel, H = Y·conj(X)/(|X|² + ε), ε = 1e−10 of the mean in-band |X|² inside the sweep band rising to 1× over 1/3 octave outside (Kirkeby et al. 1998)',
  );
}

/** Fractional buffer index at which the n-th harmonic IR peaks: fftSize − L·ln(n)·fs (order 1 → 0). */
