import { designSynchronizedSweep, renderSweep, writeWav } from '@shared/dsp';
import { createBenchDatabase, prepareOrganisation, startBenchServer, type ServerReport, type SettledMemory } from './api-bench/bench-setup';
import { printFigures, reportLine } from './api-bench/bench-report';
import { loadAverage, processCpuSeconds } from './api-bench/proc-cpu';
import { multipartBody, runRigLoad } from './api-bench/rig-load';

/**
 * `npm run bench:api`: the server (own database on the test MariaDB, own blob folder, production settings) on
 * loopback; RIGS simulated rigs each post a 2 s, 48 kHz sweep capture with its frequency_response analysis in one
 * multipart request with `Prefer: wait=30`, one after another, for SECONDS seconds. Prints its configuration, a
 * memory/CPU line per server report (10 s), and the figures against issue 5's targets; memory growth is judged on
 * the server's memory after a full GC at the end of the warm-up and after the last request. Bounded; stops by itself.
 *
 * Env: BENCH_RIGS (32), BENCH_SECONDS (60), BENCH_WARMUP_SECONDS (5, not counted), BENCH_SERVER_NODE_ARGS (e.g.
 * "--cpu-prof --cpu-prof-dir=/tmp/prof" to profile the server), and the server's own SWEEPLINE_* variables
 * (SWEEPLINE_ENGINE_THREADS, SWEEPLINE_JOB_CONCURRENCY, SWEEPLINE_DB_CONNECTIONS) pass through.
 */
const RIGS = Number(process.env.BENCH_RIGS ?? 32);
const SECONDS = Number(process.env.BENCH_SECONDS ?? 60);
const WARMUP_SECONDS = Math.min(Number(process.env.BENCH_WARMUP_SECONDS ?? 5), SECONDS / 2);
const WAIT_SECONDS = 30;

async function main() {
  const loadAtStart = loadAverage();
  const database = await createBenchDatabase();
  const server = await startBenchServer(database.url, {
    nodeArgs: (process.env.BENCH_SERVER_NODE_ARGS ?? '').split(' ').filter(Boolean),
    env: {},
  });
  try {
    const sweep = { startHz: 20, stopHz: 20_000, approximateDurationSeconds: 2, sampleRateHz: 48_000, levelDbfs: -12, trailingSilenceSeconds: 0.3 };
    const { secret, stimulusId } = await prepareOrganisation(server.base, database.url, sweep);
    const wav = writeWav({ sampleRateHz: 48_000, channels: [renderSweep(designSynchronizedSweep(sweep)).map((x) => 0.8 * x)], encoding: 'float32' });
    const analysis = JSON.stringify({ kind: 'frequency_response', stimulusId, dut: { model: 'KB-65 woofer', serial: 'KB65-24-000123' } });
    const body = multipartBody(analysis, wav, 'kb65-24-000123.wav');

    process.stdout.write('\nSweepline API benchmark (upload + frequency_response analysis + result in one request, Prefer: wait)\n');
    process.stdout.write(`  rigs ${RIGS}, duration ${SECONDS} s (first ${WARMUP_SECONDS} s warm-up, not counted), capture ${wav.length} bytes float32 mono 48 kHz\n`);
    process.stdout.write(
      `  server: NODE_ENV=${server.nodeEnv}, response validation ${server.validateResponses ? 'ON' : 'off'}, engine threads ${server.engineThreads}, ` +
        `jobs held at once ${server.jobConcurrency}, DB connections ${server.databaseConnections}, LOG_LEVEL=error\n`,
    );
    process.stdout.write(`  machine: ${(await import('node:os')).availableParallelism()} cores, load average at start ${loadAtStart}\n`);
    let previous: ServerReport | undefined = server.reports.at(-1);
    server.onReport((report) => {
      process.stdout.write(reportLine(report, previous));
      previous = report;
    });

    const serverCpuStart = processCpuSeconds(server.pid);
    const databaseCpuStart = processCpuSeconds(database.serverPid);
    const afterWarmup = new Promise<SettledMemory>((resolve) => setTimeout(() => void server.settledMemory().then(resolve), WARMUP_SECONDS * 1000));
    const load = await runRigLoad({ base: server.base, secret, body, rigs: RIGS, seconds: SECONDS, waitSeconds: WAIT_SECONDS });
    const serverCpuEnd = processCpuSeconds(server.pid);
    const settled = { afterWarmup: await afterWarmup, atEnd: await server.settledMemory() };
    const databaseCpuEnd = processCpuSeconds(database.serverPid);
    const loadAtEnd = loadAverage();
    await server.stop();
    process.stdout.write(`  load average at end ${loadAtEnd}\n`);
    printFigures({
      rigs: RIGS,
      warmupSeconds: WARMUP_SECONDS,
      load,
      reports: server.reports,
      serverCpuSeconds: serverCpuStart === null || serverCpuEnd === null ? null : serverCpuEnd - serverCpuStart,
      databaseCpuSeconds: databaseCpuStart === null || databaseCpuEnd === null ? null : databaseCpuEnd - databaseCpuStart,
      settled,
    });
  } finally {
    await server.stop().catch(() => undefined);
    await database.drop();
  }
}

main().catch((error: unknown) => {
  process.stderr.write(`benchmark failed: ${error instanceof Error ? error.stack : String(error)}\n`);
  process.exit(1);
});
