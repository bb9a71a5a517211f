import type { ServerReport, SettledMemory } from './bench-setup';
import type { RigLoadResult } from './rig-load';

/** Issue 5's targets for 32 rigs posting 2 s, 48 kHz sweep captures. */
export const TARGETS = { throughputPerSecond: 15, latencyP99Ms: 2000, loopDelayP99Ms: 50, errors: 0, memoryGrowthFraction: 0.1 };

const mb = (bytes: number | undefined) => (bytes === undefined ? 'n/a' : `${(bytes / 1e6).toFixed(0)} MB`);
const verdict = (met: boolean) => (met ? 'met' : 'MISSED');

export function percentile(sorted: number[], p: number): number {
  return sorted.length ? sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))] : Number.NaN;
}

/** One line per server report (every 10 s): memory, loop delay of that interval, CPU and engine use. */
export function reportLine(report: ServerReport, previous: ServerReport | undefined): string {
  const seconds = report.elapsedSeconds - (previous?.elapsedSeconds ?? 0);
  const cpuShare = previous ? (report.cpuSeconds - previous.cpuSeconds) / seconds : Number.NaN;
  const done = report.engine.completed - (previous?.engine.completed ?? 0);
  return (
    `  [t=${report.elapsedSeconds.toFixed(0).padStart(3)} s] rss ${mb(report.rssBytes)} heap ${mb(report.heapUsedBytes)} external ${mb(report.externalBytes)}` +
    ` | loop p99 ${report.intervalP99Ms.toFixed(1)} ms max ${report.intervalMaxMs.toFixed(0)} ms | server cpu ${Number.isNaN(cpuShare) ? 'n/a' : `${(100 * cpuShare).toFixed(0)} %`}` +
    ` | engine ${(done / seconds).toFixed(1)}/s run p50 ${report.engine.runTimeP50Ms.toFixed(0)} ms, util ${(100 * report.engine.utilization).toFixed(0)} %, queued ${report.engine.queued}\n`
  );
}

export interface BenchFigures {
  rigs: number;
  warmupSeconds: number;
  load: RigLoadResult;
  reports: ServerReport[];
  serverCpuSeconds: number | null;
  databaseCpuSeconds: number | null;
  /** Memory after a full GC at the end of the warm-up and after the last request. */
  settled: { afterWarmup: SettledMemory; atEnd: SettledMemory };
}

const growthOf = (from: number, to: number) => (to - from) / from;
const percent = (fraction: number) => `${fraction >= 0 ? '+' : ''}${(100 * fraction).toFixed(0)} %`;

/** The figures against the targets, one per line, each marked met / MISSED. */
export function printFigures(figures: BenchFigures): void {
  const { load, reports, warmupSeconds } = figures;
  const measuredSeconds = load.elapsedSeconds - warmupSeconds;
  const counted = load.completions.filter((c) => c.atMs >= warmupSeconds * 1000);
  const sorted = counted.map((c) => c.latencyMs).sort((a, b) => a - b);
  const throughput = counted.length / measuredSeconds;
  const final = reports.find((r) => r.final) ?? reports.at(-1);
  // Memory is compared after a full GC at both ends (threads started and JIT warm at the first): raw samples taken
  // every 10 s mostly show where the GC sawtooth happened to be.
  const { afterWarmup, atEnd } = figures.settled;
  const heapGrowth = growthOf(afterWarmup.heapUsedBytes, atEnd.heapUsedBytes);
  const rssGrowth = growthOf(afterWarmup.rssBytes, atEnd.rssBytes);
  const analyses = final?.engine.completed ?? load.completions.length;
  const queriesPerAnalysis = final && analyses ? final.queries / analyses : Number.NaN;
  const perAnalysisMs = (cpuSeconds: number | null) => (cpuSeconds === null || !analyses ? 'n/a' : `${((1000 * cpuSeconds) / analyses).toFixed(0)} ms/analysis`);
  const share = (cpuSeconds: number | null) => (cpuSeconds === null ? 'n/a' : `${((100 * cpuSeconds) / load.elapsedSeconds).toFixed(0)} % of one core`);
  const rows: Array<[string, string, string]> = [
    ['throughput (after warm-up)', `${throughput.toFixed(2)} analyses/s`, `≥ ${TARGETS.throughputPerSecond} /s: ${verdict(throughput >= TARGETS.throughputPerSecond)}`],
    ['latency p50 / p90', `${percentile(sorted, 50).toFixed(0)} / ${percentile(sorted, 90).toFixed(0)} ms`, ''],
    ['latency p99', `${percentile(sorted, 99).toFixed(0)} ms`, `< ${TARGETS.latencyP99Ms} ms: ${verdict(percentile(sorted, 99) < TARGETS.latencyP99Ms)}`],
    ['event-loop delay p99 (server, whole run)', final ? `${final.p99Ms.toFixed(1)} ms (max ${final.maxMs.toFixed(0)} ms)` : 'n/a', final ? `< ${TARGETS.loopDelayP99Ms} ms: ${verdict(final.p99Ms < TARGETS.loopDelayP99Ms)}` : ''],
    ['errors', `${load.errors.length}${load.errors.length ? ` (${[...new Set(load.errors)].slice(0, 3).join('; ')})` : ''}`, `${TARGETS.errors}: ${verdict(load.errors.length === TARGETS.errors)}`],
    [
      'server heap in use after full GC: warm-up → end',
      `${mb(afterWarmup.heapUsedBytes)} → ${mb(atEnd.heapUsedBytes)} (${percent(heapGrowth)})`,
      `growth < ${100 * TARGETS.memoryGrowthFraction} %: ${verdict(heapGrowth < TARGETS.memoryGrowthFraction)}`,
    ],
    [
      'server RSS after full GC: warm-up → end (peak)',
      `${mb(afterWarmup.rssBytes)} → ${mb(atEnd.rssBytes)} (${percent(rssGrowth)}; peak ${mb(final?.peakRssBytes)})`,
      `growth < ${100 * TARGETS.memoryGrowthFraction} %: ${verdict(rssGrowth < TARGETS.memoryGrowthFraction)}`,
    ],
    ['analyses completed (all / counted)', `${load.completions.length} / ${counted.length}`, ''],
    ['engine run time p50 / p99 per analysis', final ? `${final.engine.runTimeP50Ms.toFixed(0)} / ${final.engine.runTimeP99Ms.toFixed(0)} ms (threads ${(100 * final.engine.utilization).toFixed(0)} % busy)` : 'n/a', ''],
    ['SQL statements per analysis (server)', Number.isNaN(queriesPerAnalysis) ? 'n/a' : queriesPerAnalysis.toFixed(1), ''],
    ['CPU: server process (all threads)', `${share(figures.serverCpuSeconds)}, ${perAnalysisMs(figures.serverCpuSeconds)}`, ''],
    ['CPU: load generator', `${share(load.cpuSeconds)}, ${perAnalysisMs(load.cpuSeconds)}`, ''],
    ['CPU: MariaDB (shared, upper bound)', `${share(figures.databaseCpuSeconds)}, ${perAnalysisMs(figures.databaseCpuSeconds)}`, ''],
  ];
  process.stdout.write('\nFigures (targets of issue 5)\n');
  for (const [label, value, target] of rows) process.stdout.write(`  ${label.padEnd(48)} ${value.padEnd(52)} ${target}\n`);
  const phases = counted.flatMap((c) => (c.phases ? [c.phases] : []));
  if (phases.length) {
    const describe = (key: keyof (typeof phases)[number]) => {
      const values = phases.map((p) => p[key]).sort((a, b) => a - b);
      return `${key.replace('Ms', '')} ${percentile(values, 50).toFixed(0)} / ${percentile(values, 99).toFixed(0)}`;
    };
    process.stdout.write(`  latency by phase, p50 / p99 ms (from the analyses' timestamps): ${(['uploadMs', 'queueMs', 'runMs', 'answerMs'] as const).map(describe).join(', ')}\n`);
  }
  if (final) {
    const kinds = Object.entries(final.queryKinds).sort((a, b) => b[1] - a[1]).map(([kind, n]) => `${kind} ${(n / analyses).toFixed(1)}`);
    process.stdout.write(`  SQL statements per analysis by kind: ${kinds.join(', ')}\n`);
  }
}
