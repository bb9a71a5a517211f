import { mkdir } from 'node:fs/promises';
import path from 'node:path';
import { chromium, type Browser, type Page, type Request } from 'playwright-core';

/** Debian's chromium package; no browser is ever downloaded. */
export const CHROMIUM_PATH = process.env.SWEEPLINE_CHROMIUM_PATH ?? '/usr/bin/chromium';

// Flags that let chromium run headless as root in a container, and keep it from calling home.
export const CHROMIUM_ARGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
  '--disable-dev-shm-usage',
];

export function launchBrowser(): Promise<Browser> {
  return chromium.launch({ executablePath: CHROMIUM_PATH, args: CHROMIUM_ARGS, headless: true });
}

const LOOPBACK_HOSTS = new Set(['127.0.0.1', 'localhost', '[::1]', '::1']);

/** True for URLs that stay on this machine; data: and blob: URLs never touch the network. */
export function isLoopbackUrl(url: string): boolean {
  const parsed = new URL(url);
  if (parsed.protocol === 'data:' || parsed.protocol === 'blob:') return true;
  return LOOPBACK_HOSTS.has(parsed.hostname) || /^127\.\d+\.\d+\.\d+$/.test(parsed.hostname);
}

/** Records every request the page makes, so a test can assert that none left the loopback host. */
export function recordRequests(page: Page): string[] {
  const urls: string[] = [];
  page.on('request', (request: Request) => urls.push(request.url()));
  return urls;
}

export const SCREENSHOT_DIR = path.resolve('test-artifacts/screenshots');

/** Whole page by default; `fullPage: false` for modal dialogs, whose backdrop covers only the viewport. */
export async function saveScreenshot(page: Page, name: string, options: { fullPage?: boolean } = {}): Promise<string> {
  await mkdir(SCREENSHOT_DIR, { recursive: true });
  const file = path.join(SCREENSHOT_DIR, `${name}.png`);
  await page.screenshot({ path: file, fullPage: options.fullPage ?? true });
  return file;
}
