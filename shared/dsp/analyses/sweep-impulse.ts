import { deconvolveSweepCapture, deconvolveWithReference, type CircularImpulseResponse } from '../response/deconvolve';
import { findImpulsePeak, type ImpulsePeak } from '../response/impulse-peak';
import type { TimeWindow } from '../response/time-window';
import { warning, type EngineWarning } from '../result/warnings';
import type { SweepDesign } from '../stimuli/sweep';
import type { ResolvedSweepResponseOptions } from './sweep-response-options';

/**
 * Deconvolution, arrival and time window of a sweep capture.
 *
 * Without a gate the window starts max(5 ms, 2/f1) before the peak (at most ¼·L·ln 2, to stay clear of the
 * 2nd-harmonic IR): the deconvolved pulse of a band-limited sweep rings on both sides at f1, and cutting that
 * ringing biases the response for a few octaves above f1. It ends analysisWindowSeconds after the peak, or where
 * the capture's recorded decay (the part after the sweep) ends, whichever comes first.
 */
export interface SweepImpulse {
  ir: CircularImpulseResponse;
  peak: ImpulsePeak;
  window: TimeWindow;
  warnings: EngineWarning[];
}

const MINIMUM_WINDOW_SECONDS = 0.002;

function ungatedPreRollSeconds(design: SweepDesign): number {
  return Math.min(Math.max(0.005, 2 / design.parameters.startHz), 0.25 * design.rateConstantSeconds * Math.LN2);
}

export function sweepImpulse(
  measurement: Float64Array,
  reference: Float64Array | null,
  design: SweepDesign,
  options: ResolvedSweepResponseOptions,
): SweepImpulse {
  const fs = design.sampleRateHz;
  const warnings: EngineWarning[] = [];
  const gate = options.gate;
  const preRollSeconds = gate ? gate.preRollSeconds : ungatedPreRollSeconds(design);
  const preRollSamples = Math.round(preRollSeconds * fs);
  const deconvolution = {
    captureOffsetSamples: Math.round(options.captureOffsetSeconds * fs),
    preRollReserveSeconds: Math.max(preRollSeconds, 0.01),
  };
  const ir = reference
    ? deconvolveWithReference(measurement, reference, design, deconvolution)
    : deconvolveSweepCapture(measurement, design, deconvolution);

  // The IR at time τ is complete while τ + T lies inside the capture: up to the recorded decay after the sweep.
  const recordedDecaySamples = ir.usedCaptureSampleCount - design.sweepSampleCount;
  const validEnd = Math.min(Math.max(recordedDecaySamples, Math.round(0.1 * fs)), ir.positiveSampleCount);
  const reserve = ir.fftSize - ir.positiveSampleCount;
  const peak = findImpulsePeak(ir, Math.min(reserve, Math.round(0.01 * fs)), validEnd);

  let lengthSamples: number;
  if (gate) {
    lengthSamples = Math.round(gate.lengthSeconds * fs);
    if (peak.sampleOffset + lengthSamples > Math.max(recordedDecaySamples, 0)) {
      warnings.push(
        warning('capture_shorter_than_stimulus', 'The gate reaches past the decay recorded after the sweep; the end of the gated IR is incomplete.', {
          gateEndSeconds: (peak.sampleOffset + lengthSamples) / fs,
          recordedDecaySeconds: recordedDecaySamples / fs,
        }),
      );
    }
  } else {
    const room = Math.max(validEnd - peak.sampleOffset, Math.round(MINIMUM_WINDOW_SECONDS * fs));
    lengthSamples = Math.min(Math.round(options.analysisWindowSeconds * fs), room);
  }
  lengthSamples = Math.max(lengthSamples, 2);
  const window: TimeWindow = {
    gated: gate !== null,
    shape: gate ? gate.shape : 'half_hann',
    preRollSamples,
    lengthSamples,
    totalSamples: preRollSamples + lengthSamples,
    taperFraction: gate ? gate.taperFraction : 0.25,
    sampleRateHz: fs,
    lowestValidFrequencyHz: fs / lengthSamples,
  };
  return { ir, peak, window, warnings };
}
