import { once } from 'node:events';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { isLoopbackUrl, launchBrowser } from '../support/browser';
import { createTestContext, type TestContext } from '../support/test-app';

let context: TestContext;
let server: http.Server;
let baseUrl: string;
let browser: Browser;
beforeAll(async () => {
  context = await createTestContext();
  server = http.createServer(context.app).listen(0, '127.0.0.1');
  await once(server, 'listening');
  baseUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  server?.closeAllConnections();
  await new Promise((resolve) => server?.close(resolve));
  await context?.close();
});

describe('/docs in a real browser', () => {
  it('renders every operation under the server\'s CSP, loading nothing from other hosts', async () => {
    const page = await browser.newPage();
    const violations: string[] = [];
    const requests: string[] = [];
    page.on('console', (message) => {
      if (/Content.Security.Policy|Refused to/i.test(message.text())) violations.push(message.text());
    });
    page.on('pageerror', (error) => violations.push(error.message));
    page.on('request', (request) => requests.push(request.url()));

    await page.goto(`${baseUrl}/docs`);
    await page.getByText('Sweepline API').first().waitFor();
    await page.locator('.opblock').first().waitFor();
    const operations = await page.locator('.opblock-summary-path').allTextContents();
    expect(operations).toContain('/v1/api-keys');
    expect(operations).toContain('/v1/auth/sign-in');
    // Both security schemes are offered by the Authorize dialog.
    await page.getByRole('button', { name: /Authorize/ }).first().click();
    await page.getByText('sessionCookie').first().waitFor();
    await page.getByText('apiKey').first().waitFor();

    expect(violations).toEqual([]);
    expect(requests.filter((url) => !isLoopbackUrl(url))).toEqual([]);
    await page.close();
  });
});
