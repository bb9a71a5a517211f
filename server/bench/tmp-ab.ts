import { complexFftPlan } from '@shared/dsp/fft-plan';
const N = 2 ** 19, M = N / 2;
const x = new Float64Array(N); for (let i = 0; i < N; i++) x[i] = Math.random();
const plan = complexFftPlan(M); const rev = plan.bitReversal, order = plan.permutationOrder;
const re = new Float64Array(M + 1), im = new Float64Array(M + 1);
function natural() { for (let n = 0; n < M; n++) { const k = rev[n]; re[k] = x[2 * n]; im[k] = x[2 * n + 1]; } }
function tiled() { for (let i = 0; i < M; i++) { const n = order[i]; const k = rev[n]; re[k] = x[2 * n]; im[k] = x[2 * n + 1]; } }
const a: number[] = [], b: number[] = [];
for (let r = 0; r < 60; r++) { let t = performance.now(); natural(); a.push(performance.now() - t); t = performance.now(); tiled(); b.push(performance.now() - t); }
a.sort((p, q) => p - q); b.sort((p, q) => p - q);
console.log('natural min', a[0].toFixed(2), 'p25', a[15].toFixed(2), '| tiled min', b[0].toFixed(2), 'p25', b[15].toFixed(2));
