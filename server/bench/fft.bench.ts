/**
 * FFT timings: median (and spread) of the real forward and inverse transforms for 2^16..2^21 points, ours and
 * fft.js's realTransform/inverseTransform for comparison. Run: npx tsx server/bench/fft.bench.ts [repeats]
 * Timings are wall-clock on whatever else the machine is doing; run it on a quiet machine.
 */
import FFT from 'fft.js';
import { inverseRealFft, realFft } from '@shared/dsp/fft';

const repeats = Number(process.argv[2] ?? 21);

function summarise(samples: number[]): string {
  const sorted = [...samples].sort((a, b) => a - b);
  const median = sorted[Math.floor(sorted.length / 2)];
  return `${median.toFixed(2).padStart(7)} ms (min ${sorted[0].toFixed(2)}, max ${sorted[sorted.length - 1].toFixed(2)})`;
}

function time(run: () => void): number[] {
  for (let warm = 0; warm < 3; warm++) run();
  const samples: number[] = [];
  for (let r = 0; r < repeats; r++) {
    const start = performance.now();
    run();
    samples.push(performance.now() - start);
  }
  return samples;
}

console.log(`Real FFT, float64, ${repeats} timed runs after 3 warm-up runs, median (min, max)`);
for (let exponent = 16; exponent <= 21; exponent++) {
  const size = 2 ** exponent;
  const signal = new Float64Array(size);
  let seed = 12345;
  for (let n = 0; n < size; n++) {
    seed = (seed * 1103515245 + 12345) >>> 0;
    signal[n] = seed / 2 ** 32 - 0.5;
  }
  const spectrum = realFft(signal, size);
  const forward = time(() => realFft(signal, size));
  const inverse = time(() => inverseRealFft(spectrum, size));
  const pair = time(() => inverseRealFft(realFft(signal, size), size));

  const reference = new FFT(size);
  const referenceOut = reference.createComplexArray() as number[];
  const referenceIn = Array.from(signal);
  const referenceForward = time(() => reference.realTransform(referenceOut, referenceIn));

  console.log(`2^${exponent} (${size})`);
  console.log(`  forward            ${summarise(forward)}`);
  console.log(`  inverse            ${summarise(inverse)}`);
  console.log(`  forward + inverse  ${summarise(pair)}`);
  console.log(`  fft.js realTransform (half spectrum, for comparison) ${summarise(referenceForward)}`);
}
