/**
 * Console benchmark: `npm run bench:console`.
 * 1. First-load size: the built console's entry script, the modules index.html preloads and its stylesheets,
 *    gzip-compressed here (zlib level 9) — what a browser downloads before the first screen. The lazily loaded
 *    analyst screens are listed beside, for reference. Target: JS < 250 kB gzip.
 * 2. Time to interactive on loopback in headless chromium against a real server (startTestServer over the test
 *    MariaDB): from the start of navigation until the first screen's heading is visible and its form accepts
 *    focus (sign-in for a visitor; overview for a signed-in analyst). Median of RUNS fresh page loads.
 * 3. Overlay draw: /compare?bench=overlay renders 10 synthetic curves × 2 000 points with the real compare
 *    chart, for the page's first chart (code not yet compiled by the JIT) and for a second one after changing
 *    the normalisation. The page's performance marks split each into: data preparation (normalisation, series
 *    config) with the React render and commit; the wait for the chart fonts; and the chart itself (uPlot options,
 *    creation and first draw). "Total" runs from the start of the data preparation to the end of the first
 *    draw — what a person waits once the curves are in hand. Target: < 50 ms for the chart and for the total.
 *    Raster of the canvas happens after the draw call, with the next frame, and is not in these figures.
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import { cpus, loadavg } from 'node:os';
import { gzipSync } from 'node:zlib';
import { acquireTestDatabaseServer } from '../bootstrap/lib/instances.mjs';

const RUNS = Number(process.env.BENCH_RUNS ?? 7);
const JS_TARGET_KB = 250;
const OVERLAY_TARGET_MS = 50;

/** What the bench page reports per chart (window.__sweeplineOverlayDraws, console/app/routes/app/compare.tsx). */
interface OverlayDrawTiming {
  chartMs: number;
  totalMs: number;
  prepareAndRenderMs: number;
  fontsMs: number;
}

const median = (values: number[]) => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)];
const kb = (bytes: number) => (bytes / 1024).toFixed(1);

function firstLoadAssets(distDir: string) {
  const html = readFileSync(path.join(distDir, 'index.html'), 'utf8');
  const scripts = [...html.matchAll(/<script[^>]+src="([^"]+)"/g), ...html.matchAll(/<link[^>]+rel="modulepreload"[^>]+href="([^"]+)"/g)].map((m) => m[1]);
  const styles = [...html.matchAll(/<link[^>]+rel="stylesheet"[^>]+href="([^"]+)"/g)].map((m) => m[1]);
  const size = (href: string) => {
    const file = path.join(distDir, href.replace(/^\//, ''));
    const bytes = readFileSync(file);
    return { href, rawBytes: statSync(file).size, gzipBytes: gzipSync(bytes, { level: 9 }).length };
  };
  return { scripts: [...new Set(scripts)].map(size), styles: [...new Set(styles)].map(size) };
}

/** Gzip size of the lazily loaded chunk whose file name starts with `prefix` (Vite names chunks after their module). */
function lazyChunkGzipBytes(distDir: string, prefix: string): number | null {
  const dir = path.join(distDir, 'assets');
  const file = readdirSync(dir).find((name) => name.startsWith(`${prefix}-`) && name.endsWith('.js'));
  return file ? gzipSync(readFileSync(path.join(dir, file)), { level: 9 }).length : null;
}

async function main() {
  const loadAtStart = loadavg();
  const database = await acquireTestDatabaseServer();
  process.env.SWEEPLINE_TEST_DATABASE_SERVER_URL = database.url;
  const { startTestServer } = await import('../../tests/support/test-server');
  const { launchBrowser } = await import('../../tests/support/browser');
  const { CONSOLE_DIST } = await import('../web/console-build');
  const server = await startTestServer();
  const browser = await launchBrowser();
  try {
    const assets = firstLoadAssets(CONSOLE_DIST);
    const jsGzip = assets.scripts.reduce((sum, asset) => sum + asset.gzipBytes, 0);
    const cssGzip = assets.styles.reduce((sum, asset) => sum + asset.gzipBytes, 0);

    const visitorMs: number[] = [];
    for (let run = 0; run < RUNS; run++) {
      const context = await browser.newContext({ baseURL: server.baseUrl, viewport: { width: 1440, height: 900 } });
      const page = await context.newPage();
      const started = Date.now();
      await page.goto('/sign-in', { waitUntil: 'commit' });
      await page.getByRole('heading', { name: 'Sign in' }).waitFor();
      await page.getByLabel('Password').focus();
      visitorMs.push(Date.now() - started);
      await context.close();
    }

    const context = await browser.newContext({ baseURL: server.baseUrl, viewport: { width: 1440, height: 900 } });
    const signUp = await context.request.post('/v1/auth/sign-up', {
      headers: { Origin: server.baseUrl },
      data: { email: `bench.${Date.now()}@kestrelbay.example`, password: 'kb65-woofer-sweep-pass', displayName: 'Bench Analyst', organisationName: 'Kestrel Bay Acoustics' },
    });
    if (signUp.status() !== 201) throw new Error(`sign-up answered ${signUp.status()}`);
    const page = await context.newPage();
    const analystMs: number[] = [];
    const firstDraws: OverlayDrawTiming[] = [];
    const warmDraws: OverlayDrawTiming[] = [];
    for (let run = 0; run < RUNS; run++) {
      const started = Date.now();
      await page.goto('/', { waitUntil: 'commit' });
      await page.getByRole('heading', { name: 'Overview' }).waitFor();
      analystMs.push(Date.now() - started);
      await page.goto('/compare?bench=overlay');
      await page.waitForSelector('body[data-bench-overlay-draws="1"]');
      // A second chart on the same page (normalisation changed): the same draw with the code already compiled.
      await page.getByText('0 dB at 1 kHz').click();
      await page.waitForSelector('body[data-bench-overlay-draws="2"]');
      const draws = await page.evaluate(() => window.__sweeplineOverlayDraws ?? []);
      firstDraws.push(draws[0]);
      warmDraws.push(draws[1]);
    }
    await context.close();

    const row = (label: string, value: string, target: string) => console.log(`${label.padEnd(44)} ${value.padStart(12)}   ${target}`);
    console.log(`Console benchmark (${RUNS} runs, headless chromium on loopback)\n`);
    row('First-load JS (gzip)', `${kb(jsGzip)} kB`, `target < ${JS_TARGET_KB} kB ${jsGzip / 1024 < JS_TARGET_KB ? 'met' : 'missed'}`);
    for (const asset of assets.scripts) row(`  ${asset.href}`, `${kb(asset.gzipBytes)} kB`, `(${kb(asset.rawBytes)} kB raw)`);
    row('First-load CSS (gzip)', `${kb(cssGzip)} kB`, '');
    for (const [label, prefix] of [['  lazy: analyses screen', 'analyses'], ['  lazy: analysis detail', 'analysis-detail'], ['  lazy: compare', 'compare'], ['  lazy: result readers + uPlot', 'result-view']] as const) {
      const bytes = lazyChunkGzipBytes(CONSOLE_DIST, prefix);
      if (bytes !== null) row(label, `${kb(bytes)} kB`, '(loaded when first visited)');
    }
    row('Time to interactive, visitor (sign-in)', `${median(visitorMs)} ms`, `median; min ${Math.min(...visitorMs)}, max ${Math.max(...visitorMs)}`);
    row('Time to interactive, analyst (overview)', `${median(analystMs)} ms`, `median; min ${Math.min(...analystMs)}, max ${Math.max(...analystMs)}`);
    const verdict = (ms: number) => (ms < OVERLAY_TARGET_MS ? 'met' : 'missed');
    for (const [label, draws] of [['first chart', firstDraws], ['redrawn', warmDraws]] as const) {
      const figure = (key: keyof OverlayDrawTiming) => draws.map((draw) => draw[key]);
      const spread = (values: number[]) => `min ${Math.min(...values).toFixed(1)}, max ${Math.max(...values).toFixed(1)}`;
      const total = figure('totalMs');
      const chart = figure('chartMs');
      row(`Overlay 10 curves × 2 000 points, ${label}`, `${median(total).toFixed(1)} ms`, `total; target < ${OVERLAY_TARGET_MS} ms ${verdict(median(total))}; ${spread(total)}`);
      row('  preparation, render and commit', `${median(figure('prepareAndRenderMs')).toFixed(1)} ms`, spread(figure('prepareAndRenderMs')));
      row('  fonts ready', `${median(figure('fontsMs')).toFixed(1)} ms`, spread(figure('fontsMs')));
      row('  chart: uPlot creation to first draw', `${median(chart).toFixed(1)} ms`, `target < ${OVERLAY_TARGET_MS} ms ${verdict(median(chart))}; ${spread(chart)}`);
    }
    const load = (values: number[]) => values.map((v) => v.toFixed(2)).join(' ');
    console.log(`\nMachine: ${cpus().length} cores, load average ${load(loadAtStart)} at the start, ${load(loadavg())} at the end (1, 5, 15 min; a busy machine stretches the times).`);
  } finally {
    await browser.close();
    await server.stop();
    await database.release();
  }
}

await main();
