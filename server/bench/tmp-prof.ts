import { complexFftPlan, complexFftBitReversedInput } from '@shared/dsp/fft-plan';
import { realFft } from '@shared/dsp/fft';
const N = 2 ** 19, M = N / 2;
const x = new Float64Array(N); for (let i = 0; i < N; i++) x[i] = Math.random();
const plan = complexFftPlan(M);
const t: Record<string, number[]> = { alloc: [], load: [], kernel: [], whole: [] };
for (let r = 0; r < 41; r++) {
  let s = performance.now(); const re = new Float64Array(M + 1), im = new Float64Array(M + 1); t.alloc.push(performance.now() - s);
  s = performance.now(); const rev = plan.bitReversal; for (let n = 0; n < M; n++) { const k = rev[n]; re[k] = x[2 * n]; im[k] = x[2 * n + 1]; } t.load.push(performance.now() - s);
  s = performance.now(); complexFftBitReversedInput(plan, re, im); t.kernel.push(performance.now() - s);
  s = performance.now(); realFft(x, N); t.whole.push(performance.now() - s);
}
for (const [k, v] of Object.entries(t)) { v.sort((a, b) => a - b); console.log(k, 'min', v[0].toFixed(2), 'med', v[20].toFixed(2)); }
