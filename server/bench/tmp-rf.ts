import FFT from 'fft.js';
import { realFft, inverseRealFft } from '@shared/dsp/fft';
// The previous wrapper over fft.js (realTransform + copy out; inverse as one half-size complex inverse), for the before/after figure.
function oldForward(signal: Float64Array, n: number, plan: FFT) { const input = new Float64Array(n); input.set(signal); const out = new Float64Array(2 * n); plan.realTransform(out as unknown as number[], input as unknown as number[]); const re = new Float64Array(n / 2 + 1), im = new Float64Array(n / 2 + 1); for (let k = 0; k <= n / 2; k++) { re[k] = out[2 * k]; im[k] = out[2 * k + 1]; } return { re, im }; }
for (const p of [16, 19, 20]) {
  const n = 2 ** p; const x = new Float64Array(n); for (let i = 0; i < n; i++) x[i] = Math.random();
  const plan = new FFT(n);
  const s = realFft(x, n); const tf: number[] = [], ti: number[] = [], tp: number[] = [], to: number[] = [];
  for (let r = 0; r < 3; r++) { inverseRealFft(realFft(x, n), n); oldForward(x, n, plan); }
  for (let r = 0; r < 21; r++) { let t = performance.now(); realFft(x, n); tf.push(performance.now() - t); t = performance.now(); inverseRealFft(s, n); ti.push(performance.now() - t); t = performance.now(); inverseRealFft(realFft(x, n), n); tp.push(performance.now() - t); t = performance.now(); oldForward(x, n, plan); to.push(performance.now() - t); }
  const f = (v: number[]) => { v.sort((a, b) => a - b); return `med ${v[10].toFixed(1)} min ${v[0].toFixed(1)}`; };
  console.log(`ours  2^${p} fwd ${f(tf)} | inv ${f(ti)} | pair ${f(tp)} | old fft.js wrapper fwd ${f(to)}`);
}
