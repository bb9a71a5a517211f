import { warning, type EngineWarning } from '../result/warnings';
import type { ToneFigures } from './tone-figures';

export interface ChainResidualComparison {
  thdNearChainResidual: boolean;
  thdPlusNoiseNearChainResidual: boolean;
  /** Orders whose HD_n is within the margin of the loopback channel's. */
  harmonicOrdersNearChainResidual: number[];
}

/**
 * A DUT figure is only meaningful clearly above what the measurement chain produces by itself: the loopback
 * channel, analysed the same way, is the chain's residual. Marks (in place) every DUT harmonic within
 * `marginDb` of the loopback's same order, and compares THD_F and THD+N.
 */
export function compareWithChainResidual(
  device: ToneFigures,
  loopback: ToneFigures,
  marginDb: number,
): ChainResidualComparison {
  const loopbackByOrder = new Map(loopback.harmonics.map((h) => [h.order, h]));
  const near: number[] = [];
  for (const harmonic of device.harmonics) {
    const chain = loopbackByOrder.get(harmonic.order);
    harmonic.nearChainResidual = chain !== undefined && harmonic.valueDb - chain.valueDb < marginDb;
    if (harmonic.nearChainResidual) near.push(harmonic.order);
  }
  return {
    thdNearChainResidual: device.thdF.valueDb - loopback.thdF.valueDb < marginDb,
    thdPlusNoiseNearChainResidual: device.thdPlusNoise.valueDb - loopback.thdPlusNoise.valueDb < marginDb,
    harmonicOrdersNearChainResidual: near,
  };
}

export function chainResidualWarnings(comparison: ChainResidualComparison, marginDb: number, label: string): EngineWarning[] {
  const parts: string[] = [];
  if (comparison.thdNearChainResidual) parts.push('THD');
  if (comparison.thdPlusNoiseNearChainResidual) parts.push('THD+N');
  if (comparison.harmonicOrdersNearChainResidual.length > 0) parts.push(`HD of orders ${comparison.harmonicOrdersNearChainResidual.join(', ')}`);
  if (parts.length === 0) return [];
  return [
    warning('near_chain_residual', `${label}: ${parts.join(', ')} within ${marginDb} dB of the loopback channel's own figure; the result may describe the chain, not the device.`, {
      marginDb,
    }),
  ];
}
