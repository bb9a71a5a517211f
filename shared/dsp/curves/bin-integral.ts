import type { PiecewiseIntegral } from './piecewise-integral';

/**
 * ∫ y(f)/f df (= ∫ y d(ln f)) for y linear in f between FFT bins f_k = k·binSpacingHz, built in one pass over the
 * bins. Same block-restarted prefix sums as buildPiecewiseIntegral (blocks are bins [2^(j−1), 2^j), i.e.
 * octaves), specialised for even spacing because this is the hot path of smoothing a long capture: no node
 * array, no per-bin closure, and the per-bin logarithm replaced by its series where that is exact to rounding.
 */

/** Below this bin the weights use Math.log1p; above, a 5-term series whose error is under 1e-16 relative. */
const SERIES_FROM_BIN = 1024;

function blockOfBin(k: number): number {
  return 32 - Math.clz32(k);
}

export function binLogIntegral(values: Float64Array, binSpacingHz: number): PiecewiseIntegral {
  const binCount = values.length;
  const localPrefix = new Float64Array(binCount);
  const blockTotals = new Float64Array(blockOfBin(binCount - 1) + 1);
  let running = 0;
  const seriesFrom = Math.min(SERIES_FROM_BIN, binCount - 1);
  // Segment [k, k+1] integrates to y_k·logWeight + (y_{k+1} − y_k)·slopeWeight with logWeight = ln(1 + 1/k) and
  // slopeWeight = 1 − k·ln(1 + 1/k); node k + 1 opens a new block when it is a power of two.
  for (let k = 1; k < seriesFrom; k++) {
    localPrefix[k] = running;
    const logWeight = Math.log1p(1 / k);
    running += values[k] * logWeight + (values[k + 1] - values[k]) * (1 - k * logWeight);
    if (((k + 1) & k) === 0) {
      blockTotals[blockOfBin(k)] = running;
      running = 0;
    }
  }
  for (let k = seriesFrom; k < binCount - 1; k++) {
    localPrefix[k] = running;
    const x = 1 / k;
    const logWeight = x * (1 - x * (1 / 2 - x * (1 / 3 - x * (1 / 4 - x / 5))));
    const slopeWeight = x * (1 / 2 - x * (1 / 3 - x * (1 / 4 - x * (1 / 5 - x / 6))));
    running += values[k] * logWeight + (values[k + 1] - values[k]) * slopeWeight;
    if (((k + 1) & k) === 0) {
      blockTotals[blockOfBin(k)] = running;
      running = 0;
    }
  }
  localPrefix[binCount - 1] = running;
  blockTotals[blockOfBin(binCount - 1)] = running;

  const lastSegment = binCount - 2;
  const lastHz = (binCount - 1) * binSpacingHz;

  // Partial segment [a, b] ⊂ [k, k+1] in bin units (a > 0): y_a·ln(1+x) + s·a·(x − ln(1+x)), x = (b − a)/a.
  const partial = (k: number, a: number, b: number): number => {
    const slope = values[k + 1] - values[k];
    const valueAtA = values[k] + slope * (a - k);
    const x = (b - a) / a;
    const logRatio = Math.log1p(x);
    return valueAtA * logRatio + slope * a * (x - logRatio);
  };

  const betweenNodes = (p: number, q: number): number => {
    const blockP = blockOfBin(p);
    const blockQ = blockOfBin(q);
    if (blockP === blockQ) return localPrefix[q] - localPrefix[p];
    let sum = blockTotals[blockP] - localPrefix[p] + localPrefix[q];
    for (let block = blockP + 1; block < blockQ; block++) sum += blockTotals[block];
    return sum;
  };

  return {
    firstHz: 0,
    lastHz,
    integrate(aHz: number, bHz: number): number {
      if (!(bHz > aHz)) return 0;
      const a = aHz / binSpacingHz;
      const b = bHz / binSpacingHz;
      const i = Math.min(lastSegment, Math.floor(a));
      let j = Math.min(lastSegment, Math.floor(b));
      if (j > i && j === b) j -= 1;
      if (i === j) return partial(i, a, b);
      return partial(i, a, i + 1) + betweenNodes(i + 1, j) + partial(j, j, b);
    },
  };
}
