/** Our plan ids. "bench" is free and needs no subscription; the others are paid monthly. */
export const PLAN_IDS = ['bench', 'line', 'plant'] as const;
export type PlanId = (typeof PLAN_IDS)[number];
export type PaidPlanId = Exclude<PlanId, 'bench'>;

export const FREE_PLAN_ID: PlanId = 'bench';

export interface PlanLimits {
  analysesPerMonth: number;
  /** Audio analysed per month, summed over captures (a 2 s sweep counts 2 s whatever its channel count). */
  audioMinutesPerMonth: number;
  /** Captures, stimuli and results kept, in bytes (decimal: 1 GB = 10^9 bytes). */
  storageBytes: number;
  /** Per API key. */
  requestsPerMinute: number;
  /** Each upload limit is checked on its own; a file must pass all of them. */
  maxUploadBytes: number;
  maxUploadDurationSeconds: number;
  maxUploadChannels: number;
  maxUploadSampleRateHz: number;
}

export interface Plan {
  id: PlanId;
  name: string;
  summary: string;
  /** Price per month in minor units (cents) of `currency`; 0 for the free plan. */
  monthlyPriceMinor: number;
  /** ISO 4217, lower case as the payment provider writes it. */
  currency: 'eur';
  /**
   * How the monthly price is found at the payment provider (a price "lookup key"), so the same code works
   * against the local fake and a real account without configuring price ids.
   */
  priceLookupKey: string;
  limits: PlanLimits;
}

const GB = 1e9;

export const PLANS: Record<PlanId, Plan> = {
  bench: {
    id: 'bench',
    name: 'Bench',
    summary: 'For evaluating Sweepline on one bench rig.',
    monthlyPriceMinor: 0,
    currency: 'eur',
    priceLookupKey: 'sweepline_bench_monthly',
    limits: {
      analysesPerMonth: 200,
      audioMinutesPerMonth: 60,
      storageBytes: 1 * GB,
      requestsPerMinute: 60,
      maxUploadBytes: 64 * 1e6,
      maxUploadDurationSeconds: 60,
      maxUploadChannels: 2,
      maxUploadSampleRateHz: 96_000,
    },
  },
  line: {
    id: 'line',
    name: 'Line',
    summary: 'For a lab or a production line with several rigs.',
    monthlyPriceMinor: 29_000,
    currency: 'eur',
    priceLookupKey: 'sweepline_line_monthly',
    limits: {
      analysesPerMonth: 20_000,
      audioMinutesPerMonth: 6_000,
      storageBytes: 100 * GB,
      requestsPerMinute: 600,
      maxUploadBytes: 256 * 1e6,
      maxUploadDurationSeconds: 600,
      maxUploadChannels: 8,
      maxUploadSampleRateHz: 192_000,
    },
  },
  plant: {
    id: 'plant',
    name: 'Plant',
    summary: 'For several production lines and sites.',
    monthlyPriceMinor: 149_000,
    currency: 'eur',
    priceLookupKey: 'sweepline_plant_monthly',
    limits: {
      analysesPerMonth: 200_000,
      audioMinutesPerMonth: 60_000,
      storageBytes: 1_000 * GB,
      requestsPerMinute: 3_000,
      maxUploadBytes: 1_000 * 1e6,
      maxUploadDurationSeconds: 1_800,
      maxUploadChannels: 32,
      maxUploadSampleRateHz: 384_000,
    },
  },
};

export function isPlanId(value: unknown): value is PlanId {
  return typeof value === 'string' && (PLAN_IDS as readonly string[]).includes(value);
}

export function isPaidPlanId(value: unknown): value is PaidPlanId {
  return isPlanId(value) && PLANS[value].monthlyPriceMinor > 0;
}

export function planById(planId: PlanId): Plan {
  return PLANS[planId];
}

export function planByPriceLookupKey(lookupKey: string | null | undefined): Plan | undefined {
  return Object.values(PLANS).find((plan) => plan.priceLookupKey === lookupKey);
}
