import type { TimeWindow } from '../response/time-window';

/**
 * Where each harmonic impulse response sits in the circular deconvolution buffer and the window that isolates it.
 *
 * With a synchronized sweep the n-th harmonic IR peaks Δt_n = L·ln(n) before the linear one (Novak et al., JAES
 * 63(10) 2015): at τ_n = τ_1 − L·ln(n)·fs samples, generally fractional. The windows tile the axis without overlap
 * and with the same pre-peak offset P for every order: order n covers [⌊τ_n⌋ − P, ⌊τ_(n−1)⌋ − P), i.e. P before
 * its peak and L·ln(n/(n−1)) − P after it, the gap up to the next (later) IR. Half-Hann rise over P, flat, half-Hann
 * fall over the last quarter (common practice, no source). The fractional part of τ_n is applied later as a
 * linear phase, so magnitude and phase refer to the exact peak time.
 */
export interface HarmonicWindow {
  order: number;
  /** τ_n: exact peak position in samples from t = 0 (negative: before the sweep's time zero). */
  peakSamples: number;
  /** Signed offset of the window's first sample from t = 0. */
  startOffset: number;
  window: TimeWindow;
  /** Length after the peak, seconds: what limits the lowest trustworthy frequency. */
  postPeakSeconds: number;
  /** ≈ 1/(post-peak length): below this fundamental frequency the order's window is shorter than one period. */
  lowestTrustworthyFundamentalHz: number;
}

export const HARMONIC_WINDOW_FALL_FRACTION = 0.25;
/** Default pre-peak offset, seconds, before the cap by the shortest window. */
export const DEFAULT_PRE_PEAK_SECONDS = 0.05;

export interface HarmonicWindowPlanInput {
  /** τ_1, the linear IR's exact peak position in samples from t = 0. */
  linearPeakSamples: number;
  sampleRateHz: number;
  rateConstantSeconds: number;
  /** Orders ≥ 2 to place (ascending). */
  orders: readonly number[];
  /** Requested pre-peak offset, seconds (capped at a quarter of the shortest window). */
  prePeakSeconds: number;
  /** Length after the linear IR's peak, samples. */
  linearPostPeakSamples: number;
}

function timeWindow(preRollSamples: number, lengthSamples: number, sampleRateHz: number): TimeWindow {
  return {
    gated: false,
    shape: 'half_hann',
    preRollSamples,
    lengthSamples,
    totalSamples: preRollSamples + lengthSamples,
    taperFraction: HARMONIC_WINDOW_FALL_FRACTION,
    sampleRateHz,
    lowestValidFrequencyHz: sampleRateHz / Math.max(1, lengthSamples),
  };
}

/** The pre-peak offset actually used: the request, capped at a quarter of the shortest window, L·ln(K/(K−1)). */
export function prePeakSamples(input: Pick<HarmonicWindowPlanInput, 'orders' | 'prePeakSeconds' | 'rateConstantSeconds' | 'sampleRateHz'>): number {
  const highest = Math.max(2, ...input.orders);
  const shortestSeconds = input.rateConstantSeconds * Math.log(highest / (highest - 1));
  return Math.max(1, Math.floor(Math.min(input.prePeakSeconds, shortestSeconds / 4) * input.sampleRateHz));
}

/** Windows for the linear IR (order 1) and every requested order. */
export function planHarmonicWindows(input: HarmonicWindowPlanInput): Map<number, HarmonicWindow> {
  const fs = input.sampleRateHz;
  const pre = prePeakSamples(input);
  const peakOf = (order: number) => input.linearPeakSamples - input.rateConstantSeconds * Math.log(order) * fs;
  const startOf = (order: number) => Math.floor(peakOf(order)) - pre;
  const plans = new Map<number, HarmonicWindow>();
  const describe = (order: number, startOffset: number, total: number): HarmonicWindow => {
    const post = total - pre;
    return {
      order,
      peakSamples: peakOf(order),
      startOffset,
      window: timeWindow(pre, post, fs),
      postPeakSeconds: post / fs,
      lowestTrustworthyFundamentalHz: fs / post,
    };
  };
  plans.set(1, describe(1, startOf(1), pre + input.linearPostPeakSamples));
  for (const order of input.orders) {
    const start = startOf(order);
    plans.set(order, describe(order, start, startOf(order - 1) - start));
  }
  return plans;
}
