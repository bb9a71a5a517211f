import { EngineError } from './errors';
import { warning } from './result/warnings';
import type { EngineWarning } from './result/warnings';

/**
 * Per-channel statistics of a capture, full scale = ±1, for capture metadata and warnings. dBFS follows AES17
 * (a full-scale sine reads 0 dBFS): RMS level 20·log10(√2·rms), peak level 20·log10(|peak|).
 */
export interface ChannelStats {
  sampleCount: number;
  /** Largest |x|, full-scale units. */
  peakLinear: number;
  /** 20·log10(peak), dB re full scale; null for digital silence. */
  peakDbfs: number | null;
  /** RMS including DC, full-scale units. */
  rmsLinear: number;
  /** AES17 level 20·log10(√2·rms), dBFS; null for digital silence. */
  rmsDbfs: number | null;
  /** Mean value (DC offset), full-scale units. */
  dcOffset: number;
  /** Samples with |x| ≥ clipThreshold. */
  clippedSampleCount: number;
  /** Runs of ≥ minFlatTopRun consecutive samples equal to the channel's maximum (or minimum) value, |value| ≥ flatTopMinLevel. */
  flatTopRunCount: number;
  /** Longest such run, samples (0 if none). */
  longestFlatTopRun: number;
}

export interface SignalStatsOptions {
  /** |x| at or above this counts as clipped, full-scale units (default 0.999 ≈ −0.009 dBFS peak). */
  clipThreshold?: number;
  /** Consecutive equal extreme samples that make a flat-top run (default 3). */
  minFlatTopRun?: number;
  /** Extreme values below this are not flat-top candidates, so coarse quantisation of quiet signals is not clipping (default 0.25). */
  flatTopMinLevel?: number;
}

export const DEFAULT_SIGNAL_STATS_OPTIONS: Readonly<Required<SignalStatsOptions>> = Object.freeze({
  clipThreshold: 0.999,
  minFlatTopRun: 3,
  flatTopMinLevel: 0.25,
});

function resolveOptions(options: SignalStatsOptions): Required<SignalStatsOptions> {
  const resolved = { ...DEFAULT_SIGNAL_STATS_OPTIONS, ...options };
  if (!(resolved.clipThreshold > 0) || !(resolved.flatTopMinLevel >= 0) || !Number.isInteger(resolved.minFlatTopRun) || resolved.minFlatTopRun < 2) {
    throw new EngineError('signal_stats_options_invalid', 'clipThreshold must be > 0, flatTopMinLevel ≥ 0 and minFlatTopRun an integer ≥ 2.');
  }
  return resolved;
}

function countRunsAt(samples: Float64Array, value: number, minRun: number): { runs: number; longest: number } {
  let runs = 0;
  let longest = 0;
  let current = 0;
  for (let i = 0; i <= samples.length; i++) {
    if (i < samples.length && samples[i] === value) {
      current++;
      continue;
    }
    if (current >= minRun) {
      runs++;
      longest = Math.max(longest, current);
    }
    current = 0;
  }
  return { runs, longest };
}

/** Peak (linear, dBFS), RMS (dBFS AES17), DC offset and clipping counts of one channel, full scale = ±1. */
export function channelStats(samples: Float64Array, options: SignalStatsOptions = {}): ChannelStats {
  if (!(samples instanceof Float64Array)) throw new EngineError('signal_invalid', 'Samples must be a Float64Array.');
  const { clipThreshold, minFlatTopRun, flatTopMinLevel } = resolveOptions(options);
  const count = samples.length;
  let max = -Infinity;
  let min = Infinity;
  let sum = 0;
  let sumSquares = 0;
  let clipped = 0;
  for (let i = 0; i < count; i++) {
    const x = samples[i];
    if (x - x !== 0) {
      throw new EngineError('signal_non_finite_sample', `Sample ${i} is ${String(x)}; statistics need finite samples.`, { details: { frame: i } });
    }
    if (x > max) max = x;
    if (x < min) min = x;
    sum += x;
    sumSquares += x * x;
    if (Math.abs(x) >= clipThreshold) clipped++;
  }
  const peakLinear = count === 0 ? 0 : Math.max(Math.abs(max), Math.abs(min));
  const rmsLinear = count === 0 ? 0 : Math.sqrt(sumSquares / count);
  let flatTopRunCount = 0;
  let longestFlatTopRun = 0;
  for (const extreme of count === 0 ? [] : max === min ? [max] : [max, min]) {
    if (Math.abs(extreme) < flatTopMinLevel || extreme === 0) continue;
    const { runs, longest } = countRunsAt(samples, extreme, minFlatTopRun);
    flatTopRunCount += runs;
    longestFlatTopRun = Math.max(longestFlatTopRun, longest);
  }
  return {
    sampleCount: count,
    peakLinear,
    peakDbfs: peakLinear > 0 ? 20 * Math.log10(peakLinear) : null,
    rmsLinear,
    rmsDbfs: rmsLinear > 0 ? 20 * Math.log10(Math.SQRT2 * rmsLinear) : null,
    dcOffset: count === 0 ? 0 : sum / count,
    clippedSampleCount: clipped,
    flatTopRunCount,
    longestFlatTopRun,
  };
}

/** channelStats for every channel of a capture. */
export function captureStats(channels: readonly Float64Array[], options: SignalStatsOptions = {}): ChannelStats[] {
  return channels.map((channel) => channelStats(channel, options));
}

export interface SignalWarningOptions {
  /** |DC offset| above this, full-scale units, gives a dc_offset warning (default 0.001, i.e. −60 dB re full scale). */
  dcOffsetThreshold?: number;
}

/** clipping and dc_offset warnings for a capture's channel statistics (thresholds are common practice, no source). */
export function signalStatsWarnings(stats: readonly ChannelStats[], options: SignalWarningOptions = {}): EngineWarning[] {
  const dcOffsetThreshold = options.dcOffsetThreshold ?? 0.001;
  const warnings: EngineWarning[] = [];
  stats.forEach((channel, index) => {
    if (channel.clippedSampleCount > 0 || channel.flatTopRunCount > 0) {
      warnings.push(
        warning('clipping', `Channel ${index} looks clipped: ${channel.clippedSampleCount} sample(s) at full scale, ${channel.flatTopRunCount} flat-topped run(s).`, {
          channel: index,
          clippedSampleCount: channel.clippedSampleCount,
          flatTopRunCount: channel.flatTopRunCount,
          longestFlatTopRun: channel.longestFlatTopRun,
        }),
      );
    }
    if (Math.abs(channel.dcOffset) > dcOffsetThreshold) {
      warnings.push(
        warning('dc_offset', `Channel ${index} has a DC offset of ${channel.dcOffset.toExponential(2)} full scale.`, {
          channel: index,
          dcOffset: channel.dcOffset,
        }),
      );
    }
  });
  return warnings;
}
