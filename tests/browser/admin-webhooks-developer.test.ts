import { once } from 'node:events';
import { readFile } from 'node:fs/promises';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { startJobRunner, type JobRunner } from '@server/jobs/job-runner';
import { startWebhookDispatcher, type WebhookDispatcher } from '@server/webhooks/dispatcher';
import { startTestServer } from '../support/test-server';
import { isLoopbackUrl, launchBrowser, recordRequests, saveScreenshot } from '../support/browser';
import { apiCalls, SWEEP_PARAMETERS, unitCapture } from './analyst-fixtures';

// The receiver-side verifier shipped in examples/ (plain JavaScript, so it is typed here).
type ExampleVerifier = (body: Buffer, headers: { id: string; timestamp: string; signature: string }, secrets: string[]) => number;
const exampleModule = '../../examples/rig-loop.mjs';
const { verifyWebhook } = (await import(exampleModule)) as { verifyWebhook: ExampleVerifier };

type Received = { headers: http.IncomingHttpHeaders; body: Buffer };

/** A webhook receiver on the loopback interface that records every POST and answers 200. */
async function startReceiver() {
  const received: Received[] = [];
  const server = http.createServer((req, res) => {
    const chunks: Buffer[] = [];
    req.on('data', (chunk: Buffer) => chunks.push(chunk));
    req.on('end', () => {
      received.push({ headers: req.headers, body: Buffer.concat(chunks) });
      res.writeHead(200, { 'content-type': 'text/plain' }).end('received');
    });
  });
  server.listen(0, '127.0.0.1');
  await once(server, 'listening');
  const { port } = server.address() as AddressInfo;
  return {
    url: `http://127.0.0.1:${port}/sweepline/events`,
    received,
    stop: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}

const poll = async (done: () => boolean, timeoutMs = 30_000) => {
  const deadline = Date.now() + timeoutMs;
  while (!done()) {
    if (Date.now() > deadline) throw new Error('timed out waiting');
    await new Promise((resolve) => setTimeout(resolve, 50));
  }
};

/** Reads the fmt and data chunks of a RIFF WAVE file (Microsoft/IBM RIFF specification 1.0, 1991, "WAVE form"). */
function readWaveHeader(bytes: Buffer) {
  expect(bytes.toString('ascii', 0, 4)).toBe('RIFF');
  expect(bytes.toString('ascii', 8, 12)).toBe('WAVE');
  let offset = 12;
  let format: { formatTag: number; channels: number; sampleRateHz: number; bitsPerSample: number } | null = null;
  let dataBytes = -1;
  while (offset + 8 <= bytes.length) {
    const id = bytes.toString('ascii', offset, offset + 4);
    const size = bytes.readUInt32LE(offset + 4);
    if (id === 'fmt ') {
      format = {
        formatTag: bytes.readUInt16LE(offset + 8),
        channels: bytes.readUInt16LE(offset + 10),
        sampleRateHz: bytes.readUInt32LE(offset + 12),
        bitsPerSample: bytes.readUInt16LE(offset + 22),
      };
    }
    if (id === 'data') dataBytes = size;
    offset += 8 + size + (size % 2);
  }
  return { format, dataBytes };
}

// An admin's and a viewer's day on the integration screens, against a real server, database, job runner and
// webhook dispatcher: the admin registers a receiver running in this test, sees its secret once, runs an
// analysis through the API and watches the signed delivery arrive, resends it, creates and downloads a
// stimulus, and opens the developer corner; a viewer sees none of the create controls and the API refuses them.
describe('admin webhooks, stimuli and developer corner', () => {
  let server: Awaited<ReturnType<typeof startTestServer>>;
  let runner: JobRunner;
  let dispatcher: WebhookDispatcher;
  let receiver: Awaited<ReturnType<typeof startReceiver>>;
  let browser: Browser;
  let context: BrowserContext;
  let page: Page;
  let requests: string[];
  const pageErrors: string[] = [];
  let signingSecret = '';
  let createdStimulusName = '';

  const signInAs = async (role: 'admin' | 'viewer') => {
    const user = server.demo?.members.find((member) => member.role === role);
    if (!user) throw new Error(`the demo seed has no ${role}`);
    await context.clearCookies();
    await page.goto('/sign-in');
    await page.getByLabel('E-mail').fill(user.email);
    await page.getByLabel('Password').fill(user.password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('heading', { name: 'Overview' }).waitFor();
  };

  beforeAll(async () => {
    server = await startTestServer({ seedDemo: true });
    runner = startJobRunner(server.deps, { threads: 1, pollMs: 50 });
    dispatcher = startWebhookDispatcher(server.deps, { pollIntervalMs: 100 });
    receiver = await startReceiver();
    browser = await launchBrowser();
    context = await browser.newContext({ baseURL: server.baseUrl, viewport: { width: 1366, height: 768 }, acceptDownloads: true });
    page = await context.newPage();
    requests = recordRequests(page);
    page.on('pageerror', (error) => pageErrors.push(error.message));
  }, 240_000);

  afterAll(async () => {
    await context?.close();
    await browser?.close();
    await dispatcher?.stop();
    await runner?.stop();
    await receiver?.stop();
    await server?.stop();
  });

  it('creates a webhook endpoint and shows its signing secret exactly once', async () => {
    await signInAs('admin');
    await page.getByRole('navigation', { name: 'Console' }).getByRole('link', { name: 'Webhooks' }).click();
    await page.getByRole('heading', { name: 'Webhooks', level: 1 }).waitFor();
    await page.getByRole('heading', { name: 'Endpoints' }).waitFor();
    await expect.poll(() => page.getByText('Loading webhook endpoints…').count()).toBe(0);

    await page.getByRole('button', { name: 'Create endpoint' }).click();
    await page.getByText('This field is required.').waitFor();
    expect(await page.getByLabel('Receiver URL').evaluate((element) => element === document.activeElement)).toBe(true);

    await page.getByLabel('Receiver URL').fill(receiver.url);
    await page.getByLabel('Description (optional)').fill('Line 2 MES bridge');
    expect(await page.getByLabel('analysis.succeeded').isChecked()).toBe(true);
    await saveScreenshot(page, 'webhooks-01-create-form');
    await page.getByRole('button', { name: 'Create endpoint' }).click();

    const dialog = page.getByRole('dialog');
    await dialog.getByText('This secret will not be shown again.').waitFor();
    signingSecret = await dialog.getByLabel('Signing secret').inputValue();
    expect(signingSecret).toMatch(/^whsec_[A-Za-z0-9+/=]+$/);
    await dialog.getByRole('button', { name: 'Copy' }).click();
    await dialog.getByText(/copied to the clipboard|Copying was blocked/).waitFor();
    await saveScreenshot(page, 'webhooks-02-secret-once', { fullPage: false });
    await dialog.getByRole('button', { name: 'I have stored the secret' }).click();
    await expect.poll(() => page.getByRole('dialog').count()).toBe(0);

    await page.getByRole('link', { name: receiver.url }).waitFor();
    expect(await page.getByText(signingSecret).count()).toBe(0);
    await saveScreenshot(page, 'webhooks-03-list');
  });

  it('shows the signed delivery of a finished analysis with its response code, and resends it', async () => {
    await page.getByRole('link', { name: receiver.url }).click();
    await page.getByRole('heading', { name: 'Line 2 MES bridge', level: 1 }).waitFor();
    await page.getByText('No deliveries yet').waitFor();

    // The rig's side: stimulus, capture and analysis through the API with the admin's session.
    const api = apiCalls(context.request, server.baseUrl);
    const stimulus = await api.post<{ id: string }>('/v1/stimuli', { name: 'KB-65 production sweep', type: 'sweep', parameters: SWEEP_PARAMETERS });
    const capture = await api.upload<{ id: string }>('/v1/captures', 'KB65-24-000123.wav', unitCapture(null));
    const analysis = await api.post<{ id: string; status: string }>(
      '/v1/analyses',
      { kind: 'response_and_distortion', captureId: capture.id, stimulusId: stimulus.id, dut: { model: 'KB-65 woofer', serial: 'KB65-24-000123' } },
      { Prefer: 'wait=60' },
    );
    expect(analysis.status).toBe('succeeded');

    await poll(() => receiver.received.length >= 1);
    const first = receiver.received[0];
    // Standard Webhooks v1.0.0 signature, checked with the verifier the rig examples ship.
    const check = () =>
      verifyWebhook(
        first.body,
        { id: String(first.headers['webhook-id']), timestamp: String(first.headers['webhook-timestamp']), signature: String(first.headers['webhook-signature']) },
        [signingSecret],
      );
    expect(check()).toBe(0);
    const event = JSON.parse(first.body.toString('utf8')) as { type: string; data: { analysisId?: string; id?: string } };
    expect(event.type).toBe('analysis.succeeded');

    await page.getByRole('button', { name: 'Refresh' }).click();
    const row = page.locator(`tr[data-delivery-id]`).first();
    await row.getByText('Delivered').waitFor();
    expect(await row.innerText()).toMatch(/analysis\.succeeded[\s\S]*Delivered[\s\S]*1[\s\S]*200/);
    await saveScreenshot(page, 'webhooks-04-delivery-log');

    await row.getByRole('button', { name: /^Resend analysis\.succeeded delivery/ }).click();
    await page.getByText('analysis.succeeded queued again; it goes out within a few seconds.').waitFor();
    await poll(() => receiver.received.length >= 2);
    const second = receiver.received[1];
    expect(second.headers['webhook-id']).toBe(first.headers['webhook-id']);
    expect(second.body.equals(first.body)).toBe(true);

    await row.getByRole('button', { name: 'Attempts' }).click();
    await expect.poll(async () => page.getByText('Attempt 2').count(), { timeout: 15_000 }).toBe(1);
    expect(await page.getByText('Attempt 1').count()).toBe(1);
    await row.getByText('Delivered').waitFor();
    await saveScreenshot(page, 'webhooks-05-resent-attempts');
  });

  it('rotates the secret and shows the new one once', async () => {
    await page.getByRole('button', { name: 'Rotate secret' }).click();
    await page.getByRole('dialog').getByRole('button', { name: 'Rotate secret' }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByText('Store the new signing secret now').waitFor();
    const rotated = await dialog.getByLabel('Signing secret').inputValue();
    expect(rotated).toMatch(/^whsec_/);
    expect(rotated).not.toBe(signingSecret);
    await dialog.getByText(/two\s+signatures, one per secret/).waitFor();
    await saveScreenshot(page, 'webhooks-06-rotated-secret', { fullPage: false });
    await dialog.getByRole('button', { name: 'I have stored the secret' }).click();
    await page.getByText(/Still signs beside the new one until/).waitFor();
  });

  it('pauses, resumes and deletes the endpoint', async () => {
    await page.getByRole('button', { name: 'Pause deliveries' }).click();
    await page.getByRole('button', { name: 'Resume deliveries' }).waitFor();
    await page.getByRole('main').getByText('Paused', { exact: true }).waitFor();
    await page.getByRole('button', { name: 'Resume deliveries' }).click();
    await page.getByRole('main').getByText('Enabled', { exact: true }).waitFor();

    // Cancel comes first and takes focus; Esc closes without deleting.
    await page.getByRole('button', { name: 'Delete', exact: true }).click();
    await page.getByRole('dialog').getByRole('button', { name: 'Cancel' }).waitFor();
    await page.keyboard.press('Escape');
    await expect.poll(() => page.getByRole('dialog').count()).toBe(0);
    await page.getByRole('button', { name: 'Delete', exact: true }).click();
    await page.getByRole('dialog').getByRole('button', { name: 'Delete endpoint' }).click();
    await page.getByRole('heading', { name: 'Webhooks', level: 1 }).waitFor();
    await page.getByText('Webhook endpoint deleted with its delivery log.').waitFor();
    await expect.poll(() => page.getByRole('link', { name: receiver.url }).count()).toBe(0);
  });

  it('creates a stimulus from parameters and downloads its WAV beside the safety cautions', async () => {
    await page.getByRole('navigation', { name: 'Console' }).getByRole('link', { name: 'Stimuli' }).click();
    await page.getByRole('heading', { name: 'Create a stimulus' }).waitFor();

    // The engine refuses a stop frequency above the Nyquist frequency fs/2 (Nyquist–Shannon sampling theorem);
    // its problem+json points at the field.
    await page.getByLabel('Stop frequency (Hz)').fill('30000');
    await page.getByRole('button', { name: 'Create stimulus' }).click();
    await page.getByRole('alert').waitFor();
    await expect.poll(() => page.getByLabel('Stop frequency (Hz)').getAttribute('aria-invalid')).toBe('true');
    await saveScreenshot(page, 'stimuli-01-engine-refusal');

    await page.getByLabel('Calibrator check tone').check();
    await expect.poll(() => page.getByLabel('Frequency (Hz)').inputValue()).toBe('1000');
    await page.getByLabel('Duration (s)').fill('1');
    createdStimulusName = 'KB-M10 mic chain check 1 kHz';
    await page.getByLabel('Name (optional)').fill(createdStimulusName);
    await page.getByRole('button', { name: 'Create stimulus' }).click();

    const dialog = page.getByRole('dialog');
    await dialog.getByRole('heading', { name: createdStimulusName }).waitFor();
    const cautions = dialog.getByRole('list', { name: 'Safety cautions' });
    expect(await cautions.innerText()).toMatch(/Hearing/);
    expect(await cautions.innerText()).toMatch(/tweeters/);
    expect(await dialog.innerText()).toMatch(/Local codes and your lab’s licensed practice come first/);
    await saveScreenshot(page, 'stimuli-02-download-cautions', { fullPage: false });

    const [download] = await Promise.all([page.waitForEvent('download'), dialog.getByRole('link', { name: 'WAV, 24-bit PCM' }).click()]);
    const wav = await readFile(await download.path());
    const header = readWaveHeader(wav);
    // 1 s tone + 0.1 s silence either side at 48 kHz, 3 bytes per mono sample (24-bit PCM).
    expect(header.format).toMatchObject({ channels: 1, sampleRateHz: 48_000, bitsPerSample: 24 });
    expect([1, 0xfffe]).toContain(header.format!.formatTag);
    expect(header.dataBytes).toBe(Math.round(1.2 * 48_000) * 3);
    expect(download.suggestedFilename()).toMatch(/pcm24\.wav$/);

    await dialog.getByRole('button', { name: 'Close' }).click();
    await page.getByRole('row', { name: new RegExp(createdStimulusName) }).waitFor();
    await saveScreenshot(page, 'stimuli-03-list');
  });

  it('fills the organisation’s base URL into the developer corner and its rig examples', async () => {
    await page.getByRole('navigation', { name: 'Console' }).getByRole('link', { name: 'Developer corner' }).click();
    await page.getByRole('heading', { name: 'Developer corner', level: 1 }).waitFor();
    expect(await page.getByTestId('base-url').innerText()).toBe(server.baseUrl);
    expect(await page.getByRole('region', { name: 'curl quick start' }).innerText()).toContain(`export SWEEPLINE_BASE_URL=${server.baseUrl}`);
    expect(await page.getByRole('link', { name: 'Open the API reference' }).getAttribute('href')).toBe('/docs');
    await saveScreenshot(page, 'developer-01-corner');

    const shellTab = page.getByRole('tab', { name: 'Shell + curl' });
    expect(await shellTab.getAttribute('aria-selected')).toBe('true');
    const example = page.getByRole('region', { name: /rig example$/ });
    expect(await example.innerText()).toContain(`export SWEEPLINE_BASE_URL=${server.baseUrl}`);
    await shellTab.focus();
    await page.keyboard.press('ArrowRight');
    await expect.poll(() => page.getByRole('tab', { name: 'Python' }).getAttribute('aria-selected')).toBe('true');
    expect(await page.evaluate(() => document.activeElement?.textContent)).toBe('Python');
    const python = await page.getByRole('region', { name: 'Python rig example' }).innerText();
    expect(python).toContain(`export SWEEPLINE_BASE_URL=${server.baseUrl}`);
    expect(python).not.toContain('http://127.0.0.1:4620');
    await page.keyboard.press('End');
    await expect.poll(() => page.getByRole('tab', { name: 'Node + undici' }).getAttribute('aria-selected')).toBe('true');
    await page.getByRole('region', { name: 'Node + undici rig example' }).scrollIntoViewIfNeeded();
    await saveScreenshot(page, 'developer-02-node-example', { fullPage: false });
  });

  it('shows a viewer no create controls, and the API refuses the same calls', async () => {
    await signInAs('viewer');
    const sidebar = page.getByRole('navigation', { name: 'Console' });
    expect(await sidebar.getByRole('link', { name: 'Webhooks' }).count()).toBe(0);
    expect(await sidebar.getByRole('link', { name: 'Stimuli' }).count()).toBe(1);

    await page.goto('/webhooks');
    await page.getByText('Your role does not manage webhooks').waitFor();
    expect(await page.getByRole('button', { name: 'Create endpoint' }).count()).toBe(0);
    await saveScreenshot(page, 'viewer-01-webhooks');

    await page.goto('/stimuli');
    await page.getByRole('row', { name: new RegExp(createdStimulusName) }).waitFor();
    expect(await page.getByRole('button', { name: 'Create stimulus' }).count()).toBe(0);
    await page.getByRole('button', { name: `Download ${createdStimulusName}` }).click();
    await page.getByRole('dialog').getByRole('list', { name: 'Safety cautions' }).waitFor();
    await saveScreenshot(page, 'viewer-02-stimuli-download', { fullPage: false });
    await page.keyboard.press('Escape');
    await expect.poll(() => page.getByRole('dialog').count()).toBe(0);
    await saveScreenshot(page, 'viewer-03-stimuli');

    await page.goto('/api-keys');
    await page.getByText('Your role does not manage API keys').waitFor();
    expect(await page.getByRole('button', { name: 'Create key' }).count()).toBe(0);

    const refused = await page.evaluate(async (receiverUrl) => {
      const post = async (path: string, body: unknown) => {
        const response = await fetch(path, {
          method: 'POST',
          headers: { 'Content-Type': 'application/json', 'Idempotency-Key': crypto.randomUUID() },
          body: JSON.stringify(body),
        });
        return { status: response.status, type: response.headers.get('content-type'), code: ((await response.json()) as { code?: string }).code };
      };
      return [
        await post('/v1/webhook-endpoints', { url: receiverUrl, eventTypes: ['analysis.succeeded'] }),
        await post('/v1/stimuli', { type: 'calibrator_check', parameters: { frequencyHz: 1000, durationSeconds: 1, sampleRateHz: 48000 } }),
        await post('/v1/api-keys', { name: 'viewer key', scopes: ['analyses:read'] }),
      ];
    }, receiver.url);
    for (const answer of refused) {
      // RFC 9110 §15.5.4 403 Forbidden, body as RFC 9457 problem details.
      expect(answer.status).toBe(403);
      expect(answer.type).toMatch(/^application\/problem\+json/);
      expect(answer.code).toBe('insufficient_permission');
    }
  });

  it('threw no page errors and stayed on the loopback host', () => {
    expect(pageErrors).toEqual([]);
    expect(requests.filter((url) => !isLoopbackUrl(url))).toEqual([]);
  });
});
