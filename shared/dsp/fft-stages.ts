/**
 * Butterfly stages of the decimation-in-time complex FFT in fft-plan.ts, over separate real/imaginary arrays,
 * forward sign e^(−j2πkn/N). Each works on [start, end), so the driver can run early stages block by block.
 */

/** Radix-2 stage of span 2 (twiddle 1). */
export function radix2Stage(re: Float64Array, im: Float64Array, start: number, end: number): void {
  for (let i = start; i < end; i += 2) {
    const ar = re[i];
    const ai = im[i];
    const br = re[i + 1];
    const bi = im[i + 1];
    re[i] = ar + br;
    im[i] = ai + bi;
    re[i + 1] = ar - br;
    im[i + 1] = ai - bi;
  }
}

/** The span-4 radix-4 stage: all twiddles are 1, so it needs no table. */
export function firstRadix4Stage(re: Float64Array, im: Float64Array, start: number, end: number): void {
  for (let p0 = start; p0 < end; p0 += 4) {
    const a0r = re[p0];
    const a0i = im[p0];
    const a2r = re[p0 + 1];
    const a2i = im[p0 + 1];
    const a1r = re[p0 + 2];
    const a1i = im[p0 + 2];
    const a3r = re[p0 + 3];
    const a3i = im[p0 + 3];
    const t0r = a0r + a2r;
    const t0i = a0i + a2i;
    const t1r = a0r - a2r;
    const t1i = a0i - a2i;
    const t2r = a1r + a3r;
    const t2i = a1i + a3i;
    const t3r = a1r - a3r;
    const t3i = a1i - a3i;
    re[p0] = t0r + t2r;
    im[p0] = t0i + t2i;
    re[p0 + 2] = t0r - t2r;
    im[p0 + 2] = t0i - t2i;
    re[p0 + 1] = t1r + t3i;
    im[p0 + 1] = t1i - t3r;
    re[p0 + 3] = t1r - t3i;
    im[p0 + 3] = t1i + t3r;
  }
}

/**
 * One radix-4 DIT stage of span L over [start, end). With bit-reversed input the four length-L/4 sub-transforms
 * of a group hold the residues 0, 2, 1, 3 (mod 4) of the group's samples, in that order.
 */
export function radix4Stage(
  re: Float64Array,
  im: Float64Array,
  start: number,
  end: number,
  span: number,
  twiddles: Float64Array,
): void {
  const quarter = span >> 2;
  for (let base = start; base < end; base += span) {
    for (let k = 0; k < quarter; k++) {
      const p0 = base + k;
      const p1 = p0 + quarter;
      const p2 = p1 + quarter;
      const p3 = p2 + quarter;
      const w1r = twiddles[2 * k];
      const w1i = twiddles[2 * k + 1];
      const w2r = w1r * w1r - w1i * w1i;
      const w2i = 2 * w1r * w1i;
      const w3r = w2r * w1r - w2i * w1i;
      const w3i = w2r * w1i + w2i * w1r;
      // a1 = W^k·S1 (at p2), a2 = W^2k·S2 (at p1), a3 = W^3k·S3 (at p3).
      const x1r = re[p2];
      const x1i = im[p2];
      const a1r = x1r * w1r - x1i * w1i;
      const a1i = x1r * w1i + x1i * w1r;
      const x2r = re[p1];
      const x2i = im[p1];
      const a2r = x2r * w2r - x2i * w2i;
      const a2i = x2r * w2i + x2i * w2r;
      const x3r = re[p3];
      const x3i = im[p3];
      const a3r = x3r * w3r - x3i * w3i;
      const a3i = x3r * w3i + x3i * w3r;
      const a0r = re[p0];
      const a0i = im[p0];
      const t0r = a0r + a2r;
      const t0i = a0i + a2i;
      const t1r = a0r - a2r;
      const t1i = a0i - a2i;
      const t2r = a1r + a3r;
      const t2i = a1i + a3i;
      const t3r = a1r - a3r;
      const t3i = a1i - a3i;
      re[p0] = t0r + t2r;
      im[p0] = t0i + t2i;
      re[p2] = t0r - t2r;
      im[p2] = t0i - t2i;
      // X[k+q] = t1 − j·t3, X[k+3q] = t1 + j·t3.
      re[p1] = t1r + t3i;
      im[p1] = t1i - t3r;
      re[p3] = t1r - t3i;
      im[p3] = t1i + t3r;
    }
  }
}
