import { thdRFromThdF } from './thd';
import type { OrderCurve } from './sweep-harmonics';

/** NaN → null so curves serialise to JSON unchanged. */
export function nullable(values: ArrayLike<number>, scale = 1): (number | null)[] {
  return Array.from(values, (v) => (Number.isFinite(v) ? v * scale : null));
}

export interface CombinedOrders {
  /** √(Σ HD_n²) over the orders present at each frequency (NaN where none is). */
  ratio: Float64Array;
  isUpperBound: Uint8Array;
  ordersUsed: Int32Array;
  highestOrderUsed: Int32Array;
  /** Orders used whose window is shorter than one period of f0 (f0 below their lowest trustworthy frequency). */
  ordersBelowTrustworthyFrequency: Int32Array;
}

/** RMS-combine the orders at each grid frequency (THD_F, or the screening energy). */
export function combineOrders(gridHz: Float64Array, orders: readonly OrderCurve[]): CombinedOrders {
  const n = gridHz.length;
  const ratio = new Float64Array(n).fill(Number.NaN);
  const isUpperBound = new Uint8Array(n);
  const ordersUsed = new Int32Array(n);
  const highestOrderUsed = new Int32Array(n);
  const ordersBelowTrustworthyFrequency = new Int32Array(n);
  for (let i = 0; i < n; i++) {
    let sum = 0;
    for (const curve of orders) {
      const value = curve.ratio[i];
      if (!Number.isFinite(value)) continue;
      sum += value * value;
      ordersUsed[i]++;
      highestOrderUsed[i] = curve.order;
      if (curve.isUpperBound[i]) isUpperBound[i] = 1;
      if (gridHz[i] < curve.plan.lowestTrustworthyFundamentalHz) ordersBelowTrustworthyFrequency[i]++;
    }
    if (ordersUsed[i] > 0) ratio[i] = Math.sqrt(sum);
  }
  return { ratio, isUpperBound, ordersUsed, highestOrderUsed, ordersBelowTrustworthyFrequency };
}

export function thdRCurve(thdF: Float64Array): Float64Array {
  return thdF.map((v) => (Number.isFinite(v) ? thdRFromThdF(v) : Number.NaN));
}

/** Per-order description for a result: the window each order got and what it allows. */
export function orderWindows(orders: readonly OrderCurve[], sampleRateHz: number) {
  return orders.map((curve) => ({
    order: curve.order,
    windowPostPeakSeconds: curve.plan.postPeakSeconds,
    windowTotalSeconds: curve.plan.window.totalSamples / sampleRateHz,
    lowestTrustworthyFundamentalHz: curve.plan.lowestTrustworthyFundamentalHz,
  }));
}
