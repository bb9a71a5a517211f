import { describe, expect, it } from 'vitest';
import { realFft } from '../fft';
import { designSynchronizedSweep, renderSweep, unitSweepSample } from '../stimuli/sweep';
import { deconvolveSweepCapture, deconvolveWithReference, harmonicAdvanceSeconds, harmonicPeakIndex } from './deconvolve';
import { circularSlice } from './impulse-peak';

const fs = 48000;
const design = designSynchronizedSweep({ startHz: 20, stopHz: 20000, approximateDurationSeconds: 5, sampleRateHz: fs, levelDbfs: -6 });
const sweep = renderSweep(design);

function levelDbAround(samples: Float64Array, centreOffset: number, frequencyHz: number, size = 32768): number {
  const slice = circularSlice(samples, centreOffset - size / 2, size);
  const spectrum = realFft(slice, size);
  const k = Math.round((frequencyHz * size) / fs);
  return 20 * Math.log10(Math.hypot(spectrum.re[k], spectrum.im[k]));
}

function largestIndex(samples: Float64Array, from: number, to: number): number {
  let best = from;
  for (let i = from; i < to; i++) if (Math.abs(samples[i]) > Math.abs(samples[best])) best = i;
  return best;
}

describe('deconvolution by the analytic inverse', () => {
  it('turns the sweep itself into a unit pulse at t = 0', () => {
    // Novak et al., JAES 63(10) 2015: X̃(f) = 2·sqrt(f/L)·exp(−j2πfL(1 − ln(f/f1)) + jπ/4) inverts the sweep;
    // dividing by fs (and the amplitude) gives |H| ≈ 1 in band for a unit system.
    const ir = deconvolveSweepCapture(sweep, design);
    expect(largestIndex(ir.samples, 0, ir.fftSize)).toBe(0);
    for (const f of [100, 300, 1000, 3000, 10000]) expect(Math.abs(levelDbAround(ir.samples, 0, f))).toBeLessThan(0.05);
  });

  it('places the 2nd and 3rd harmonic IRs at −L·ln n, wrapped to the end of the buffer', () => {
    // Novak et al. 2015 / Farina, AES 108th Conv. 2000: the n-th harmonic appears at t = −L·ln(n).
    const harmonics = new Float64Array(sweep.length);
    const start = design.leadingSilenceSampleCount;
    for (let n = 0; n < design.sweepSampleCount; n++) {
      const t = n / (fs * design.rateConstantSeconds);
      const phase2 = 2 * Math.PI * design.startCycles * Math.exp(t) * 2;
      const phase3 = 2 * Math.PI * design.startCycles * Math.exp(t) * 3;
      harmonics[start + n] = sweep[start + n] + design.amplitude * (0.1 * Math.sin(phase2) + 0.03 * Math.sin(phase3));
    }
    const ir = deconvolveSweepCapture(harmonics, design, { highestHarmonicOrder: 3 });
    expect(ir.fftSize - ir.positiveSampleCount).toBeGreaterThan(harmonicAdvanceSeconds(design, 3) * fs);
    for (const [order, amplitude] of [
      [2, 0.1],
      [3, 0.03],
    ] as const) {
      const expected = harmonicPeakIndex(ir, order);
      const found = largestIndex(ir.samples, Math.round(expected) - 200, Math.round(expected) + 200);
      expect(Math.abs(found - expected)).toBeLessThanOrEqual(1);
      // The harmonic sweep sin(n·φ) has the sweep's own amplitude spectrum above n·f1, so its level is its amplitude.
      // An 8192-sample slice (±85 ms) keeps the neighbouring order (0.284 s away) out.
      expect(levelDbAround(ir.samples, Math.round(expected), 5000, 8192)).toBeCloseTo(20 * Math.log10(amplitude), 1);
    }
    expect(unitSweepSample(design, 0)).toBe(0);
  });

  it('divides by a loopback reference and cancels its latency', () => {
    // Dual-channel transfer function H = Y/X (regularised, Kirkeby et al. 1998): a pure gain of 0.5 with a common
    // latency of 250 samples on both channels gives a pulse at t = 0 with |H| = 0.5 across the band.
    const latency = 250;
    const reference = new Float64Array(sweep.length);
    const measurement = new Float64Array(sweep.length);
    for (let n = latency; n < sweep.length; n++) {
      reference[n] = sweep[n - latency];
      measurement[n] = 0.5 * sweep[n - latency];
    }
    const ir = deconvolveWithReference(measurement, reference, design);
    expect(largestIndex(ir.samples, 0, ir.fftSize)).toBe(0);
    for (const f of [100, 1000, 15000]) expect(levelDbAround(ir.samples, 0, f)).toBeCloseTo(20 * Math.log10(0.5), 2);
  });
});
