/**
 * Timing of fractional-octave smoothing (prints figures; not a test). A 10 s capture at 48 kHz padded to a
 * 2^19 FFT gives 262 145 bins, smoothed to 48 points per octave over 20 Hz – 20 kHz (481 points).
 * Run: npx tsx shared/dsp/curves/smoothing.timing.ts
 */
import { logFrequencyGrid } from './grid';
import { smoothSpectrum } from './smoothing';
import type { SmoothingOptions } from './curve';

const BIN_COUNT = 2 ** 18 + 1;
const re = new Float64Array(BIN_COUNT);
const im = new Float64Array(BIN_COUNT);
for (let k = 0; k < BIN_COUNT; k++) {
  // A deterministic, bumpy response (no randomness, so runs are comparable).
  re[k] = 1 + 0.5 * Math.cos(k * 0.0007) + 0.1 * Math.sin(k * 0.31);
  im[k] = 0.3 * Math.sin(k * 0.0013);
}
const spectrum = { re, im, binSpacingHz: 48000 / 2 ** 19 };
const grid = logFrequencyGrid({ pointsPerOctave: 48, startHz: 20, stopHz: 20000 });

function timeRuns(options: SmoothingOptions, runs: number): { coldMs: number; medianMs: number; minMs: number; maxMs: number } {
  const times: number[] = [];
  for (let r = 0; r < runs; r++) {
    const start = performance.now();
    smoothSpectrum(spectrum, grid, options);
    times.push(performance.now() - start);
  }
  const coldMs = times[0];
  const warm = times.slice(5).sort((a, b) => a - b);
  return { coldMs, medianMs: warm[Math.floor(warm.length / 2)], minMs: warm[0], maxMs: warm[warm.length - 1] };
}

console.log(`smoothing ${BIN_COUNT} bins → ${grid.length} points (1/6 octave)`);
for (const window of ['hann', 'rectangular'] as const) {
  for (const averaging of ['power', 'complex'] as const) {
    const t = timeRuns({ octaveFraction: 6, window, averaging }, 45);
    console.log(
      `${window.padEnd(11)} ${averaging.padEnd(7)} first call ${t.coldMs.toFixed(2)} ms; warm median ${t.medianMs.toFixed(2)} ms ` +
        `(min ${t.minMs.toFixed(2)}, max ${t.maxMs.toFixed(2)}, 40 runs)`,
    );
  }
}
