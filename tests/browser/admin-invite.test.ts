import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { startTestServer } from '../support/test-server';
import { isLoopbackUrl, launchBrowser, recordRequests, saveScreenshot } from '../support/browser';

// An admin invites a new analyst from the Members screen; without a mailbox, the development outbox page
// shows the e-mail, its link leads to the accept page, and the newcomer signs up and lands in the console.
describe('admin invites a new analyst', () => {
  let server: Awaited<ReturnType<typeof startTestServer>>;
  let browser: Browser;
  let context: BrowserContext;
  let page: Page;
  let requests: string[];
  const pageErrors: string[] = [];

  const newcomer = {
    displayName: 'Priya Castellanos',
    email: `priya.${Date.now()}@kestrelbay.example`,
    password: 'kb-t25-dome-sweep-pass',
  };

  beforeAll(async () => {
    server = await startTestServer({ seedDemo: true, hostedFakes: true });
    browser = await launchBrowser();
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

  it('invites, follows the link from the outbox, and the newcomer signs up as an analyst', async () => {
    const admin = server.demo!.members.find((member) => member.role === 'admin')!;
    const organisationName = server.demo!.organisationName;

    await page.goto('/sign-in');
    await page.getByLabel('E-mail').fill(admin.email);
    await page.getByLabel('Password').fill(admin.password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('heading', { name: 'Overview' }).waitFor();

    await page.getByRole('link', { name: 'Members' }).click();
    await page.getByRole('heading', { name: 'Invitations' }).waitFor();
    await page.getByText('No open invitations').waitFor();
    // An admin may not hand out the owner role.
    expect(await page.getByLabel('Role', { exact: true }).locator('option[value="owner"]').isDisabled()).toBe(true);

    await page.getByRole('button', { name: 'Send invitation' }).click();
    await page.getByText('This field is required.').waitFor();

    await page.getByLabel('E-mail address').fill(newcomer.email);
    await page.getByLabel('Role', { exact: true }).selectOption('analyst');
    await page.getByRole('button', { name: 'Send invitation' }).click();
    await page.getByText(`Invitation sent to ${newcomer.email}.`).waitFor();
    const row = page.getByRole('row', { name: new RegExp(newcomer.email.replace(/\./g, '\\.')) });
    await row.getByText('E-mail sent').waitFor();
    await row.getByText('Valid until').waitFor();
    await saveScreenshot(page, 'invite-01-members-invitations');

    // The same address again: the server's 409 says to resend instead.
    await page.getByLabel('E-mail address').fill(newcomer.email);
    await page.getByRole('button', { name: 'Send invitation' }).click();
    await page.getByRole('alert').filter({ hasText: /already pending/i }).waitFor();
    await page.getByLabel('E-mail address').fill('');

    await page.getByRole('navigation', { name: 'Console' }).getByRole('link', { name: 'Outbox' }).click();
    await page.getByRole('heading', { name: 'Outbox' }).waitFor();
    await page.getByRole('heading', { name: `You are invited to join ${organisationName} on Sweepline` }).waitFor();
    await page.getByText(`To ${newcomer.email}`).waitFor();
    await saveScreenshot(page, 'invite-02-dev-outbox');

    const link = page.getByRole('article').getByRole('link', { name: /\/invitations\// }).first();
    const href = (await link.getAttribute('href'))!;
    expect(href).toMatch(new RegExp(`^${server.baseUrl}/invitations/[0-9A-Za-z]{43}$`));
    await link.click();

    // Still signed in as the admin: the page says the link is for someone else.
    await page.getByRole('heading', { name: 'You are invited' }).waitFor();
    await page.getByText('You are signed in with another address').waitFor();
    await saveScreenshot(page, 'invite-03-accept-other-account');
    await page.getByRole('button', { name: 'Sign out' }).click();

    await page.getByLabel('Your name').waitFor();
    expect(await page.getByText(organisationName, { exact: true }).count()).toBeGreaterThan(0);
    expect(await page.getByLabel('E-mail', { exact: true }).inputValue()).toBe(newcomer.email);
    await page.getByLabel('Your name').fill(newcomer.displayName);
    await page.getByLabel('Password').fill('short');
    await page.getByRole('button', { name: `Create account and join ${organisationName}` }).click();
    await page.getByText('Use at least 12 characters.').waitFor();
    await saveScreenshot(page, 'invite-04-accept-sign-up');

    await page.getByLabel('Password').fill(newcomer.password);
    await page.getByRole('button', { name: `Create account and join ${organisationName}` }).click();
    await page.getByRole('heading', { name: 'Overview' }).waitFor();
    await page.getByText(`Welcome to ${organisationName}. You joined as analyst.`).waitFor();

    const sidebar = page.getByRole('navigation', { name: 'Console' });
    await sidebar.getByRole('link', { name: 'Analyses' }).waitFor();
    expect(await sidebar.getByRole('link', { name: 'API keys' }).count()).toBe(0);
    expect(await sidebar.getByRole('link', { name: 'Outbox' }).count()).toBe(0);
    const session = await page.evaluate(() => fetch('/v1/auth/session').then((response) => response.json()));
    expect(session.user.email).toBe(newcomer.email);
    expect(session.activeOrganisation).toMatchObject({ name: organisationName, role: 'analyst' });
    await saveScreenshot(page, 'invite-05-signed-in-analyst');

    // The spent link now explains itself.
    await page.goto(href);
    await page.getByText('This invitation has already been accepted. Sign in instead.').waitFor();
    await saveScreenshot(page, 'invite-06-spent-link');
    expect(pageErrors).toEqual([]);
  });

  it('made every request to the loopback host', () => {
    expect(requests.filter((url) => !isLoopbackUrl(url))).toEqual([]);
  });
});
