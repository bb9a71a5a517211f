import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { startTestServer } from '../support/test-server';
import { isLoopbackUrl, launchBrowser, recordRequests, saveScreenshot } from '../support/browser';

type Row = { id: string; status: string; verdict: string | null; dut: { serial: string | null } };

// The overview after sign-in, against the seeded demo organisation: each card shows what the API answers for
// the same member (the test reads the same /v1 endpoints itself), and its links lead where they say.
describe('overview', () => {
  let server: Awaited<ReturnType<typeof startTestServer>>;
  let browser: Browser;
  let context: BrowserContext;
  let page: Page;
  let requests: string[];
  const pageErrors: string[] = [];

  const signInAs = async (role: 'admin' | 'analyst') => {
    const user = server.demo?.members.find((member) => member.role === role);
    if (!user) throw new Error(`the demo seed has no ${role}`);
    await context.clearCookies();
    await page.goto('/sign-in');
    await page.getByLabel('E-mail').fill(user.email);
    await page.getByLabel('Password').fill(user.password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('heading', { name: 'Overview' }).waitFor();
  };

  const api = async <T>(path: string): Promise<T> => {
    const answer = await page.request.get(path);
    expect(answer.status()).toBe(200);
    return (await answer.json()) as T;
  };

  beforeAll(async () => {
    // The measured workspace (analyses, calibrations, usage) is what the overview shows.
    const options = { seedDemo: true, demoWorkspace: true };
    server = await startTestServer(options);
    browser = await launchBrowser();
    // The smallest common laptop screen.
    context = await browser.newContext({ baseURL: server.baseUrl, viewport: { width: 1366, height: 768 } });
    page = await context.newPage();
    requests = recordRequests(page);
    page.on('pageerror', (error) => pageErrors.push(error.message));
  });

  afterAll(async () => {
    await context?.close();
    await browser?.close();
    await server?.stop();
  });

  it('shows the analyst the latest analyses, the week’s verdicts, calibrations and usage, with working links', async () => {
    await signInAs('analyst');
    const recent = await api<{ data: Row[] }>('/v1/analyses?limit=7');
    expect(recent.data.length).toBeGreaterThan(0);

    const latest = page.getByRole('list', { name: 'Latest analyses' });
    await latest.getByRole('link').first().waitFor();
    expect(await latest.getByRole('link').count()).toBe(recent.data.length);
    const firstSerial = recent.data[0].dut.serial!;
    await latest.getByRole('link', { name: new RegExp(firstSerial) }).first().waitFor();

    // The seven-day counts match the API's rows for the same span (read here page by page).
    const week = page.locator('#overview-week');
    await week.getByText(/analyses in the last seven days|No analyses in the last seven days/).waitFor();
    const createdFrom = new Date(Date.now() - 7 * 24 * 3600 * 1000).toISOString();
    let rows: Row[] = [];
    let cursor: string | undefined;
    do {
      const answer = await api<{ data: Row[]; hasMore: boolean; nextCursor?: string }>(`/v1/analyses?limit=100&createdFrom=${encodeURIComponent(createdFrom)}${cursor ? `&cursor=${encodeURIComponent(cursor)}` : ''}`);
      rows = rows.concat(answer.data);
      cursor = answer.hasMore ? answer.nextCursor : undefined;
    } while (cursor && rows.length < 500);
    const passes = rows.filter((row) => row.status === 'succeeded' && row.verdict === 'pass').length;
    const fails = rows.filter((row) => row.status === 'succeeded' && row.verdict === 'fail').length;
    expect(passes + fails).toBeGreaterThan(0);
    const figure = (label: string) => week.locator(`xpath=.//dt[normalize-space()="${label}"]/following-sibling::dd[1]`);
    expect(await figure('Pass').innerText()).toBe(String(passes));
    expect(await figure('Fail').innerText()).toBe(String(fails));

    // Calibrations: the seed's expired line-1 calibration was replaced by a later one.
    const calibrations = page.locator('#overview-calibrations');
    await calibrations.getByText('kb65-line1 · input 0').waitFor();
    await calibrations.getByText('Replaced').waitFor();
    expect(await calibrations.getByRole('link', { name: 'All calibrations' }).getAttribute('href')).toBe('/calibrations');

    const usage = await api<{ analyses: { used: number; limit: number } }>('/v1/usage');
    const meter = page.getByRole('meter', { name: 'Analyses' });
    expect(await meter.getAttribute('aria-valuenow')).toBe(String(usage.analyses.used));
    expect(await meter.getAttribute('aria-valuemax')).toBe(String(usage.analyses.limit));

    // An analyst manages no keys: the card leaves that link out.
    expect(await page.getByRole('link', { name: /Create a key for a rig/ }).count()).toBe(0);
    await saveScreenshot(page, 'overview-01-analyst');
    await saveScreenshot(page, 'overview-02-analyst-viewport', { fullPage: false });

    // Keyboard: the first row is a link reached and followed from the keyboard.
    const firstRow = latest.getByRole('link').first();
    await firstRow.focus();
    await page.keyboard.press('Enter');
    await page.waitForURL(`**/analyses/${recent.data[0].id}`);
    await page.goBack();
    await page.getByRole('heading', { name: 'Overview' }).waitFor();

    // A count opens the history filtered to those rows.
    if (fails > 0) {
      await week.getByRole('link', { name: /^Fail:/ }).click();
      await page.waitForURL(/\/analyses\?verdict=fail&createdFrom=\d{4}-\d{2}-\d{2}/);
      await page.getByRole('heading', { name: 'Analyses' }).first().waitFor();
      await page.goBack();
      await page.getByRole('heading', { name: 'Overview' }).waitFor();
    }

    await page.getByRole('link', { name: /Compare responses/ }).click();
    await page.waitForURL('**/analyses');
  });

  it('gives the admin the key link and the same living cards', async () => {
    await signInAs('admin');
    await page.getByRole('list', { name: 'Latest analyses' }).getByRole('link').first().waitFor();
    await page.getByRole('meter', { name: 'Storage' }).waitFor();
    await page.locator('#overview-calibrations').getByText('Replaced').waitFor();
    expect(await page.locator('#overview-links').getByRole('link', { name: /API reference/ }).getAttribute('href')).toBe('/docs');
    await saveScreenshot(page, 'overview-03-admin');
    await page.getByRole('link', { name: /Create a key for a rig/ }).click();
    await page.waitForURL('**/api-keys');
  });

  it('stayed on this machine and threw no page errors', () => {
    expect(requests.filter((url) => !isLoopbackUrl(url))).toEqual([]);
    expect(pageErrors).toEqual([]);
  });
});
