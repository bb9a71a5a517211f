import { monitorEventLoopDelay } from 'node:perf_hooks';
import type { Logger } from '@server/lib/logger';

/**
 * With SWEEPLINE_LOOP_DELAY_REPORT=1 (benchmarks), logs the HTTP event loop's delay percentiles, memory and CPU
 * every `intervalMs` and on stop, on stderr as one JSON line prefixed "loop-delay ", so a load generator can read
 * them. Delay figures are given for the whole run and for the last interval alone; `extra` adds fields.
 */
export function startLoopDelayReport(logger: Logger, intervalMs = 5000, extra: () => Record<string, unknown> = () => ({})): () => void {
  if (process.env.SWEEPLINE_LOOP_DELAY_REPORT !== '1') return () => {};
  const whole = monitorEventLoopDelay({ resolution: 10 });
  const interval = monitorEventLoopDelay({ resolution: 10 });
  whole.enable();
  interval.enable();
  const startedMs = performance.now();
  let peakRss = 0;
  const report = (final: boolean) => {
    const memory = process.memoryUsage();
    const cpu = process.cpuUsage();
    peakRss = Math.max(peakRss, memory.rss);
    const line = {
      final,
      elapsedSeconds: (performance.now() - startedMs) / 1000,
      p50Ms: whole.percentile(50) / 1e6,
      p99Ms: whole.percentile(99) / 1e6,
      maxMs: whole.max / 1e6,
      intervalP99Ms: interval.percentile(99) / 1e6,
      intervalMaxMs: interval.max / 1e6,
      rssBytes: memory.rss,
      peakRssBytes: peakRss,
      heapUsedBytes: memory.heapUsed,
      externalBytes: memory.external,
      cpuSeconds: (cpu.user + cpu.system) / 1e6,
      ...extra(),
    };
    interval.reset();
    process.stderr.write(`loop-delay ${JSON.stringify(line)}\n`);
  };
  const timer = setInterval(() => report(false), intervalMs);
  timer.unref();
  void logger;
  return () => {
    clearInterval(timer);
    report(true);
    whole.disable();
    interval.disable();
  };
}
