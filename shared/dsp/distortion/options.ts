import {
  rejectUnknownKeys,
  requireInteger,
  requireNumberInRange,
  requireObject,
  requireOneOf,
} from '../stimuli/parameter-checks';
import { EngineError } from '../errors';
import type { ThdForm } from './thd';
import type { ResidualWeighting, ThdPlusNoiseBand } from './thd-plus-noise';

/** Options every distortion analysis shares (sweep, tone, stepped). */
export interface CommonDistortionOptions {
  /** Highest harmonic order K (orders 2..K). Default 10. */
  maxOrder?: number;
  /** Stated upper analysis limit in Hz; harmonics above min(Nyquist, this[, sweep stop]) are dropped. Default 20 000. */
  upperLimitHz?: number;
  /** Margin over the noise floor below which a harmonic is an upper bound, dB. Default 10. */
  marginDb?: number;
  /** Which THD form is the headline figure. Default 'thd_f'. Both are always reported. */
  thdHeadline?: ThdForm;
  /** High-order screening (rub and buzz): orders fromOrder..toOrder. Default 10–35; false switches it off. */
  screening?: { fromOrder?: number; toOrder?: number } | false;
  /** Band for "max THD" and the "THD below X %" summary. */
  summary?: SummaryOptions;
  /** Flag DUT results within this many dB of the loopback channel's. Default 10. */
  chainResidualMarginDb?: number;
}

export interface SummaryOptions {
  /** Band for the maximum THD, Hz. Default [100, 10 000]. */
  maxBandHz?: [number, number];
  /** Threshold X for "THD below X % from A to B". Default 1 %. */
  belowPercent?: number;
  /** Frequency the "below X %" interval must contain. Default 1000 Hz. */
  referenceHz?: number;
}

export interface ResolvedCommonOptions {
  maxOrder: number;
  upperLimitHz: number;
  marginDb: number;
  thdHeadline: ThdForm;
  screening: { fromOrder: number; toOrder: number } | null;
  summary: Required<SummaryOptions>;
  chainResidualMarginDb: number;
}

export const COMMON_OPTION_KEYS = [
  'maxOrder',
  'upperLimitHz',
  'marginDb',
  'thdHeadline',
  'screening',
  'summary',
  'chainResidualMarginDb',
] as const;

export const DEFAULT_SCREENING_ORDERS = { fromOrder: 10, toOrder: 35 } as const;

function resolveScreening(value: unknown, field: string): ResolvedCommonOptions['screening'] {
  if (value === false) return null;
  const raw = value === undefined ? {} : requireObject(value, field);
  rejectUnknownKeys(raw, field, ['fromOrder', 'toOrder']);
  const fromOrder = requireInteger(raw.fromOrder ?? DEFAULT_SCREENING_ORDERS.fromOrder, `${field}.fromOrder`, 2, 100);
  const toOrder = requireInteger(raw.toOrder ?? DEFAULT_SCREENING_ORDERS.toOrder, `${field}.toOrder`, 2, 100);
  if (toOrder < fromOrder) {
    throw new EngineError('screening_orders_reversed', `${field}.toOrder (${toOrder}) must not be below fromOrder (${fromOrder}).`, {
      field: `${field}.toOrder`,
    });
  }
  return { fromOrder, toOrder };
}

function resolveSummary(value: unknown, field: string): Required<SummaryOptions> {
  const raw = value === undefined ? {} : requireObject(value, field);
  rejectUnknownKeys(raw, field, ['maxBandHz', 'belowPercent', 'referenceHz']);
  const band = raw.maxBandHz ?? [100, 10_000];
  if (!Array.isArray(band) || band.length !== 2) {
    throw new EngineError('parameter_not_a_band', `${field}.maxBandHz must be [lowHz, highHz].`, { field: `${field}.maxBandHz` });
  }
  const low = requireNumberInRange(band[0], `${field}.maxBandHz[0]`, 1, 1e6, 'Hz');
  const high = requireNumberInRange(band[1], `${field}.maxBandHz[1]`, 1, 1e6, 'Hz');
  if (high <= low) {
    throw new EngineError('band_empty', `${field}.maxBandHz must have low < high.`, { field: `${field}.maxBandHz` });
  }
  return {
    maxBandHz: [low, high],
    belowPercent: requireNumberInRange(raw.belowPercent ?? 1, `${field}.belowPercent`, 1e-6, 100, '%'),
    referenceHz: requireNumberInRange(raw.referenceHz ?? 1000, `${field}.referenceHz`, 1, 1e6, 'Hz'),
  };
}

/** Validate and default the shared options found in `raw` (the caller rejects unknown keys). */
export function resolveCommonOptions(raw: Record<string, unknown>, field: string): ResolvedCommonOptions {
  return {
    maxOrder: requireInteger(raw.maxOrder ?? 10, `${field}.maxOrder`, 2, 100),
    upperLimitHz: requireNumberInRange(raw.upperLimitHz ?? 20_000, `${field}.upperLimitHz`, 10, 1e6, 'Hz'),
    marginDb: requireNumberInRange(raw.marginDb ?? 10, `${field}.marginDb`, 0, 60, 'dB'),
    thdHeadline: requireOneOf(raw.thdHeadline ?? 'thd_f', `${field}.thdHeadline`, ['thd_f', 'thd_r'] as const),
    screening: resolveScreening(raw.screening, `${field}.screening`),
    summary: resolveSummary(raw.summary, `${field}.summary`),
    chainResidualMarginDb: requireNumberInRange(raw.chainResidualMarginDb ?? 10, `${field}.chainResidualMarginDb`, 0, 60, 'dB'),
  };
}

export interface ThdPlusNoiseOptions {
  lowHz?: number;
  highHz?: number;
  weighting?: ResidualWeighting;
}

export function resolveThdPlusNoiseBand(value: unknown, field: string): ThdPlusNoiseBand {
  const raw = value === undefined ? {} : requireObject(value, field);
  rejectUnknownKeys(raw, field, ['lowHz', 'highHz', 'weighting']);
  const lowHz = requireNumberInRange(raw.lowHz ?? 20, `${field}.lowHz`, 0, 1e6, 'Hz');
  const highHz = requireNumberInRange(raw.highHz ?? 20_000, `${field}.highHz`, 1, 1e6, 'Hz');
  if (highHz <= lowHz) {
    throw new EngineError('band_empty', `${field}.highHz must be above lowHz.`, { field: `${field}.highHz` });
  }
  return { lowHz, highHz, weighting: requireOneOf(raw.weighting ?? 'none', `${field}.weighting`, ['none', 'a'] as const) };
}

/** The options object itself: undefined means all defaults. */
export function requireOptionsObject(value: unknown, field: string): Record<string, unknown> {
  return value === undefined ? {} : requireObject(value, field);
}
