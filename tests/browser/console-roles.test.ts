import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { startTestServer } from '../support/test-server';
import { isLoopbackUrl, launchBrowser, recordRequests, saveScreenshot } from '../support/browser';

// What each role sees in the console, against the seeded demo organisation: controls a role may not use are
// not shown, and the API refuses the request anyway.
describe('console by role', () => {
  let server: Awaited<ReturnType<typeof startTestServer>>;
  let browser: Browser;
  let context: BrowserContext;
  let page: Page;
  let requests: string[];

  const demoUser = (role: 'admin' | 'analyst' | 'viewer') => {
    const user = server.demo?.members.find((member) => member.role === role);
    if (!user) throw new Error(`the demo seed has no ${role}`);
    return user;
  };

  const signInAs = async (role: 'admin' | 'analyst' | 'viewer') => {
    const user = demoUser(role);
    await context.clearCookies();
    await page.goto('/sign-in');
    await page.getByLabel('E-mail').fill(user.email);
    await page.getByLabel('Password').fill(user.password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('heading', { name: 'Overview' }).waitFor();
    return user;
  };

  beforeAll(async () => {
    server = await startTestServer({ seedDemo: true });
    browser = await launchBrowser();
    context = await browser.newContext({ baseURL: server.baseUrl, viewport: { width: 1440, height: 900 } });
    page = await context.newPage();
    requests = recordRequests(page);
  });

  afterAll(async () => {
    await context?.close();
    await browser?.close();
    await server?.stop();
  });

  it('lets an admin change roles but not grant or touch the owner role', async () => {
    await signInAs('admin');
    await page.getByRole('link', { name: 'Members' }).click();
    const owner = server.demo!.members.find((member) => member.role === 'owner')!;
    const analyst = demoUser('analyst');

    await expect.poll(() => page.getByLabel(`Role of ${owner.displayName}`).isDisabled()).toBe(true);
    const analystRole = page.getByLabel(`Role of ${analyst.displayName}`);
    expect(await analystRole.locator('option[value="owner"]').isDisabled()).toBe(true);

    await analystRole.selectOption('viewer');
    await page.getByText(`${analyst.displayName} is now viewer.`).waitFor();
    await saveScreenshot(page, '11-members-admin');
    await analystRole.selectOption('analyst');
    await page.getByText(`${analyst.displayName} is now analyst.`).waitFor();
  });

  it('shows an analyst no management controls and switches organisation', async () => {
    const analyst = await signInAs('analyst');
    const sidebar = page.getByRole('navigation', { name: 'Console' });
    expect(await sidebar.getByRole('link', { name: 'API keys' }).count()).toBe(0);

    await page.getByRole('link', { name: 'Members' }).click();
    await page.getByText('Read-only for your role').waitFor();
    expect(await page.getByRole('combobox', { name: /^Role of/ }).count()).toBe(0);
    expect(await page.getByRole('button', { name: /^Remove / }).count()).toBe(0);

    await page.goto('/api-keys');
    await page.getByText('Your role does not manage API keys').waitFor();
    // The hidden controls are a courtesy; the API itself refuses the analyst's session.
    const status = await page.evaluate(() => fetch('/v1/api-keys').then((response) => response.status));
    expect(status).toBe(403);

    const switcher = page.getByLabel('Organisation');
    const options = await switcher.locator('option').allTextContents();
    expect(options).toEqual(expect.arrayContaining(['Kestrel Bay Acoustics', 'Kestrel Bay Service Lab']));
    await page.getByRole('link', { name: 'Members' }).click();
    await switcher.selectOption({ label: 'Kestrel Bay Service Lab' });
    await page.getByText('Everyone who can sign in to Kestrel Bay Service Lab', { exact: false }).waitFor();
    await page.getByText('Viewer', { exact: true }).first().waitFor();
    // The member list was refetched for the new organisation: the admin of the first one is not in it.
    await expect.poll(() => page.getByRole('main').getByText('Tomas Reyes').count()).toBe(0);
    await page.getByRole('main').getByText(analyst.email).waitFor();
    await saveScreenshot(page, '12-members-switched-organisation');
  });

  it('shows a viewer calibrations and masks without create controls, and the API refuses the writes', async () => {
    await signInAs('viewer');
    await page.getByRole('navigation', { name: 'Console' }).getByRole('link', { name: 'Calibrations' }).click();
    await page.getByText('Your role does not create calibrations').waitFor();
    expect(await page.getByRole('heading', { name: 'Create a calibration' }).count()).toBe(0);

    await page.getByRole('navigation', { name: 'Console' }).getByRole('link', { name: 'Masks' }).click();
    await page.getByText('Your role does not create masks').waitFor();
    expect(await page.getByRole('heading', { name: 'Create a mask from points' }).count()).toBe(0);
    expect(await page.getByRole('heading', { name: 'Derive a mask from golden units' }).count()).toBe(0);
    // The empty list does not point a viewer at forms it cannot see.
    expect(await page.getByText('Create one from points below').count()).toBe(0);
    await saveScreenshot(page, '13-masks-viewer');

    // The hidden controls are a courtesy; the API refuses the viewer's session (same-origin writes pass the CSRF check).
    const statuses = await page.evaluate(async () => {
      const post = (url: string, body: unknown) =>
        fetch(url, {
          method: 'POST',
          headers: { 'content-type': 'application/json', 'idempotency-key': crypto.randomUUID() },
          body: JSON.stringify(body),
        }).then(async (response) => ({ status: response.status, type: response.headers.get('content-type') ?? '' }));
      return [
        await post('/v1/calibrations', { rigId: 'kb65-line1', inputChannel: 0, source: { type: 'dbfs_at_1pa', dbfsAt1Pa: -38 } }),
        await post('/v1/masks', { name: 'viewer mask', points: [] }),
      ];
    });
    for (const { status, type } of statuses) {
      expect(status).toBe(403);
      expect(type).toContain('application/problem+json');
    }
  });

  it('stayed on the loopback host', () => {
    expect(requests.filter((url) => !isLoopbackUrl(url))).toEqual([]);
  });
});
