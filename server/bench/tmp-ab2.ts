import { complexFftPlan } from '@shared/dsp/fft-plan';
const N = 2 ** 19, M = N / 2, bits = 18;
const x = new Float64Array(N); for (let i = 0; i < N; i++) x[i] = Math.random();
const plan = complexFftPlan(M); const rev = plan.bitReversal;
function makeOrder(t: number) { const T = 1 << t; const o = new Uint32Array(M); let i = 0; for (let mid = 0; mid < M >> (2 * t); mid++) for (let hi = 0; hi < T; hi++) { const base = (hi << (bits - t)) | (mid << t); for (let lo = 0; lo < T; lo++) o[i++] = base | lo; } return o; }
const orders = [2, 3, 4, 5].map(makeOrder);
const re = new Float64Array(M + 1), im = new Float64Array(M + 1);
function run(order: Uint32Array) { for (let i = 0; i < M; i++) { const n = order[i]; const k = rev[n]; re[k] = x[2 * n]; im[k] = x[2 * n + 1]; } }
const res: number[][] = orders.map(() => []);
for (let r = 0; r < 50; r++) orders.forEach((o, j) => { const t = performance.now(); run(o); res[j].push(performance.now() - t); });
res.forEach((v, j) => { v.sort((p, q) => p - q); console.log('t=', j + 2, 'min', v[0].toFixed(2), 'p25', v[12].toFixed(2)); });
