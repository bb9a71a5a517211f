import { halfHannRiseGain } from '../stimuli/fades';

/**
 * Time window applied to the linear impulse response before its spectrum is taken.
 *
 * The window starts preRollSamples before the IR peak and ends lengthSamples after it:
 * - 'half_hann' (flat top): half-Hann rise over the whole pre-roll (reaching 1 at the peak), flat, then a half-Hann
 *   fall over the last fallFraction of the part after the peak.
 * - 'tukey': a Tukey (tapered-cosine) window over the whole span; taperFraction is its α (the share of the span
 *   tapered, half at each end). The peak is only at full weight if the pre-roll is longer than the rising taper.
 * A gate (quasi-anechoic measurement) is such a window ending before the first reflection. Its lowest valid
 * frequency is taken as 1/T_gate with T_gate = the part after the peak (the frequency resolution of a record that
 * long; results below are smoothed and biased, common practice, no source).
 */
export type WindowShape = 'half_hann' | 'tukey';

export interface TimeWindow {
  /** True for a user-requested gate, false for the default analysis window. */
  gated: boolean;
  shape: WindowShape;
  preRollSamples: number;
  /** Samples from the peak to the end of the window. */
  lengthSamples: number;
  totalSamples: number;
  /** Half-Hann fall share ('half_hann') or Tukey α ('tukey'). */
  taperFraction: number;
  sampleRateHz: number;
  /** 1/T_gate in Hz for a gate; 1/T_window for the default window. */
  lowestValidFrequencyHz: number;
}

export function windowWeights(window: TimeWindow): Float64Array {
  const weights = new Float64Array(window.totalSamples);
  const total = window.totalSamples;
  if (window.shape === 'half_hann') {
    const rise = window.preRollSamples;
    const fall = Math.round(window.taperFraction * window.lengthSamples);
    for (let n = 0; n < total; n++) {
      const fromEnd = total - 1 - n;
      weights[n] = Math.min(n < rise ? halfHannRiseGain(n, rise) : 1, fromEnd < fall ? halfHannRiseGain(fromEnd, fall) : 1);
    }
    return weights;
  }
  const taper = Math.round((window.taperFraction * total) / 2);
  for (let n = 0; n < total; n++) {
    const fromEnd = total - 1 - n;
    weights[n] = Math.min(n < taper ? halfHannRiseGain(n, taper) : 1, fromEnd < taper ? halfHannRiseGain(fromEnd, taper) : 1);
  }
  return weights;
}

export function describeWindow(window: TimeWindow): string {
  const ms = (samples: number) => `${((1000 * samples) / window.sampleRateHz).toPrecision(4)} ms`;
  const what = window.gated ? 'time gate' : 'analysis window (no gate requested)';
  const shape =
    window.shape === 'half_hann'
      ? `flat top, half-Hann rise over the ${ms(window.preRollSamples)} pre-roll, half-Hann fall over the last ${Math.round(100 * window.taperFraction)} % after the peak`
      : `Tukey, α = ${window.taperFraction}`;
  return `${what}: from ${ms(window.preRollSamples)} before the IR peak to ${ms(window.lengthSamples)} after it (${shape}); lowest valid frequency ≈ 1/T = ${window.lowestValidFrequencyHz.toPrecision(4)} Hz`;
}
