import { monitorEventLoopDelay } from 'node:perf_hooks';
import type { Logger } from '@server/lib/logger';

/**
 * With SWEEPLINE_LOOP_DELAY_REPORT=1 (benchmarks), logs the HTTP event loop's delay percentiles and memory every
 * `intervalMs` and on stop, on stderr as one JSON line prefixed "loop-delay ", so a load generator can read them.
 */
export function startLoopDelayReport(logger: Logger, intervalMs = 5000): () => void {
  if (process.env.SWEEPLINE_LOOP_DELAY_REPORT !== '1') return () => {};
  const histogram = monitorEventLoopDelay({ resolution: 10 });
  histogram.enable();
  let peakRss = 0;
  const report = (final: boolean) => {
    const rss = process.memoryUsage().rss;
    peakRss = Math.max(peakRss, rss);
    const line = {
      final,
      p50Ms: histogram.percentile(50) / 1e6,
      p99Ms: histogram.percentile(99) / 1e6,
      maxMs: histogram.max / 1e6,
      rssBytes: rss,
      peakRssBytes: peakRss,
    };
    process.stderr.write(`loop-delay ${JSON.stringify(line)}\n`);
  };
  const timer = setInterval(() => report(false), intervalMs);
  timer.unref();
  void logger;
  return () => {
    clearInterval(timer);
    report(true);
    histogram.disable();
  };
}
