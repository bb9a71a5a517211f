import { designSynchronizedSweep, renderSweep, writeWav, type SweepParameters } from '@shared/dsp';
import { seededUniform } from '@shared/dsp/seeded-noise';
import { speedOfSoundMetresPerSecond } from '@shared/units/acoustics';
import { delayed, noise, simulateLoudspeaker, type LoudspeakerModel } from '@server/cli/simulated-loudspeaker';
import type { FailureMode, ProductPlan } from './demo-products';

/**
 * One simulated unit on its rig: its device model (the product's design with unit-to-unit spread, plus what is
 * wrong with it) and the capture the rig records, measurement on channel 0 and the drive loopback on channel 1.
 * Deterministic: the serial number seeds every random draw.
 */
export interface DemoUnit {
  serial: string;
  lot: string;
  measuredAt: Date;
  failure: FailureMode | null;
  device: LoudspeakerModel;
  /** Rub and buzz: a small level step at the cone's excursion peaks (high-order harmonics), re the drive peak. */
  rubStepFraction: number;
}

const INTERFACE_LATENCY_SECONDS = 0.005;
const NOISE_DBFS = -100;
const DAY_MS = 86_400_000;

/** A stable 32-bit seed from a text (FNV-1a). */
function seedOf(text: string): number {
  let hash = 0x811c9dc5;
  for (let i = 0; i < text.length; i++) hash = Math.imul(hash ^ text.charCodeAt(i), 0x01000193);
  return hash >>> 0;
}

/** Standard normal draws from the seeded uniform generator (Box–Muller). */
function gaussian(seed: number): () => number {
  const next = seededUniform(seed);
  return () => Math.sqrt(-2 * Math.log(next() + 1e-12)) * Math.cos(2 * Math.PI * next());
}

/** Model gain so the design reads `nominalLevelDbSpl` in its band: L_SPL = gain + sweep level − (dBFS at 1 Pa) + 94 dB. */
function nominalGainDb(plan: ProductPlan): number {
  return plan.nominalLevelDbSpl - (plan.sweep.levelDbfs - plan.rig.dbfsAtOnePascal + 20 * Math.log10(1 / 20e-6));
}

function withFailure(device: LoudspeakerModel, failure: FailureMode | null): LoudspeakerModel {
  switch (failure) {
    case 'high_thd':
      return { ...device, secondHarmonic: device.secondHarmonic * 8, thirdHarmonic: device.thirdHarmonic * 15 };
    case 'low_sensitivity':
      return { ...device, gainDb: device.gainDb - 3.5 };
    case 'breakup_peak':
      return { ...device, peakHz: device.peakHz * 1.3, peakGainDb: device.peakGainDb + 7 };
    case 'dome_resonance':
      return { ...device, peakHz: 7000, peakGainDb: 6, peakQ: 3 };
    case 'cushion_leak':
      return { ...device, highPassHz: 140, highPassQ: 0.5 };
    default:
      return device;
  }
}

export function demoUnit(plan: ProductPlan, lot: string, serial: string, measuredAt: Date, failure: FailureMode | null): DemoUnit {
  const draw = gaussian(seedOf(serial));
  const { nominal, spread } = plan;
  const distanceM = plan.conditions.distanceM ?? 0.02;
  const device: LoudspeakerModel = {
    ...nominal,
    gainDb: nominalGainDb(plan) + spread.gainDb * draw(),
    highPassHz: nominal.highPassHz * (1 + spread.highPassFraction * draw()),
    peakHz: nominal.peakHz * (1 + spread.peakFraction * draw()),
    peakGainDb: nominal.peakGainDb + spread.peakGainDb * draw(),
    acousticDelaySeconds: distanceM / speedOfSoundMetresPerSecond(plan.conditions.temperatureC),
  };
  return { serial, lot, measuredAt, failure, device: withFailure(device, failure), rubStepFraction: failure === 'rub_and_buzz' ? 0.08 : 0 };
}

/** Measuring times spread over the lot's days, within a day shift, from the serial's own random draws. */
export function measuringTimes(now: Date, fromDaysAgo: number, toDaysAgo: number, count: number, seedText: string): Date[] {
  const next = seededUniform(seedOf(seedText));
  return Array.from({ length: count }, (_, index) => {
    const daysAgo = count === 1 ? fromDaysAgo : fromDaysAgo - ((fromDaysAgo - toDaysAgo) * index) / (count - 1);
    // Within the shift: up to seven hours before the day mark, never after the seed's clock.
    return new Date(now.getTime() - daysAgo * DAY_MS - (1 + 6 * next()) * 3_600_000);
  });
}

function rubAndBuzz(drive: Float64Array, stepFraction: number, drivePeak: number): Float64Array {
  if (stepFraction === 0) return drive;
  const knee = 0.92 * drivePeak;
  return drive.map((x) => (Math.abs(x) > knee ? x + Math.sign(x) * stepFraction * drivePeak : x));
}

/** The stimulus of the product's line, rendered once per seed run. */
export function renderLineSweep(plan: ProductPlan): Float64Array {
  return renderSweep(designSynchronizedSweep(plan.sweep as SweepParameters, 'sweep'));
}

/** The rig's capture of one unit: float32 WAV, channel 0 the microphone (or ear simulator), channel 1 the loopback. */
export function captureWavOf(plan: ProductPlan, unit: DemoUnit, sweep: Float64Array): Uint8Array {
  const fs = plan.sweep.sampleRateHz;
  const drivePeak = 10 ** (plan.sweep.levelDbfs / 20);
  const acoustic = simulateLoudspeaker(rubAndBuzz(sweep, unit.rubStepFraction, drivePeak), fs, unit.device);
  const latency = Math.round(INTERFACE_LATENCY_SECONDS * fs);
  const hiss = noise(sweep.length, NOISE_DBFS, seedOf(`${unit.serial}/noise`));
  const measurement = delayed(acoustic, latency).map((value, n) => value + hiss[n]);
  return writeWav({ sampleRateHz: fs, channels: [measurement, delayed(sweep, latency)], encoding: 'float32' });
}

/** A calibrator's tone at the rig input: `statedLevelDbSpl` at 1 kHz read through the chain, 2 s, with the rig's hiss. */
export function calibratorWavOf(dbfsAtOnePascal: number, statedLevelDbSpl: number, seedText: string, sampleRateHz = 48_000): Uint8Array {
  const levelDbfs = dbfsAtOnePascal + statedLevelDbSpl - 20 * Math.log10(1 / 20e-6);
  // AES17: a sine of peak amplitude a reads 20·log10(a) dBFS.
  const amplitude = 10 ** (levelDbfs / 20);
  const length = 2 * sampleRateHz;
  const hiss = noise(length, NOISE_DBFS, seedOf(seedText));
  const tone = Float64Array.from({ length }, (_, n) => amplitude * Math.sin((2 * Math.PI * 1000 * n) / sampleRateHz) + hiss[n]);
  return writeWav({ sampleRateHz, channels: [tone], encoding: 'float32' });
}
