import { firstRadix4Stage, radix2Stage, radix4Stage } from './fft-stages';

/**
 * In-place complex FFT kernel over separate real/imaginary Float64Arrays: iterative decimation-in-time,
 * radix-4 stages (one radix-2 stage first when log2(size) is odd), forward sign e^(−j2πkn/N), no scaling
 * (Cooley & Tukey, Math. Comp. 19(90), 1965; radix-4 butterfly as in Oppenheim & Schafer, Discrete-Time Signal
 * Processing, ch. 9).
 *
 * Speed comes from: twiddles precomputed per stage and stored contiguously in the order the butterflies read
 * them (no strided table look-ups), the input permutation folded into the caller's load pass (bitReversal),
 * radix-4 stages (half the passes over memory of radix-2), and cache blocking: all stages up to BLOCK_SIZE run
 * block by block while the block is still in cache, before the remaining large stages sweep the whole array.
 *
 * A plan is pure memoisation of tables that depend only on the size: results never depend on the cache.
 */
export interface ComplexFftPlan {
  size: number;
  /** bitReversal[n] = index n with its log2(size) bits reversed: the load position of input sample n. */
  bitReversal: Uint32Array;
  /** Per radix-4 stage: [cos θ, −sin θ] for k = 0..L/4−1, θ = 2πk/L (W^2k and W^3k are formed from it). */
  stageTwiddles: Float64Array[];
  /** Butterfly span L of each radix-4 stage, ascending. */
  stageSpans: number[];
  /** True when a radix-2 stage (span 2) runs before the radix-4 stages. */
  leadingRadix2: boolean;
}

/** Stages with span ≤ BLOCK_SIZE run block by block (2^12 complex values = 64 KiB of re+im). */
const BLOCK_SIZE = 4096;

const plans = new Map<number, ComplexFftPlan>();

function log2Exact(size: number): number {
  return 31 - Math.clz32(size);
}

function buildPlan(size: number): ComplexFftPlan {
  const bits = log2Exact(size);
  const bitReversal = new Uint32Array(size);
  for (let n = 1; n < size; n++) {
    bitReversal[n] = (bitReversal[n >> 1] >> 1) | ((n & 1) << (bits - 1));
  }
  const leadingRadix2 = bits % 2 === 1;
  const stageSpans: number[] = [];
  const stageTwiddles: Float64Array[] = [];
  for (let span = leadingRadix2 ? 8 : 4; span <= size; span *= 4) {
    const quarter = span / 4;
    const table = new Float64Array(2 * quarter);
    for (let k = 0; k < quarter; k++) {
      const theta = (2 * Math.PI * k) / span;
      table[2 * k] = Math.cos(theta);
      table[2 * k + 1] = -Math.sin(theta);
    }
    stageSpans.push(span);
    stageTwiddles.push(table);
  }
  return { size, bitReversal, stageTwiddles, stageSpans, leadingRadix2 };
}

/** Cached plan for a power-of-two `size` ≥ 2 (the caller validates the size). */
export function complexFftPlan(size: number): ComplexFftPlan {
  let plan = plans.get(size);
  if (!plan) {
    plan = buildPlan(size);
    plans.set(size, plan);
  }
  return plan;
}

/**
 * Forward complex DFT in place, no scaling. The data must already be in bit-reversed order
 * (re[plan.bitReversal[n]] = x[n]); the output is in natural order.
 */
export function complexFftBitReversedInput(plan: ComplexFftPlan, re: Float64Array, im: Float64Array): void {
  const size = plan.size;
  const spans = plan.stageSpans;
  const tables = plan.stageTwiddles;
  const block = Math.min(BLOCK_SIZE, size);
  let stage = 0;
  while (stage < spans.length && spans[stage] <= block) stage++;
  const blockedStages = stage;
  for (let start = 0; start < size; start += block) {
    const end = start + block;
    if (plan.leadingRadix2) radix2Stage(re, im, start, end);
    for (let s = 0; s < blockedStages; s++) {
      if (spans[s] === 4) firstRadix4Stage(re, im, start, end);
      else radix4Stage(re, im, start, end, spans[s], tables[s]);
    }
  }
  for (let s = blockedStages; s < spans.length; s++) radix4Stage(re, im, 0, size, spans[s], tables[s]);
}
