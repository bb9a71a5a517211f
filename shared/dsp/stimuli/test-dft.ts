/** Test-only textbook DFT of one bin, X[k] = Σ x[n]·e^(−j2πkn/N), computed the slow, obvious way. */
export function realDftBin(x: ArrayLike<number>, k: number): { re: number; im: number } {
  let re = 0;
  let im = 0;
  const n = x.length;
  for (let i = 0; i < n; i++) {
    const angle = (2 * Math.PI * ((k * i) % n)) / n;
    re += x[i] * Math.cos(angle);
    im -= x[i] * Math.sin(angle);
  }
  return { re, im };
}
