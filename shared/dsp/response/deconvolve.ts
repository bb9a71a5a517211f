/**
 * Deconvolution of a synchronized-sweep capture into a circular impulse-response buffer.
 *
 * Conventions:
 * - Time zero is the first sample of the sweep itself (the stimulus file's leading silence is skipped: the capture
 *   is read from captureOffsetSamples + leadingSilenceSampleCount). A system delay, including any interface
 *   latency when no loopback reference is used, therefore appears as a delay of the linear IR.
 * - Buffer layout: `samples[i]` is h(t = i/fs) for i < positiveSampleCount and h(t = (i − fftSize)/fs) for the
 *   remaining indices (negative times wrapped to the end, as in any circular deconvolution). The linear IR starts
 *   at t ≥ 0; the n-th harmonic IR peaks at t = −Δt_n = −L·ln(n), i.e. at index fftSize − L·ln(n)·fs (generally
 *   fractional: apply the fraction as a linear phase on that harmonic's spectrum, or treat its phase as unreliable).
 * - FFT size = nextPowerOfTwo(used capture samples + negative-time reserve). The reserve holds the pre-roll of the
 *   linear IR and, when highestHarmonicOrder ≥ 2, the harmonic IRs up to that order with half the gap to the next
 *   order (L·ln(K) + ½·L·ln((K+1)/K)) plus the pre-roll.
 * - Analytic inverse (Novak et al., JAES 63(10) 2015): X̃(f) = 2·sqrt(f/L)·exp(−j2πfL(1 − ln(f/f1)) + jπ/4), X̃(0) = 0,
 *   h = IFFT(FFT(y)·X̃)/(fs·A). Dividing by fs turns the sampled FFT into the continuous-time scale and dividing by
 *   the sweep amplitude A makes the result relative to the stimulus: a unit-gain system gives |H| ≈ 1 in [f1, f2].
 * - Reference division (dual-channel): H = Y·conj(X)/(|X|² + ε(f)) with X the captured loopback of the drive
 *   signal (Kirkeby et al., IEEE Trans. Speech Audio Proc. 6(2), 1998, regularised inversion). ε is 1e−10 of the
 *   mean in-band |X|² inside [f1, f2] and rises (geometrically, raised-cosine in log f) to 1× that mean one third
 *   of an octave outside the band, so out-of-band noise is not amplified. The interface's response and latency
 *   cancel; the result is dB re the loopback channel.
 */
import { inverseRealFft, realFft, type Spectrum } from '../fft';
import { harmonicAdvanceSeconds, type SweepDesign } from '../stimuli/sweep';
import { unitPhasor } from './unit-phasor';
import { buffer, planSegment, type CircularImpulseResponse, type DeconvolutionOptions } from './deconvolution-plan';

export type { CaptureSegment, CircularImpulseResponse, DeconvolutionMethod, DeconvolutionOptions } from './deconvolution-plan';
export { deconvolveWithReference, REFERENCE_REGULARISATION } from './reference-division';

export { harmonicAdvanceSeconds };

/** X̃(f)/(fs·A) on the bins of one FFT size, as separate real and imaginary parts (bin 0 is 0). */
interface InverseFilter {
  re: Float64Array;
  im: Float64Array;
}

/**
 * The last few inverse filters built, by FFT size and sweep. A rig plays the same stimulus capture after capture,
 * so the filter (a log, a table phasor and a square root per bin, the costliest per-bin loop of a response) is
 * built once per worker thread and reused; 4 entries of at most fftSize/2 + 1 complex values each bound the memory.
 * The cached values are the same numbers the loop would compute again, so results are unchanged.
 */
const INVERSE_FILTER_CACHE_SIZE = 4;
const inverseFilters = new Map<string, InverseFilter>();

function analyticInverseFilter(binCount: number, fftSize: number, design: SweepDesign): InverseFilter {
  const fs = design.sampleRateHz;
  const L = design.rateConstantSeconds;
  const f1 = design.parameters.startHz;
  const key = `${binCount}|${fftSize}|${fs}|${L}|${f1}|${design.amplitude}`;
  const cached = inverseFilters.get(key);
  if (cached) {
    // Most recently used last, so the oldest is the first evicted.
    inverseFilters.delete(key);
    inverseFilters.set(key, cached);
    return cached;
  }
  const binHz = fs / fftSize;
  const scale = (2 * Math.sqrt(binHz)) / (Math.sqrt(L) * fs * design.amplitude);
  const logBinRatio = Math.log(binHz / f1);
  const re = new Float64Array(binCount);
  const im = new Float64Array(binCount);
  const phasor = new Float64Array(2);
  for (let k = 1; k < binCount; k++) {
    // Phase in cycles, −f·L·(1 − ln(f/f1)) + 1/8, reduced to [0, 1) (unitPhasor reduces it).
    const f = k * binHz;
    unitPhasor(0.125 - f * L * (1 - (Math.log(k) + logBinRatio)), phasor);
    const gain = scale * Math.sqrt(k);
    re[k] = gain * phasor[0];
    im[k] = gain * phasor[1];
  }
  const filter = { re, im };
  inverseFilters.set(key, filter);
  if (inverseFilters.size > INVERSE_FILTER_CACHE_SIZE) inverseFilters.delete(inverseFilters.keys().next().value!);
  return filter;
}

/** Multiply `spectrum` in place by X̃(f)/(fs·A), the sweep's analytic inverse (Novak et al. 2015). */
export function applyAnalyticInverse(spectrum: Spectrum, fftSize: number, design: SweepDesign): void {
  const { re, im } = spectrum;
  const filter = analyticInverseFilter(re.length, fftSize, design);
  for (let k = 0; k < re.length; k++) {
    const c = filter.re[k];
    const s = filter.im[k];
    const a = re[k];
    const b = im[k];
    re[k] = a * c - b * s;
    im[k] = a * s + b * c;
  }
}

/** Deconvolve one capture channel by the sweep's analytic inverse. */
export function deconvolveSweepCapture(
  capture: Float64Array,
  design: SweepDesign,
  options: DeconvolutionOptions = {},
): CircularImpulseResponse {
  const segment = planSegment(capture.length, design, options);
  const spectrum = realFft(capture.subarray(segment.start, segment.start + segment.length), segment.fftSize);
  applyAnalyticInverse(spectrum, segment.fftSize, design);
  const samples = inverseRealFft(spectrum, segment.fftSize);
  return buffer(samples, segment, design, 'analytic_inverse', 'analytic inverse of the synchronized sweep (Novak et al. 2015), divided by fs and the sweep amplitude');
}

/** Fractional buffer index at which the n-th harmonic IR peaks: fftSize − L·ln(n)·fs (order 1 → 0). */
export function harmonicPeakIndex(ir: Pick<CircularImpulseResponse, 'fftSize' | 'sampleRateHz' | 'rateConstantSeconds'>, order: number): number {
  if (order === 1) return 0;
  return ir.fftSize - harmonicAdvanceSeconds(ir, order) * ir.sampleRateHz;
}

/** Time in seconds of buffer index i (negative for the wrapped part). */
export function bufferIndexTimeSeconds(ir: CircularImpulseResponse, index: number): number {
  const i = index < ir.positiveSampleCount ? index : index - ir.fftSize;
  return i / ir.sampleRateHz;
}
