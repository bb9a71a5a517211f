import { describeLogGrid, describeSmoothing } from '../curves';
import { estimateImpulseNoise } from '../response/impulse-noise';
import { describeWindow } from '../response/time-window';
import { windowedExcessSpectrum } from '../response/windowed-spectrum';
import { ENGINE_VERSION } from '../result/engine-version';
import { warning, type EngineWarning } from '../result/warnings';
import { speedOfSoundMetresPerSecond } from '@shared/units/acoustics';
import { dbfsFromRms } from '@shared/units/levels';
import type { SweepDesign, SweepParameters } from '../stimuli/sweep';
import { channelWarnings, requireCapture, type CaptureInput } from './capture-checks';
import { deriveCurveOutputs } from './derived-curve-outputs';
import { magnitudeScale } from './magnitude-reference';
import { resolveSweepDesignForCapture, sweepCaptureWarnings } from './sweep-stimulus';
import { sweepImpulse, type SweepImpulse } from './sweep-impulse';
import { responseOnGrid } from './sweep-response-curves';
import { sweepSnr } from './sweep-snr';
import { resolveSweepResponseOptions, type SweepResponseOptions } from './sweep-response-options';
import type { SweepResponseResult } from './sweep-response-types';

const SWEEP_EDGE = { lowFactor: 2, highFactor: 2 ** (-1 / 6) } as const;

/** Lets a combined analysis reuse the deconvolution instead of repeating it (called once, before the spectrum). */
export interface SweepResponseObserver {
  onImpulse?: (impulse: SweepImpulse, design: SweepDesign, dividedByReference: boolean) => void;
}

/**
 * Frequency response from a synchronized-sweep capture: deconvolution (analytic inverse, or division by the
 * loopback channel), IR arrival and window/gate, excess spectrum, smoothing onto a log grid, phase and group
 * delay, calibration, normalisation, band limits, ±X dB range and the 1/3-octave table. Every convention used is
 * stated in the result; the same inputs give the same result bit for bit.
 */
export function analyzeSweepResponse(
  capture: CaptureInput,
  stimulus: SweepParameters | SweepDesign,
  options: SweepResponseOptions = {},
  observer?: SweepResponseObserver,
): SweepResponseResult {
  const input = requireCapture(capture);
  const resolved = resolveSweepResponseOptions(options, input.channels.length);
  const { design, warnings: designWarnings } = resolveSweepDesignForCapture(stimulus, input.sampleRateHz);
  const fs = design.sampleRateHz;
  const measurement = input.channels[resolved.measurementChannel];
  const reference = resolved.referenceChannel === null ? null : input.channels[resolved.referenceChannel];

  const warnings: EngineWarning[] = [...designWarnings, ...channelWarnings(measurement, resolved.measurementChannel, 'measurement')];
  if (reference) warnings.push(...channelWarnings(reference, resolved.referenceChannel as number, 'reference'));
  warnings.push(...sweepCaptureWarnings(measurement.length, design, resolved.captureOffsetSeconds));

  const impulse = sweepImpulse(measurement, reference, design, resolved);
  observer?.onImpulse?.(impulse, design, reference !== null);
  warnings.push(...impulse.warnings);
  const { ir, peak, window } = impulse;
  const spectrum = windowedExcessSpectrum(ir, peak, window);
  const grid = responseOnGrid(spectrum, design, peak.delaySeconds, resolved, 'options');

  let referenceChannelLevelDbfs: number | null = null;
  if (reference) {
    const start = Math.round(resolved.captureOffsetSeconds * fs) + design.leadingSilenceSampleCount;
    const end = Math.min(reference.length, start + design.sweepSampleCount);
    let sum = 0;
    for (let i = start; i < end; i++) sum += reference[i] * reference[i];
    referenceChannelLevelDbfs = end > start && sum > 0 ? dbfsFromRms(Math.sqrt(sum / (end - start))) : -400;
    if (referenceChannelLevelDbfs < -60) {
      warnings.push(
        warning('reference_channel_weak', `The reference channel's sweep level is ${referenceChannelLevelDbfs.toFixed(1)} dBFS; check the loopback wiring.`, {
          levelDbfs: referenceChannelLevelDbfs,
        }),
      );
    }
  }
  const scale = magnitudeScale(
    resolved,
    reference ? 'loopback' : 'stimulus',
    reference ? (referenceChannelLevelDbfs as number) : design.parameters.levelDbfs,
    reference ? "the loopback channel's RMS level over the sweep" : 'the sweep level',
  );
  warnings.push(...scale.warnings);
  const scaledDb = grid.curve.magnitudeDb.map((level) => level + scale.offsetDb);
  const derived = deriveCurveOutputs({ ...grid.curve, magnitudeDb: scaledDb }, resolved, 'options');
  warnings.push(...derived.warnings);

  const { startHz, stopHz } = design.parameters;
  const outsideSweepBand = Array.from(grid.gridHz, (f) => f < startHz || f > stopHz);
  if (outsideSweepBand.some(Boolean)) {
    warnings.push(
      warning('response_outside_sweep_band', `Part of the output grid lies outside the sweep band ${startHz}–${stopHz} Hz, where there was no excitation.`, {
        sweepStartHz: startHz,
        sweepStopHz: stopHz,
      }),
    );
  }
  // Edge ripple of the deconvolved band (fades, no excitation beyond f1 and f2; common practice, no source).
  const nearSweepEdge = Array.from(grid.gridHz, (f) => f < SWEEP_EDGE.lowFactor * startHz || f > stopHz * SWEEP_EDGE.highFactor);
  const lowestValidFrequencyHz = window.lowestValidFrequencyHz;
  const belowLowestValidFrequency = Array.from(grid.gridHz, (f) => window.gated && f < lowestValidFrequencyHz);
  if (window.gated && lowestValidFrequencyHz > grid.gridHz[0]) {
    warnings.push(
      warning('gate_limits_low_frequency', `The ${(1000 * window.lengthSamples / fs).toPrecision(4)} ms gate makes results below about ${lowestValidFrequencyHz.toPrecision(4)} Hz unreliable; they are marked.`, {
        lowestValidFrequencyHz,
      }),
    );
  }
  const noise = estimateImpulseNoise(ir, peak, window.preRollSamples);
  const driveAmplitude = reference ? Math.pow(10, (referenceChannelLevelDbfs as number) / 20) : design.amplitude;
  const snr = sweepSnr(measurement, design, Math.round(resolved.captureOffsetSeconds * fs), driveAmplitude, ir, spectrum, grid.gridHz, resolved.lowSnrThresholdDb);
  warnings.push(...snr.warnings);
  const temperatureCelsius = resolved.conditions.temperatureCelsius;
  const speedOfSound = speedOfSoundMetresPerSecond(temperatureCelsius);
  const irSamples = Math.min(spectrum.windowedImpulse.length, window.preRollSamples + Math.round(resolved.impulseResponseOutputSeconds * fs));

  return {
    kind: 'frequency_response',
    engineVersion: ENGINE_VERSION,
    conventions: {
      magnitudeReference: scale.description,
      dbfsConvention: 'aes17_sine',
      deconvolution: ir.description,
      smoothing: describeSmoothing(resolved.smoothing),
      gate: describeWindow(window),
      grid: describeLogGrid(grid.gridDescription),
      normalisation: derived.normalisationDescription,
      window: `impulse response ${describeWindow(window)}; spectrum by FFT of ${spectrum.fftSize} points (zero-padded)`,
      phase: `unwrapped from ${grid.gridHz[0] <= 1000 && grid.gridHz[grid.gridHz.length - 1] >= 1000 ? '1 kHz' : 'the band centre'} outward, bulk delay τ0 removed (φ + 2πfτ0), τ0 from the IR peak with parabolic sub-sample interpolation; ${resolved.smoothing.averaging === 'complex' && resolved.smoothing.octaveFraction !== 'none' ? 'complex-smoothed' : 'not smoothed'}; group delay −(1/2π)·dφ/df by central differences on the grid, bulk delay included`,
      calibration: scale.calibrationDescription,
      speedOfSound: `${speedOfSound.toFixed(2)} m/s at ${temperatureCelsius} °C, c = 331.3·√(1 + θ/273.15) m/s (dry air)`,
      stimulus: `${design.formula}; f1 = ${startHz} Hz, f2 = ${stopHz} Hz, L = ${design.rateConstantSeconds} s, level ${design.parameters.levelDbfs} dBFS peak, half-Hann fades ${design.parameters.fadeInSeconds} s / ${design.parameters.fadeOutSeconds} s`,
      snr: snr.description,
      sweepEdges: `points below ${SWEEP_EDGE.lowFactor}·f1 and above f2·2^(−1/6) are marked nearSweepEdge: the response there carries the band-edge ripple and fades of the sweep (sweep wider than the band you report)`,
      timeZero: 'start of the sweep in the capture (captureOffsetSeconds + leading silence); delay includes interface latency unless a loopback reference is divided out',
    },
    figures: {
      delayMs: peak.delaySeconds * 1000,
      delaySamples: peak.delaySamples,
      delayDistanceMetres: peak.delaySeconds * speedOfSound,
      speedOfSoundMetresPerSecond: speedOfSound,
      temperatureCelsius,
      polarity: peak.value >= 0 ? 'positive' : 'negative',
      peakToNoiseDb: noise ? noise.peakToNoiseDb : null,
      lowestValidFrequencyHz,
      gated: window.gated,
      windowPreRollMs: (1000 * window.preRollSamples) / fs,
      windowLengthMs: (1000 * window.lengthSamples) / fs,
      normalisationReferenceLevelDb: derived.normalisationReferenceLevelDb,
      referenceChannelLevelDbfs,
      bandLimits: derived.bandLimits,
      toleranceRange: derived.toleranceRange,
      sweep: {
        startHz,
        stopHz,
        rateConstantSeconds: design.rateConstantSeconds,
        sweepDurationSeconds: design.sweepDurationSeconds,
        levelDbfs: design.parameters.levelDbfs,
        sampleRateHz: fs,
      },
      deconvolutionFftSize: ir.fftSize,
      spectrumFftSize: spectrum.fftSize,
    },
    curves: {
      frequencyHz: Array.from(grid.gridHz),
      nominalLabel: grid.nominalLabels,
      magnitudeDb: Array.from(derived.curve.magnitudeDb),
      phaseDeg: Array.from(grid.curve.phaseDeg ?? []),
      groupDelayMs: Array.from(grid.groupDelaySeconds, (s) => s * 1000),
      belowLowestValidFrequency,
      outsideSweepBand,
      nearSweepEdge,
      snrDb: snr.snrDb ? Array.from(snr.snrDb) : null,
      thirdOctave: derived.thirdOctave,
      impulseResponse:
        irSamples > 0
          ? { startSeconds: spectrum.startSeconds, sampleRateHz: fs, samples: Array.from(spectrum.windowedImpulse.subarray(0, irSamples)) }
          : null,
    },
    warnings,
  };
}
