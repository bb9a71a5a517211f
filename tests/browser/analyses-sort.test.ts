import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { startJobRunner, type JobRunner } from '@server/jobs/job-runner';
import { startTestServer } from '../support/test-server';
import { isLoopbackUrl, launchBrowser, recordRequests, saveScreenshot } from '../support/browser';
import { apiCalls } from './analyst-fixtures';

// The history's column headers drive the server's sort through the URL, by mouse and by keyboard. Four spectrum
// analyses (flat curves against flat 85..95 dB SPL limits) have closed-form worst margins min(95 − L, L − 85).
describe('analyses table sorting', () => {
  let server: Awaited<ReturnType<typeof startTestServer>>;
  let runner: JobRunner;
  let browser: Browser;
  let context: BrowserContext;
  let page: Page;
  let requests: string[];
  const pageErrors: string[] = [];
  const units = [
    { serial: 'KB65-24-000201', levelDbSpl: 90 }, // margin +5, pass
    { serial: 'KB65-24-000202', levelDbSpl: 96 }, // margin −1, fail
    { serial: 'KB65-24-000203', levelDbSpl: 87 }, // margin +2, pass
    { serial: 'KB65-24-000204', levelDbSpl: 92, unmasked: true }, // no verdict
  ];

  beforeAll(async () => {
    server = await startTestServer();
    runner = startJobRunner(server.deps, { threads: 1, pollMs: 50 });
    browser = await launchBrowser();
    context = await browser.newContext({ baseURL: server.baseUrl, viewport: { width: 1440, height: 900 } });
    page = await context.newPage();
    requests = recordRequests(page);
    page.on('pageerror', (error) => pageErrors.push(error.message));
    const api = apiCalls(context.request, server.baseUrl);
    await api.post('/v1/auth/sign-up', {
      email: `ines.${Date.now()}@kestrelbay.example`,
      password: 'kb65-woofer-sort-pass',
      displayName: 'Ines Varga',
      organisationName: 'Kestrel Bay Acoustics',
    });
    const mask = await api.post<{ id: string }>('/v1/masks', {
      name: 'KB-65 flat limits',
      levelReference: 'absolute',
      upper: [{ frequencyHz: 100, levelDb: 95 }, { frequencyHz: 10_000, levelDb: 95 }],
      lower: [{ frequencyHz: 100, levelDb: 85 }, { frequencyHz: 10_000, levelDb: 85 }],
    });
    const frequenciesHz = [50, 100, 200, 500, 1000, 2000, 5000, 10_000, 20_000];
    for (const unit of units) {
      await api.post(
        '/v1/analyses',
        {
          kind: 'spectrum',
          spectrum: { frequenciesHz, magnitudeDb: frequenciesHz.map(() => unit.levelDbSpl), magnitudeReference: 'db_spl' },
          options: { thirdOctaveTable: false },
          ...(unit.unmasked ? {} : { mask: { maskId: mask.id } }),
          dut: { model: 'KB-65 woofer', serial: unit.serial },
        },
        { Prefer: 'wait=30' },
      );
    }
  }, 240_000);

  afterAll(async () => {
    await context?.close();
    await browser?.close();
    await runner?.stop();
    await server?.stop();
  });

  const serialsInTable = async () => (await page.locator('tbody tr').allInnerTexts()).map((text) => text.match(/KB65-24-\d{6}/)?.[0]);
  const ariaSortOf = (name: string) => page.locator('th', { has: page.getByRole('button', { name, exact: true }) }).getAttribute('aria-sort');

  it('sorts by worst margin on click: URL, aria-sort and the server order', async () => {
    await page.goto('/analyses');
    await page.getByRole('link', { name: /KB65-24-000204/ }).waitFor();
    await expect.poll(() => ariaSortOf('Created')).toBe('descending');
    await page.getByRole('button', { name: 'Margin', exact: true }).click();
    await expect.poll(() => new URL(page.url()).searchParams.get('sort')).toBe('worstMarginDb');
    // Worst first: −1, +2, +5, then the one without a mask.
    await expect.poll(serialsInTable).toEqual(['KB65-24-000202', 'KB65-24-000203', 'KB65-24-000201', 'KB65-24-000204']);
    await expect.poll(() => ariaSortOf('Margin')).toBe('ascending');
    await expect.poll(() => ariaSortOf('Created')).toBeNull();
    await saveScreenshot(page, 'analyses-sort-01-margin');
    await page.getByRole('button', { name: 'Margin', exact: true }).click();
    await expect.poll(() => new URL(page.url()).searchParams.get('sort')).toBe('-worstMarginDb');
    await expect.poll(serialsInTable).toEqual(['KB65-24-000201', 'KB65-24-000203', 'KB65-24-000202', 'KB65-24-000204']);
    await expect.poll(() => ariaSortOf('Margin')).toBe('descending');
  });

  it('sorts by keyboard: Enter and Space on a focused header button', async () => {
    await page.getByRole('button', { name: 'Verdict', exact: true }).focus();
    await page.keyboard.press('Enter');
    await expect.poll(() => new URL(page.url()).searchParams.get('sort')).toBe('verdict');
    await expect.poll(() => ariaSortOf('Verdict')).toBe('ascending');
    // fail < pass; ties by id; no verdict last.
    await expect.poll(async () => (await serialsInTable())[0]).toBe('KB65-24-000202');
    expect((await serialsInTable()).at(-1)).toBe('KB65-24-000204');
    await page.getByRole('button', { name: 'Created', exact: true }).focus();
    await page.keyboard.press('Space');
    await expect.poll(() => new URL(page.url()).searchParams.get('sort')).toBeNull();
    await expect.poll(() => ariaSortOf('Created')).toBe('descending');
    await saveScreenshot(page, 'analyses-sort-02-keyboard');
  });

  it('stayed on the loopback host without page errors', () => {
    expect(pageErrors).toEqual([]);
    expect(requests.filter((url) => !isLoopbackUrl(url))).toEqual([]);
  });
});
