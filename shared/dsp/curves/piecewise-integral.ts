import { segmentIndex } from './interpolate';

/**
 * Integral of a piecewise function over any interval in O(1) segment evaluations, from prefix sums of the
 * per-segment integrals. The prefix sums restart every octave of node frequency ("blocks"), so a difference of
 * two prefix values never mixes in the large totals of distant octaves: a band 120 dB below the rest of the
 * spectrum keeps its relative precision (a single global cumulative sum would lose it to cancellation).
 */
export interface PiecewiseIntegral {
  readonly firstHz: number;
  readonly lastHz: number;
  /** ∫ over [aHz, bHz], firstHz ≤ aHz ≤ bHz ≤ lastHz (0 when bHz ≤ aHz). */
  integrate(aHz: number, bHz: number): number;
}

/** Integral over the part [aHz, bHz] of segment `segment` = [x_segment, x_segment+1]. */
export type SegmentPart = (segment: number, aHz: number, bHz: number) => number;

export function buildPiecewiseIntegral(nodesHz: Float64Array, part: SegmentPart): PiecewiseIntegral {
  const nodeCount = nodesHz.length;
  const blockOfNode = new Int32Array(nodeCount);
  const localPrefix = new Float64Array(nodeCount);
  const blockTotals: number[] = [];
  let blockStartHz = nodesHz[0];
  let running = 0;
  for (let k = 1; k < nodeCount; k++) {
    const segment = k - 1;
    running += part(segment, nodesHz[segment], nodesHz[k]);
    if (nodesHz[k] >= 2 * blockStartHz) {
      blockTotals.push(running);
      running = 0;
      blockStartHz = nodesHz[k];
      blockOfNode[k] = blockTotals.length;
      localPrefix[k] = 0;
    } else {
      blockOfNode[k] = blockTotals.length;
      localPrefix[k] = running;
    }
  }
  blockTotals.push(running);

  const segmentOf = (valueHz: number) => segmentIndex(nodesHz, valueHz);

  // Integral from node p to node q (p ≤ q) out of the block-local prefix sums.
  const betweenNodes = (p: number, q: number): number => {
    const blockP = blockOfNode[p];
    const blockQ = blockOfNode[q];
    if (blockP === blockQ) return localPrefix[q] - localPrefix[p];
    let sum = blockTotals[blockP] - localPrefix[p] + localPrefix[q];
    for (let block = blockP + 1; block < blockQ; block++) sum += blockTotals[block];
    return sum;
  };

  return {
    firstHz: nodesHz[0],
    lastHz: nodesHz[nodeCount - 1],
    integrate(aHz: number, bHz: number): number {
      if (!(bHz > aHz)) return 0;
      const i = segmentOf(aHz);
      let j = segmentOf(bHz);
      // b sitting exactly on a node belongs to the segment that ends there.
      if (j > i && nodesHz[j] === bHz) j -= 1;
      if (i === j) return part(i, aHz, bHz);
      return part(i, aHz, nodesHz[i + 1]) + betweenNodes(i + 1, j) + part(j, nodesHz[j], bHz);
    },
  };
}
