import { spawn } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const ROOT = path.resolve(fileURLToPath(new URL('../..', import.meta.url)));
export const CONSOLE_DIST = path.join(ROOT, 'dist', 'console');
// examples/ is bundled too: the developer corner shows the rig examples verbatim.
const SOURCES = ['console', 'shared', 'examples', 'vite.config.ts', 'package-lock.json', 'tsconfig.json'].map((entry) => path.join(ROOT, entry));
const LOCK_DIR = path.join(ROOT, 'dist', '.console-build.lock');

function newestMtimeMs(entry: string): number {
  let stat: fs.Stats;
  try {
    stat = fs.statSync(entry);
  } catch {
    return 0;
  }
  if (!stat.isDirectory()) return stat.mtimeMs;
  let newest = stat.mtimeMs;
  for (const child of fs.readdirSync(entry)) {
    if (child === 'node_modules' || child.startsWith('.')) continue;
    newest = Math.max(newest, newestMtimeMs(path.join(entry, child)));
  }
  return newest;
}

function isFresh(): boolean {
  const built = newestMtimeMs(path.join(CONSOLE_DIST, 'index.html'));
  return built > 0 && built >= Math.max(...SOURCES.map(newestMtimeMs));
}

function runViteBuild(outDir: string): Promise<{ ok: boolean; output: string }> {
  return new Promise((resolve) => {
    const vite = path.join(ROOT, 'node_modules', 'vite', 'bin', 'vite.js');
    const child = spawn(process.execPath, [vite, 'build', '--outDir', outDir, '--emptyOutDir', '--logLevel', 'warn'], {
      cwd: ROOT,
      env: { ...process.env, NODE_ENV: 'production' },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    let output = '';
    child.stdout.on('data', (chunk) => (output += chunk));
    child.stderr.on('data', (chunk) => (output += chunk));
    child.on('close', (code) => resolve({ ok: code === 0, output }));
  });
}

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

/** Only one build at a time across processes (npm start and a test run may both want one). */
async function withBuildLock<T>(work: () => Promise<T>): Promise<T> {
  fs.mkdirSync(path.dirname(LOCK_DIR), { recursive: true });
  for (let waitedMs = 0; ; waitedMs += 250) {
    try {
      fs.mkdirSync(LOCK_DIR);
      break;
    } catch {
      const ageMs = Date.now() - newestMtimeMs(LOCK_DIR);
      if (ageMs > 5 * 60_000) fs.rmSync(LOCK_DIR, { recursive: true, force: true });
      else await sleep(250);
    }
  }
  try {
    return await work();
  } finally {
    fs.rmSync(LOCK_DIR, { recursive: true, force: true });
  }
}

export type ConsoleBuildResult = { status: 'absent' | 'fresh' | 'built' | 'failed'; dir: string | null };

/**
 * Builds the console into dist/console when it is missing or older than its sources. The build goes to a
 * temporary folder first, so a running server keeps serving the previous build until the new one is whole.
 * A failed build is reported and the previous build (if any) stays in service: the API still starts.
 */
export async function ensureConsoleBuilt(logger: { info(message: string): void; warn(message: string): void }): Promise<ConsoleBuildResult> {
  if (!fs.existsSync(path.join(ROOT, 'console', 'index.html'))) return { status: 'absent', dir: null };
  if (isFresh()) return { status: 'fresh', dir: CONSOLE_DIST };
  return withBuildLock(async () => {
    if (isFresh()) return { status: 'fresh', dir: CONSOLE_DIST };
    logger.info('building the console (vite build)…');
    const temporary = `${CONSOLE_DIST}.build-${process.pid}`;
    const { ok, output } = await runViteBuild(temporary);
    if (!ok) {
      fs.rmSync(temporary, { recursive: true, force: true });
      logger.warn(`console build failed:\n${output}`);
      return { status: 'failed', dir: fs.existsSync(path.join(CONSOLE_DIST, 'index.html')) ? CONSOLE_DIST : null };
    }
    fs.rmSync(CONSOLE_DIST, { recursive: true, force: true });
    fs.renameSync(temporary, CONSOLE_DIST);
    return { status: 'built', dir: CONSOLE_DIST };
  });
}
