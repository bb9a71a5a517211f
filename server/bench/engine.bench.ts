/**
 * Engine benchmark: `npm run bench:engine`. For each scenario, the full response analysis of a WAV capture
 * (decode the WAV bytes, deconvolve, window, smooth, grid output, band limits, 1/3-octave table) is timed in a
 * fresh process: 3 warm-up runs, then RUNS timed runs (median, min, max, IQR). Peak memory is measured in another
 * fresh process: after a JIT warm-up on a 0.5 s capture and a GC, the growth of the process's peak RSS
 * (process.resourceUsage().maxRSS) during one analysis, compared with the capture's float64 size (frames ×
 * channels × 8 bytes). Times are wall-clock (the targets apply to them); the process CPU time (user + system, which
 * includes V8's helper threads) is shown beside them because a busy machine stretches wall-clock time.
 *
 * To add a row (e.g. distortion), append a Scenario to SCENARIOS with its own `analyse` function.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { cpus, loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import {
  analyzeSweepResponse,
  analyzeSweepResponseAndDistortion,
  designSynchronizedSweep,
  readWav,
  renderSweep,
  writeWav,
  type SweepParameters,
} from '@shared/dsp';
import { DEFAULT_MODEL, delayed, noise, simulateLoudspeaker } from '../cli/simulated-loudspeaker';

const RUNS = Number(process.env.BENCH_RUNS ?? 9);

interface Scenario {
  name: string;
  captureSeconds: number;
  sampleRateHz: number;
  timeTargetMs: number | null;
  analyse(bytes: Uint8Array, sweep: SweepParameters): unknown;
}

const RESPONSE_OPTIONS = { smoothing: { octaveFraction: 6 }, grid: { pointsPerOctave: 48 } } as const;

function responseFromBytes(bytes: Uint8Array, sweep: SweepParameters, referenceChannel: number | null = null): unknown {
  const capture = readWav(bytes);
  return analyzeSweepResponse(capture, sweep, { ...RESPONSE_OPTIONS, referenceChannel });
}

export const SCENARIOS: Scenario[] = [
  { name: 'response 2 s @ 48 kHz', captureSeconds: 2, sampleRateHz: 48000, timeTargetMs: null, analyse: (b, s) => responseFromBytes(b, s) },
  { name: 'response 10 s @ 48 kHz', captureSeconds: 10, sampleRateHz: 48000, timeTargetMs: 120, analyse: (b, s) => responseFromBytes(b, s) },
  { name: 'response 60 s @ 48 kHz', captureSeconds: 60, sampleRateHz: 48000, timeTargetMs: 1500, analyse: (b, s) => responseFromBytes(b, s) },
  { name: 'response 10 s @ 96 kHz', captureSeconds: 10, sampleRateHz: 96000, timeTargetMs: null, analyse: (b, s) => responseFromBytes(b, s) },
  { name: 'response 10 s @ 48 kHz, loopback', captureSeconds: 10, sampleRateHz: 48000, timeTargetMs: null, analyse: (b, s) => responseFromBytes(b, s, 1) },
  // Distortion rows: the same analysis plus distortion from the same deconvolution; compare with the 10 s response row.
  { name: 'response + distortion K=10, 10 s @ 48 kHz', captureSeconds: 10, sampleRateHz: 48000, timeTargetMs: null, analyse: (b, s) => responseAndDistortionFromBytes(b, s, false) },
  { name: 'response + distortion K=10 + screening 10–35, 10 s @ 48 kHz', captureSeconds: 10, sampleRateHz: 48000, timeTargetMs: null, analyse: (b, s) => responseAndDistortionFromBytes(b, s, true) },
];

function responseAndDistortionFromBytes(bytes: Uint8Array, sweep: SweepParameters, screening: boolean): unknown {
  const capture = readWav(bytes);
  return analyzeSweepResponseAndDistortion(capture, sweep, {
    response: RESPONSE_OPTIONS,
    distortion: { maxOrder: 10, ...(screening ? {} : { screening: false as const }) },
  });
}

const MEMORY_FACTOR_TARGET = 10;

/** A sweep filling the capture (0.1 s lead, trailing decay) through the demo loudspeaker, plus the loopback. */
function buildCapture(captureSeconds: number, sampleRateHz: number, startHz = 20): { bytes: Uint8Array; sweep: SweepParameters; frames: number } {
  const trailing = captureSeconds < 1 ? 0.1 : captureSeconds <= 2 ? 0.4 : 1;
  const sweep: SweepParameters = {
    startHz,
    stopHz: 20000,
    approximateDurationSeconds: captureSeconds - 0.1 - trailing,
    sampleRateHz,
    levelDbfs: -12,
    leadingSilenceSeconds: 0.1,
    trailingSilenceSeconds: trailing,
  };
  const drive = renderSweep(designSynchronizedSweep(sweep));
  const acoustic = simulateLoudspeaker(drive, sampleRateHz, { ...DEFAULT_MODEL, acousticDelaySeconds: 0.003 });
  const hiss = noise(drive.length, -85, 1);
  const latency = Math.round(0.005 * sampleRateHz);
  const measurement = delayed(acoustic, latency).map((v, n) => v + hiss[n]);
  const bytes = writeWav({ sampleRateHz, channels: [measurement, delayed(drive, latency)], encoding: 'float32' });
  return { bytes, sweep, frames: drive.length };
}

function quantile(sorted: number[], q: number): number {
  const position = (sorted.length - 1) * q;
  const low = Math.floor(position);
  const high = Math.ceil(position);
  return sorted[low] + (sorted[high] - sorted[low]) * (position - low);
}

function runChild(mode: 'time' | 'memory', index: number, file: string): Record<string, number> {
  const self = fileURLToPath(import.meta.url);
  const child = spawnSync(process.execPath, ['--expose-gc', ...process.execArgv, self, '--child', mode, String(index), file], {
    encoding: 'utf8',
    maxBuffer: 1 << 20,
  });
  if (child.status !== 0) throw new Error(`benchmark child failed: ${child.stderr}`);
  return JSON.parse(child.stdout.trim().split('\n').pop() as string);
}

function child(mode: string, index: number, file: string): void {
  const scenario = SCENARIOS[index];
  const { sweep } = JSON.parse(readFileSync(`${file}.json`, 'utf8')) as { sweep: SweepParameters };
  const bytes = new Uint8Array(readFileSync(file));
  const gc = (globalThis as { gc?: () => void }).gc ?? (() => undefined);
  if (mode === 'time') {
    for (let i = 0; i < 3; i++) scenario.analyse(bytes, sweep);
    const samples: number[] = [];
    const cpu: number[] = [];
    // No forced GC between runs: it leaves concurrent sweeping running into the next timed run; a worker
    // analysing one capture after another does not force collections either.
    for (let i = 0; i < RUNS; i++) {
      const start = performance.now();
      const cpuStart = process.cpuUsage();
      scenario.analyse(bytes, sweep);
      const used = process.cpuUsage(cpuStart);
      samples.push(performance.now() - start);
      cpu.push((used.user + used.system) / 1000);
    }
    samples.sort((a, b) => a - b);
    cpu.sort((a, b) => a - b);
    const out = {
      median: quantile(samples, 0.5),
      min: samples[0],
      max: samples[samples.length - 1],
      q1: quantile(samples, 0.25),
      q3: quantile(samples, 0.75),
      cpuMedian: quantile(cpu, 0.5),
    };
    process.stdout.write(`${JSON.stringify(out)}\n`);
    return;
  }
  // A 0.5 s warm-up (sweep from 100 Hz) compiles the code while its own peak stays below any scenario's.
  const small = buildCapture(0.5, scenario.sampleRateHz, 100);
  scenario.analyse(small.bytes, small.sweep);
  gc();
  const before = process.memoryUsage();
  const peakBeforeKb = process.resourceUsage().maxRSS;
  scenario.analyse(bytes, sweep);
  const peakAfterKb = process.resourceUsage().maxRSS;
  const after = process.memoryUsage();
  process.stdout.write(
    `${JSON.stringify({
      peakRssGrowthBytes: (peakAfterKb - peakBeforeKb) * 1024,
      heapUsedGrowthBytes: after.heapUsed - before.heapUsed,
      arrayBuffersGrowthBytes: after.arrayBuffers - before.arrayBuffers,
    })}\n`,
  );
}

function mb(bytes: number): string {
  return `${(bytes / 2 ** 20).toFixed(1)} MB`;
}

function main(): void {
  const dir = mkdtempSync(join(tmpdir(), 'sweepline-bench-'));
  const rows: string[][] = [];
  let allPass = true;
  try {
    SCENARIOS.forEach((scenario, index) => {
      const { bytes, sweep, frames } = buildCapture(scenario.captureSeconds, scenario.sampleRateHz);
      const file = join(dir, `capture-${index}.wav`);
      writeFileSync(file, bytes);
      writeFileSync(`${file}.json`, JSON.stringify({ sweep }));
      const time = runChild('time', index, file);
      const memory = runChild('memory', index, file);
      const float64Bytes = frames * 2 * 8;
      const factor = memory.peakRssGrowthBytes / float64Bytes;
      const timePass = scenario.timeTargetMs === null ? null : time.median < scenario.timeTargetMs;
      const memoryPass = factor < MEMORY_FACTOR_TARGET;
      allPass &&= timePass !== false && memoryPass;
      rows.push([
        scenario.name,
        `${time.median.toFixed(1)} ms`,
        `${time.min.toFixed(1)}–${time.max.toFixed(1)}`,
        `${time.q1.toFixed(1)}–${time.q3.toFixed(1)}`,
        `${time.cpuMedian.toFixed(1)} ms`,
        scenario.timeTargetMs === null ? '—' : `< ${scenario.timeTargetMs} ms ${timePass ? 'PASS' : 'FAIL'}`,
        mb(float64Bytes),
        `${mb(memory.peakRssGrowthBytes)} (${factor.toFixed(1)}×)`,
        `< ${MEMORY_FACTOR_TARGET}× ${memoryPass ? 'PASS' : 'FAIL'}`,
        `${mb(memory.heapUsedGrowthBytes)} / ${mb(memory.arrayBuffersGrowthBytes)}`,
      ]);
      process.stderr.write(`done: ${scenario.name}\n`);
    });
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
  const header = ['scenario', 'median', 'min–max', 'IQR', 'CPU median', 'time target', 'capture f64', 'peak RSS growth', 'memory target', 'heap / arrayBuffers after'];
  const widths = header.map((h, i) => Math.max(h.length, ...rows.map((r) => r[i].length)));
  const line = (cells: string[]) => cells.map((c, i) => c.padEnd(widths[i])).join('  ');
  console.log(`Sweepline engine benchmark — ${RUNS} timed runs after 3 warm-ups per scenario, fresh process each; Node ${process.version}`);
  console.log('Full response analysis: WAV decode (2-channel float32) + analytic-inverse deconvolution + window + 1/6-octave smoothing on a 48 points/octave grid + band limits + 1/3-octave table.');
  console.log(line(header));
  console.log(widths.map((w) => '-'.repeat(w)).join('  '));
  for (const row of rows) console.log(line(row));
  console.log(allPass ? 'All targets met.' : 'Some targets missed (see FAIL).');
  console.log(`Load average at the end: ${loadavg().map((v) => v.toFixed(2)).join(', ')} on ${cpus().length} cores.`);
}

const childIndex = process.argv.indexOf('--child');
if (childIndex >= 0) child(process.argv[childIndex + 1], Number(process.argv[childIndex + 2]), process.argv[childIndex + 3]);
else main();
