import type { LoudspeakerModel } from '@server/cli/simulated-loudspeaker';

/**
 * The invented product lines of Kestrel Bay Acoustics in the local demo: three models, each measured on its own
 * rig over the last six weeks. Every figure here is invented; times are days before the seed's clock.
 */

/** Why a unit is off: each mode changes its simulated device in one way (demo-units.ts). */
export type FailureMode = 'rub_and_buzz' | 'high_thd' | 'low_sensitivity' | 'breakup_peak' | 'dome_resonance' | 'cushion_leak';

export interface LotPlan {
  lot: string;
  /** First and last measuring day, days before the seed's clock. */
  fromDaysAgo: number;
  toDaysAgo: number;
  unitCount: number;
  /** Unit index in the lot (0-based) → what is wrong with it. */
  failures: Record<number, FailureMode>;
  /** Serial number of the lot's first unit; the others follow. */
  firstSerial: number;
}

export interface RigPlan {
  rigId: string;
  inputChannel: number;
  /** The chain's real sensitivity in the simulation: a 1 Pa tone reads this many dBFS. */
  dbfsAtOnePascal: number;
}

export interface ProductPlan {
  model: string;
  serialPrefix: string;
  deviceType: 'loudspeaker' | 'headphone';
  rig: RigPlan;
  stimulusName: string;
  sweep: { startHz: number; stopHz: number; approximateDurationSeconds: number; sampleRateHz: number; levelDbfs: number; leadingSilenceSeconds: number; trailingSilenceSeconds: number };
  conditions: { distanceM?: number; driveVoltageVrms: number; nominalImpedanceOhm: number; environment?: 'anechoic' | 'half_space' | 'near_field'; fixture: string; temperatureC: number };
  sensitivityBandHz: [number, number];
  /** Engine options of the line's analyses (the same for every unit, golden ones included). */
  responseOptions: Record<string, unknown>;
  distortionOptions: Record<string, unknown>;
  /** The design's level in the sensitivity band, dB SPL at the stated drive and distance (sets the model gain). */
  nominalLevelDbSpl: number;
  /** The design shape; gainDb and acousticDelaySeconds are set per unit. */
  nominal: Omit<LoudspeakerModel, 'gainDb' | 'acousticDelaySeconds'>;
  /** Unit-to-unit spread (one standard deviation). */
  spread: { gainDb: number; highPassFraction: number; peakFraction: number; peakGainDb: number };
  tags: string[];
  lots: LotPlan[];
}

// Wider than the reported 20 Hz–20 kHz, so the band edges of the sweep stay outside the curves and masks.
const SWEEP_48K = { startHz: 10, stopHz: 24_000, approximateDurationSeconds: 1, sampleRateHz: 48_000, leadingSilenceSeconds: 0.05, trailingSilenceSeconds: 0.3 };

// 24 points per octave over the reported band; high-order screening (rub and buzz) over orders 10–20.
const RESPONSE_OPTIONS = { grid: { pointsPerOctave: 24, startHz: 20, stopHz: 20_000 } };
const SCREENING = { screening: { fromOrder: 10, toOrder: 20 } };

export const KB65: ProductPlan = {
  model: 'KB-65 woofer',
  serialPrefix: 'KB65-26',
  deviceType: 'loudspeaker',
  rig: { rigId: 'kb65-line1', inputChannel: 0, dbfsAtOnePascal: -38 },
  stimulusName: 'KB-65 line sweep 10 Hz–24 kHz, 1 s',
  sweep: { ...SWEEP_48K, levelDbfs: -6 },
  conditions: { distanceM: 1, driveVoltageVrms: 2.83, nominalImpedanceOhm: 8, environment: 'half_space', fixture: 'Line 1 test baffle', temperatureC: 21 },
  sensitivityBandHz: [300, 3000],
  responseOptions: RESPONSE_OPTIONS,
  distortionOptions: SCREENING,
  nominalLevelDbSpl: 87,
  nominal: { highPassHz: 55, highPassQ: 0.9, peakHz: 1800, peakGainDb: 4, peakQ: 4, lowPassHz: 6000, secondHarmonic: 0.008, thirdHarmonic: 0.02 },
  spread: { gainDb: 0.3, highPassFraction: 0.03, peakFraction: 0.015, peakGainDb: 0.25 },
  tags: ['line-1'],
  lots: [
    { lot: 'KB65-2611A', fromDaysAgo: 39, toDaysAgo: 34, unitCount: 8, failures: { 5: 'rub_and_buzz' }, firstSerial: 1201 },
    { lot: 'KB65-2611B', fromDaysAgo: 20, toDaysAgo: 15, unitCount: 8, failures: { 2: 'low_sensitivity', 6: 'breakup_peak' }, firstSerial: 1301 },
    { lot: 'KB65-2612A', fromDaysAgo: 10, toDaysAgo: 4, unitCount: 8, failures: { 4: 'high_thd' }, firstSerial: 1401 },
  ],
};

export const KBT25: ProductPlan = {
  model: 'KB-T25 tweeter',
  serialPrefix: 'KBT25-26',
  deviceType: 'loudspeaker',
  rig: { rigId: 'kbt25-line2', inputChannel: 0, dbfsAtOnePascal: -36.5 },
  stimulusName: 'KB-T25 line sweep 10 Hz–24 kHz, 1 s',
  // Tweeters are easily burnt: a lower sweep level and 2 V at the terminals.
  sweep: { ...SWEEP_48K, levelDbfs: -12 },
  conditions: { distanceM: 1, driveVoltageVrms: 2, nominalImpedanceOhm: 6, environment: 'half_space', fixture: 'Line 2 tweeter baffle', temperatureC: 21 },
  sensitivityBandHz: [2000, 10_000],
  responseOptions: RESPONSE_OPTIONS,
  // A tweeter's distortion is read in its own band only (below it the fundamental is tiny).
  distortionOptions: { ...SCREENING, summary: { maxBandHz: [2000, 15_000], referenceHz: 4000 } },
  nominalLevelDbSpl: 88,
  nominal: { highPassHz: 1300, highPassQ: 0.8, peakHz: 14_000, peakGainDb: 2, peakQ: 2, lowPassHz: 21_000, secondHarmonic: 0.005, thirdHarmonic: 0.01 },
  spread: { gainDb: 0.25, highPassFraction: 0.03, peakFraction: 0.02, peakGainDb: 0.2 },
  tags: ['line-2'],
  lots: [
    { lot: 'KBT25-2611A', fromDaysAgo: 33, toDaysAgo: 29, unitCount: 7, failures: {}, firstSerial: 501 },
    { lot: 'KBT25-2612A', fromDaysAgo: 9, toDaysAgo: 5, unitCount: 7, failures: { 3: 'dome_resonance' }, firstSerial: 601 },
  ],
};

export const KBH40: ProductPlan = {
  model: 'KB-H40 headphone',
  serialPrefix: 'KBH40-26',
  deviceType: 'headphone',
  rig: { rigId: 'kbh40-ear-sim', inputChannel: 0, dbfsAtOnePascal: -45 },
  stimulusName: 'KB-H40 ear-simulator sweep 10 Hz–24 kHz, 1 s',
  sweep: { ...SWEEP_48K, levelDbfs: -12 },
  conditions: { driveVoltageVrms: 0.1, nominalImpedanceOhm: 32, fixture: 'Ear simulator with pinna, left channel', temperatureC: 22 },
  sensitivityBandHz: [300, 3000],
  responseOptions: RESPONSE_OPTIONS,
  distortionOptions: SCREENING,
  nominalLevelDbSpl: 86,
  nominal: { highPassHz: 18, highPassQ: 0.7, peakHz: 2800, peakGainDb: 8, peakQ: 1.5, lowPassHz: 9000, secondHarmonic: 0.004, thirdHarmonic: 0.01 },
  spread: { gainDb: 0.35, highPassFraction: 0.05, peakFraction: 0.02, peakGainDb: 0.3 },
  tags: ['headphone-cell'],
  lots: [
    { lot: 'KBH40-2611A', fromDaysAgo: 27, toDaysAgo: 23, unitCount: 6, failures: { 1: 'cushion_leak' }, firstSerial: 301 },
    { lot: 'KBH40-2612A', fromDaysAgo: 6, toDaysAgo: 2, unitCount: 6, failures: {}, firstSerial: 401 },
  ],
};

export const DEMO_PRODUCTS: ProductPlan[] = [KB65, KBT25, KBH40];

/** Golden (reference) units of the KB-65: the first three set mask version 1, all five version 2. */
export const KB65_GOLDEN = {
  lot: 'KB65-GOLDEN',
  firstSerial: 1001,
  unitCount: 5,
  firstBatch: 3,
  firstBatchDaysAgo: 41,
  secondBatchDaysAgo: 22,
  maskName: 'KB-65 woofer response limits (golden units)',
  coverageFactor: 3,
  minHalfWidthDb: 1.5,
};

export function serialOf(plan: ProductPlan, number: number): string {
  return `${plan.serialPrefix}-${String(number).padStart(6, '0')}`;
}
