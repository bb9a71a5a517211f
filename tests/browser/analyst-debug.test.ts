import { afterAll, beforeAll, describe, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { startTestServer } from '../support/test-server';
import { launchBrowser } from '../support/browser';
import { apiCalls } from './analyst-fixtures';

describe('debug', () => {
  let server: Awaited<ReturnType<typeof startTestServer>>;
  let browser: Browser;
  let page: Page;
  beforeAll(async () => {
    server = await startTestServer();
    browser = await launchBrowser();
    const context = await browser.newContext({ baseURL: server.baseUrl });
    page = await context.newPage();
    page.on('console', (m) => console.log('CONSOLE', m.type(), m.text().slice(0, 300)));
    page.on('pageerror', (e) => console.log('PAGEERROR', e.message));
    page.on('request', (r) => console.log('REQ', r.url()));
    const api = apiCalls(context.request, server.baseUrl);
    await api.post('/v1/auth/sign-up', { email: `d.${Date.now()}@kestrelbay.example`, password: 'kb65-woofer-sweep-pass', displayName: 'D', organisationName: 'K' });
    for (const lot of ['LOT-A', 'LOT-B']) await api.post('/v1/analyses', { kind: 'spectrum', spectrum: { frequenciesHz: [100, 1000, 10000], magnitudeDb: [80, 85, 82], magnitudeReference: 'db_spl' }, dut: { model: 'KB-65 woofer', serial: 'S-' + lot, lot } });
  });
  afterAll(async () => { await browser?.close(); await server?.stop(); });
  it('submits', async () => {
    await page.goto('/analyses');
    await page.getByRole('link', { name: /S-LOT-A/ }).waitFor();
    await page.getByLabel('Lot', { exact: true }).fill('LOT-A');
    console.log('filled');
    await page.getByLabel('Lot', { exact: true }).press('Enter', { timeout: 5000 }).catch((e) => console.log('press failed', String(e).slice(0, 200)));
    await new Promise((r) => setTimeout(r, 2000));
    console.log('URL', page.url());
  }, 60_000);
});
