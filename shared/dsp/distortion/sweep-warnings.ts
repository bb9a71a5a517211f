import { warning, type EngineWarning } from '../result/warnings';
import type { CombinedOrders } from './sweep-curves';
import type { SweepHarmonics } from './sweep-harmonics';
import type { ResolvedSweepDistortionOptions } from './sweep-options';

export interface SweepWarningInput {
  gridHz: Float64Array;
  harmonics: SweepHarmonics;
  thdF: CombinedOrders;
  bandLimitHz: number;
  options: ResolvedSweepDistortionOptions;
  screeningHarmonics: SweepHarmonics | null;
  chainNear: boolean[] | null;
  noiseAvailable: boolean;
}

function windowWarning(label: string, harmonics: SweepHarmonics, lowestGridHz: number): EngineWarning[] {
  const short = harmonics.orders.filter((curve) => curve.plan.lowestTrustworthyFundamentalHz > lowestGridHz);
  if (short.length === 0) return [];
  const worst = short[short.length - 1];
  return [
    warning(
      'harmonic_orders_overlap',
      `${label}: the sweep leaves order ${short[0].order}${short.length > 1 ? `–${worst.order}` : ''} windows shorter than one period of f0 at low frequency (order ${worst.order}: ${(1000 * worst.plan.postPeakSeconds).toFixed(1)} ms, trustworthy from ${worst.plan.lowestTrustworthyFundamentalHz.toFixed(1)} Hz); use a longer sweep for these orders there.`,
      {
        orders: short.map((c) => c.order).join(','),
        highestOrderLowestTrustworthyFundamentalHz: worst.plan.lowestTrustworthyFundamentalHz,
      },
    ),
  ];
}

/** Warnings of a sweep distortion analysis (clipping is raised on the capture by the caller). */
export function sweepDistortionWarnings(input: SweepWarningInput): EngineWarning[] {
  const { gridHz, options } = input;
  const warnings: EngineWarning[] = [];
  const maxOrder = options.common.maxOrder;
  const fullOrdersUpToHz = input.bandLimitHz / maxOrder;
  if (gridHz[gridHz.length - 1] > fullOrdersUpToHz) {
    warnings.push(
      warning(
        'harmonics_beyond_band_dropped',
        `Above ${fullOrdersUpToHz.toFixed(1)} Hz fewer than ${maxOrder - 1} orders lie below the band limit ${input.bandLimitHz} Hz; THD there includes only the orders listed in curves.harmonicDistortion.ordersUsed.`,
        { bandLimitHz: input.bandLimitHz, allOrdersUpToHz: fullOrdersUpToHz },
      ),
    );
  }
  warnings.push(...windowWarning('THD orders', input.harmonics, gridHz[0]));
  if (input.screeningHarmonics) warnings.push(...windowWarning('Screening orders', input.screeningHarmonics, gridHz[0]));
  const bounded = input.thdF.isUpperBound.reduce((count, flag) => count + flag, 0);
  if (bounded > 0) {
    warnings.push(
      warning(
        'harmonic_below_noise_floor',
        `At ${bounded} of ${gridHz.length} frequencies at least one harmonic is not ${options.common.marginDb} dB above the noise floor; those HD values and the THD there are upper bounds.`,
        { frequencyCount: bounded },
      ),
    );
  }
  const snr = input.harmonics.linearSignalToNoiseDb;
  if (snr) {
    let worst = Number.POSITIVE_INFINITY;
    let worstHz = gridHz[0];
    snr.forEach((value, i) => {
      if (value < worst) {
        worst = value;
        worstHz = gridHz[i];
      }
    });
    if (worst < options.minSnrDb) {
      warnings.push(
        warning('low_snr', `The fundamental is only ${worst.toFixed(1)} dB above the noise at ${worstHz.toFixed(1)} Hz (threshold ${options.minSnrDb} dB); distortion below that cannot be measured.`, {
          worstSignalToNoiseDb: worst,
          atHz: worstHz,
        }),
      );
    }
  }
  if (input.chainNear && input.chainNear.some(Boolean)) {
    const count = input.chainNear.filter(Boolean).length;
    warnings.push(
      warning('near_chain_residual', `THD is within ${options.common.chainResidualMarginDb} dB of the loopback channel's at ${count} frequencies; there the result may describe the chain, not the device.`, {
        frequencyCount: count,
      }),
    );
  }
  return warnings;
}
