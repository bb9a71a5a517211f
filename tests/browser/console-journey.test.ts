import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { fetch } from 'undici';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { startTestServer } from '../support/test-server';
import { isLoopbackUrl, launchBrowser, recordRequests, saveScreenshot } from '../support/browser';

// A newcomer's first visit, driven through the built console against a real server and database: sign up,
// look around, create an API key, prove the key works from outside the browser, revoke it, sign out.
describe('console journey', () => {
  let server: Awaited<ReturnType<typeof startTestServer>>;
  let browser: Browser;
  let context: BrowserContext;
  let page: Page;
  let requests: string[];
  const pageErrors: string[] = [];
  const policyViolations: string[] = [];

  const person = {
    displayName: 'Mara Lindqvist',
    email: `mara.${Date.now()}@kestrelbay.example`,
    password: 'tide-pools-at-dawn-65',
    organisationName: 'Kestrel Bay Acoustics',
  };

  beforeAll(async () => {
    server = await startTestServer();
    browser = await launchBrowser();
    context = await browser.newContext({ baseURL: server.baseUrl, viewport: { width: 1440, height: 900 } });
    page = await context.newPage();
    requests = recordRequests(page);
    page.on('pageerror', (error) => pageErrors.push(error.message));
    page.on('console', (message) => {
      if (/Content.Security.Policy/i.test(message.text())) policyViolations.push(message.text());
    });
  });

  afterAll(async () => {
    await context?.close();
    await browser?.close();
    await server?.stop();
  });

  it('signs up, creates a key that works from a rig, revokes it and signs out', async () => {
    await page.goto('/');
    await page.getByRole('heading', { name: 'Sign in' }).waitFor();
    await page.getByRole('link', { name: 'Create an account' }).click();
    await page.getByRole('heading', { name: 'Create your account' }).waitFor();

    await page.getByRole('button', { name: 'Create account' }).click();
    await expect.poll(() => page.getByText('This field is required.').count()).toBeGreaterThan(0);
    await saveScreenshot(page, '01-sign-up-validation');

    await page.getByLabel('Your name').fill(person.displayName);
    await page.getByLabel('Work e-mail').fill(person.email);
    await page.getByLabel('Password').fill(person.password);
    await page.getByLabel('Organisation').fill(person.organisationName);
    await page.getByRole('button', { name: 'Create account' }).click();

    await page.getByRole('heading', { name: 'Overview' }).waitFor();
    await page.getByText('Operational').waitFor();
    await saveScreenshot(page, '02-overview');

    await page.getByRole('link', { name: 'Members' }).click();
    await page.getByRole('heading', { name: 'Members' }).waitFor();
    await page.getByRole('main').getByText(person.email).waitFor();
    expect(await page.getByLabel(`Role of ${person.displayName}`).inputValue()).toBe('owner');
    await saveScreenshot(page, '03-members');

    // The only owner cannot leave: the server's last-owner problem is shown in the dialog.
    await page.getByRole('button', { name: `Remove ${person.displayName}` }).click();
    await page.getByRole('button', { name: 'Leave organisation' }).click();
    await page.getByRole('dialog').getByRole('alert').waitFor();
    expect(await page.getByRole('dialog').getByRole('alert').innerText()).toMatch(/owner/i);
    await saveScreenshot(page, '04-members-last-owner', { fullPage: false });
    await page.keyboard.press('Escape');
    await expect.poll(() => page.getByRole('dialog').count()).toBe(0);

    await page.getByRole('link', { name: 'API keys' }).click();
    await page.getByRole('heading', { name: 'Create a key' }).waitFor();
    await page.getByText('No API keys yet').waitFor();
    await page.getByLabel('Name').fill('KB-65 line 2 rig');
    await page.getByLabel('captures:write').check();
    await page.getByLabel('analyses:read').check();
    await saveScreenshot(page, '05-api-keys-form');
    await page.getByRole('button', { name: 'Create key' }).click();

    const secretField = page.getByRole('dialog').getByLabel('Secret');
    await secretField.waitFor();
    const secret = await secretField.inputValue();
    expect(secret).toMatch(/^swl_live_/);
    await page.getByRole('dialog').getByRole('button', { name: 'Copy' }).click();
    await page.getByText(/copied to the clipboard|Copying was blocked/).waitFor();
    await saveScreenshot(page, '06-api-key-secret', { fullPage: false });

    // A rig presents the secret as a bearer token (RFC 6750 §2.1); the server must accept it.
    const current = await fetch(`${server.baseUrl}/v1/api-keys/current`, {
      headers: { authorization: `Bearer ${secret}` },
    });
    expect(current.status).toBe(200);
    const currentBody = (await current.json()) as { apiKey: { name: string; lastFour: string } };
    expect(currentBody.apiKey.name).toBe('KB-65 line 2 rig');
    expect(currentBody.apiKey.lastFour).toBe(secret.slice(-4));

    await page.getByRole('button', { name: 'I have stored the secret' }).click();
    await expect.poll(() => page.getByRole('dialog').count()).toBe(0);
    const row = page.getByRole('row', { name: /KB-65 line 2 rig/ });
    await row.getByText(`…${secret.slice(-4)}`).waitFor();
    expect(await page.getByText(secret).count()).toBe(0);
    await saveScreenshot(page, '07-api-keys-list');

    // Esc closes the confirmation and focus returns to the button that opened it.
    const revokeButton = page.getByRole('button', { name: 'Revoke KB-65 line 2 rig' });
    await revokeButton.click();
    await page.getByRole('dialog').getByRole('button', { name: 'Cancel' }).waitFor();
    await page.keyboard.press('Escape');
    await expect.poll(() => page.getByRole('dialog').count()).toBe(0);
    expect(await page.evaluate(() => document.activeElement?.getAttribute('aria-label'))).toBe('Revoke KB-65 line 2 rig');

    await page.keyboard.press('Enter');
    await saveScreenshot(page, '08-api-key-revoke-confirm', { fullPage: false });
    await page.getByRole('dialog').getByRole('button', { name: 'Revoke key' }).click();
    await row.getByText('Revoked').waitFor();

    const afterRevoke = await fetch(`${server.baseUrl}/v1/api-keys/current`, {
      headers: { authorization: `Bearer ${secret}` },
    });
    expect(afterRevoke.status).toBe(401);
    expect(afterRevoke.headers.get('content-type')).toMatch(/application\/problem\+json/);

    await page.goto('/no-such-screen');
    await page.getByRole('heading', { name: 'Nothing measured at this address' }).waitFor();
    await saveScreenshot(page, '09-not-found');

    await page.goto('/');
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.getByRole('heading', { name: 'Sign in' }).waitFor();
    await page.getByLabel('E-mail').fill(person.email);
    await page.getByLabel('Password').fill('not-the-password-at-all');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('alert').waitFor();
    expect(await page.getByRole('alert').innerText()).toMatch(/e-mail address or password/i);
    await saveScreenshot(page, '10-sign-in-refused');

    await page.getByLabel('Password').fill(person.password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('heading', { name: 'Overview' }).waitFor();

    expect(pageErrors).toEqual([]);
    expect(policyViolations).toEqual([]);
  });

  it('made every request to the loopback host, fonts included', () => {
    expect(requests.length).toBeGreaterThan(10);
    expect(requests.some((url) => url.endsWith('.woff2'))).toBe(true);
    expect(requests.filter((url) => !isLoopbackUrl(url))).toEqual([]);
  });
});
