import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { PLANS } from '@server/billing/plans';
import { manualClock } from '@server/lib/clock';
import { newId } from '@server/lib/ids';
import { reserveAnalysis } from '@server/modules/usage/usage.service';
import { thresholdEmailsSettled } from '@server/modules/usage/threshold-emails';
import { startTestServer } from '../support/test-server';
import { isLoopbackUrl, launchBrowser, recordRequests, saveScreenshot } from '../support/browser';

// An admin of the demo organisation moves it from the free plan to Line through the payment provider's hosted
// checkout (the local fake), comes back to the console and sees the new plan and limits once the signed event
// has arrived.
describe('admin plan upgrade', () => {
  let server: Awaited<ReturnType<typeof startTestServer>>;
  let browser: Browser;
  let context: BrowserContext;
  let page: Page;
  let requests: string[];
  const pageErrors: string[] = [];
  const policyViolations: string[] = [];

  beforeAll(async () => {
    server = await startTestServer({ seedDemo: true, hostedFakes: true });
    await chargeDemoAnalyses();
    browser = await launchBrowser();
    context = await browser.newContext({ baseURL: server.baseUrl, viewport: { width: 1366, height: 768 } });
    page = await context.newPage();
    requests = recordRequests(page);
    page.on('pageerror', (error) => pageErrors.push(error.message));
    page.on('console', (message) => {
      if (/Content.Security.Policy/i.test(message.text())) policyViolations.push(message.text());
    });
  });

  // 170 of the free plan's 200 analyses (85 %), spread over the period's days so far, for the meters and the chart.
  async function chargeDemoAnalyses() {
    const organisationId = server.demo!.organisationId;
    const now = Date.now();
    const today = new Date(now).toISOString().slice(0, 10);
    // Earlier days of this month at 09:00 UTC, and today a minute ago.
    const days = [-3, -2, -1]
      .map((offset) => new Date(Date.parse(`${today}T09:00:00.000Z`) + offset * 86_400_000))
      .filter((day) => day.getUTCMonth() === new Date(now).getUTCMonth())
      .concat(new Date(Math.max(now - 60_000, Date.parse(`${today}T00:00:00.000Z`))));
    const perDay = Math.floor(170 / days.length);
    for (const [index, day] of days.entries()) {
      const count = index === days.length - 1 ? 170 - perDay * (days.length - 1) : perDay;
      const deps = { ...server.deps, clock: manualClock(day) };
      for (let n = 0; n < count; n += 1) await reserveAnalysis(deps, organisationId, { analysisId: newId('analysis'), audioSeconds: 4 });
    }
    await thresholdEmailsSettled();
  }

  afterAll(async () => {
    await context?.close();
    await browser?.close();
    await server?.stop();
  });

  it('upgrades on the hosted checkout page and sees the new plan and limits on return', async () => {
    const admin = server.demo!.members.find((member) => member.role === 'admin')!;
    const paymentsBaseUrl = server.hosted!.fakes!.payments.baseUrl;

    await page.goto('/sign-in');
    await page.getByLabel('E-mail').fill(admin.email);
    await page.getByLabel('Password').fill(admin.password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('heading', { name: 'Overview' }).waitFor();

    await page.getByRole('link', { name: 'Usage & plan' }).click();
    await page.getByRole('heading', { name: 'Usage & plan', level: 1 }).waitFor();
    await page.getByRole('meter', { name: 'Analyses' }).waitFor();
    await expect.poll(() => page.getByTestId('current-plan-name').innerText()).toBe('Bench');
    // 170 of 200 = 85 % (arithmetic).
    expect(await page.getByRole('meter', { name: 'Analyses' }).getAttribute('aria-valuetext')).toBe('170 of 200 (85 %)');
    await page.getByRole('img', { name: /Analyses per day this period, 170 in total/ }).waitFor();
    // No subscription yet: the portal is not offered.
    expect(await page.getByRole('button', { name: 'Manage billing' }).isDisabled()).toBe(true);
    await page.getByText('No invoices yet').waitFor();
    await saveScreenshot(page, 'plan-01-usage-bench');

    // Keyboard: the plan's button is reached with Tab and pressed with Enter.
    const changeToLine = page.getByRole('button', { name: 'Change to Line' });
    await changeToLine.focus();
    await page.keyboard.press('Enter');
    await page.waitForURL((url) => url.href.startsWith(`${paymentsBaseUrl}/checkout/`));
    const payButton = page.getByRole('button', { name: 'Pay €290.00 and subscribe' });
    await payButton.waitFor();
    await saveScreenshot(page, 'plan-02-hosted-checkout');
    await payButton.click();

    // Back on the console: the page waits for the provider's event, then shows the new plan.
    await page.waitForURL((url) => url.href.startsWith(`${server.baseUrl}/usage?checkout=cs_`));
    await page.getByText('You are now on Line').waitFor();
    await expect.poll(() => page.getByTestId('current-plan-name').innerText()).toBe('Line');
    // 170 of 20,000 = 0.85 %, shown to one decimal.
    const lineLimit = PLANS.line.limits.analysesPerMonth.toLocaleString('en-US');
    await expect.poll(() => page.getByRole('meter', { name: 'Analyses' }).getAttribute('aria-valuetext')).toBe(`170 of ${lineLimit} (0.9 %)`);
    await page.getByText('€290.00 per month').first().waitFor();
    const planCard = page.getByRole('listitem').filter({ has: page.getByRole('heading', { name: 'Line', level: 3 }) });
    await planCard.getByText('Current plan').waitFor();
    const invoiceRow = page.getByRole('row', { name: /paid/ });
    await invoiceRow.getByText('€290.00').waitFor();
    expect(await page.getByRole('button', { name: 'Manage billing' }).isDisabled()).toBe(false);
    // Further changes go through the portal, never a second checkout.
    await page.getByRole('button', { name: 'Switch to Plant in the billing portal' }).waitFor();
    await saveScreenshot(page, 'plan-03-usage-line');

    const usage = await page.evaluate(async () => (await fetch('/v1/usage')).json());
    expect(usage.planId).toBe('line');
    expect(usage.analyses.limit).toBe(PLANS.line.limits.analysesPerMonth);

    expect(pageErrors).toEqual([]);
    expect(policyViolations).toEqual([]);
    expect(requests.filter((url) => !isLoopbackUrl(url))).toEqual([]);
  });
});
