import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { analyses } from '@server/db/tables';
import { startJobRunner, type JobRunner } from '@server/jobs/job-runner';
import { newId } from '@server/lib/ids';
import { startTestServer } from '../support/test-server';
import { isLoopbackUrl, launchBrowser, recordRequests, saveScreenshot } from '../support/browser';
import { apiCalls, SWEEP_PARAMETERS, unitCapture } from './analyst-fixtures';

type Analysis = { id: string; status: string; verdict: string | null };

// The production engineer's screens against a real server, database and job runner, in a laptop-sized window:
// a lot with one unit outside its ±3 dB mask (sweep captures through RBJ Audio EQ Cookbook peaking filters), the
// production summary and its failing-unit link, calibrations entered by value (one already expired), a mask
// typed in as points, and a mask derived from the lot's golden units.
describe('production, calibrations and masks', () => {
  let server: Awaited<ReturnType<typeof startTestServer>>;
  let runner: JobRunner;
  let browser: Browser;
  let context: BrowserContext;
  let page: Page;
  let requests: string[];
  const pageErrors: string[] = [];
  const created: Record<string, Analysis> = {};

  const units = [
    { serial: 'KB65-24-000301', filter: null },
    { serial: 'KB65-24-000302', filter: { f0Hz: 3000, gainDb: 1, q: 1 } },
    { serial: 'KB65-24-000304', filter: { f0Hz: 800, gainDb: -1, q: 1 } },
    // RBJ peaking +6 dB at 2 kHz (Q = 2) rises above the +3 dB limit: the failing unit.
    { serial: 'KB65-24-000303', filter: { f0Hz: 2000, gainDb: 6, q: 2 } },
  ];

  beforeAll(async () => {
    server = await startTestServer();
    runner = startJobRunner(server.deps, { threads: 1, pollMs: 50 });
    browser = await launchBrowser();
    context = await browser.newContext({ baseURL: server.baseUrl, viewport: { width: 1366, height: 768 } });
    page = await context.newPage();
    requests = recordRequests(page);
    page.on('pageerror', (error) => pageErrors.push(error.message));

    const api = apiCalls(context.request, server.baseUrl);
    const signedUp = await api.post<{ activeOrganisation: { id: string } }>('/v1/auth/sign-up', {
      email: `maren.${Date.now()}@kestrelbay.example`,
      password: 'kb65-woofer-line-pass',
      displayName: 'Maren Stoltz',
      organisationName: 'Kestrel Bay Acoustics',
    });
    const stimulus = await api.post<{ id: string }>('/v1/stimuli', { name: 'KB-65 line sweep', type: 'sweep', parameters: SWEEP_PARAMETERS });
    const mask = await api.post<{ id: string }>('/v1/masks', {
      name: 'KB-65 woofer ±3 dB',
      levelReference: 'relative',
      referenceLevel: { kind: 'at_frequency', frequencyHz: 1000 },
      upper: [{ frequencyHz: 100, levelDb: 3 }, { frequencyHz: 5000, levelDb: 3 }],
      lower: [{ frequencyHz: 100, levelDb: -3 }, { frequencyHz: 5000, levelDb: -3 }],
    });
    for (const unit of units) {
      const capture = await api.upload<{ id: string }>('/v1/captures', `${unit.serial}.wav`, unitCapture(unit.filter));
      created[unit.serial] = await api.post<Analysis>(
        '/v1/analyses',
        {
          kind: 'response_and_distortion',
          captureId: capture.id,
          stimulusId: stimulus.id,
          options: { response: { smoothing: { octaveFraction: 6 } }, distortion: { maxOrder: 5 } },
          mask: { maskId: mask.id },
          dut: { model: 'KB-65 woofer', serial: unit.serial, lot: 'LOT-2026-12A' },
        },
        { Prefer: 'wait=60' },
      );
    }
    // Sweep results state no sensitivity (a separate sensitivity analysis does), so an earlier lot's results are
    // stored as that kind writes its figures, to give the sensitivity histogram values: 86.2…89.9 dB SPL.
    const earlier = Date.now() - 3 * 86_400_000;
    for (const [i, dbSpl] of [88.3, 86.2, 87.4, 89.9, 86.9, 88.1, 87.6, 88.4].entries()) {
      const createdAt = new Date(earlier + i * 3_600_000);
      await server.deps.db.insert(analyses).values({
        id: newId('analysis'),
        organisationId: signedUp.activeOrganisation.id,
        kind: 'sensitivity',
        status: 'succeeded',
        progress: 1,
        request: { kind: 'sensitivity' },
        dutModel: 'KB-65 woofer',
        dutSerial: `KB65-24-0002${String(i + 10)}`,
        dutLot: 'LOT-2026-11B',
        tags: [],
        audioSeconds: 0,
        attempts: 1,
        cancelRequested: 0,
        resultJson: JSON.stringify({ kind: 'sensitivity', figures: { deviceType: 'loudspeaker', dbSplAt2p83VoltsOneMetre: dbSpl }, curves: {} }),
        verdict: null,
        createdAt,
        updatedAt: createdAt,
      });
    }
  }, 240_000);

  afterAll(async () => {
    await context?.close();
    await browser?.close();
    await runner?.stop();
    await server?.stop();
  });

  it('has the lot the rig measured, one unit failing the mask', () => {
    expect(Object.values(created).map((a) => a.status)).toEqual(['succeeded', 'succeeded', 'succeeded', 'succeeded']);
    expect(created['KB65-24-000303'].verdict).toBe('fail');
    expect(created['KB65-24-000301'].verdict).toBe('pass');
  });

  it('shows the production summary of the lot and follows the failing unit to its analysis', async () => {
    await page.goto('/production');
    await page.getByRole('heading', { name: 'Production', level: 1 }).waitFor();
    await page.getByText('Choose a model', { exact: true }).waitFor();
    await saveScreenshot(page, 'pcm-01-production-empty');
    await page.getByLabel('Model', { exact: true }).selectOption('KB-65 woofer');
    await page.getByLabel('Lot', { exact: true }).selectOption('LOT-2026-12A');
    await expect.poll(() => new URL(page.url()).searchParams.get('lot')).toBe('LOT-2026-12A');
    const tiles = page.getByRole('region', { name: 'Counts and yield' });
    await tiles.getByText('75.0 %').waitFor(); // 3 pass of 3 + 1 judged pass or fail
    await saveScreenshot(page, 'pcm-02-production-lot');
    await page.locator('#production-sensitivity').getByText('No values').waitFor();
    expect(await page.locator('#production-thd').innerText()).toMatch(/THD_F at 1 kHz \(% of the fundamental\)/);
    await page.locator('#production-thd').getByRole('img').waitFor();
    await page.locator('#production-trend').getByRole('img').waitFor();
    const failing = page.locator('#failing-units');
    await expect.poll(() => failing.getByRole('link', { name: /KB65-24-0003/ }).count()).toBe(1);

    // All lots: the earlier lot's sensitivities fill the histogram (Sturges: 8 values → 1 dB classes 86…90).
    await page.getByLabel('Lot', { exact: true }).selectOption('');
    await page.locator('#production-sensitivity').getByText(/n = 8 · mean 87\.85 dB SPL/).waitFor();
    await page.locator('#production-sensitivity').getByRole('img', { name: /8 values .* in 4 classes from 86\.00 to 90\.00 dB SPL/ }).waitFor();
    await saveScreenshot(page, 'pcm-02b-production-all-lots');

    await failing.getByRole('link', { name: 'KB65-24-000303' }).click();
    await expect.poll(() => new URL(page.url()).pathname).toBe(`/analyses/${created['KB65-24-000303'].id}`);
    await page.getByRole('heading', { name: 'Frequency response' }).waitFor();
  });

  it('creates calibrations by value and marks the expired one', async () => {
    await page.goto('/calibrations');
    await page.getByRole('heading', { name: 'Calibrations', level: 1 }).waitFor();
    await page.getByText('No calibrations yet').waitFor();
    const form = page.getByRole('form', { name: 'Create a calibration' });
    await form.getByRole('button', { name: 'Create calibration' }).click();
    await form.getByText('This field is required.').first().waitFor();

    await form.getByLabel('Rig', { exact: true }).fill('kb-line2-rig1');
    await form.getByLabel('Level of a 1 Pa tone (dBFS)').fill('-38.25');
    await form.getByRole('button', { name: 'Create calibration' }).click();
    const table = page.getByRole('table', { name: 'Calibrations per rig input' });
    await table.getByText('−38.25 dBFS').waitFor();
    expect(await table.getByText('In use').count()).toBe(1);

    // A microphone entered by sensitivity, valid only in the first half of 2025: expired today.
    await form.getByText('Microphone mV/Pa', { exact: true }).click();
    await form.getByLabel('Input channel').fill('1');
    await form.getByLabel('Microphone sensitivity (mV/Pa)').fill('12.5');
    await form.getByLabel('Converter full scale (V)').fill('1');
    await form.getByText('−38.06 dBFS').waitFor(); // 20·log10(0.0125 / 1)
    await form.getByLabel('Valid from (optional)').fill('2025-01-01');
    await form.getByLabel('Valid until (optional)').fill('2025-06-30');
    await form.getByRole('button', { name: 'Create calibration' }).click();
    await page.getByText(/created for kb-line2-rig1 input 1\./).waitFor();
    await saveScreenshot(page, 'pcm-03-calibrations');
    const expiredGroup = table.getByRole('rowgroup', { name: 'kb-line2-rig1 input 1' });
    await expiredGroup.getByText(/^\W*Expired$/).waitFor();
    await expiredGroup.getByText('The calibration in use has expired').waitFor();
    expect(await table.getByRole('rowgroup', { name: 'kb-line2-rig1 input 0' }).getByText(/^\W*Valid$/).count()).toBe(1);
  });

  it('creates a mask with the points editor after a validation message', async () => {
    await page.goto('/masks');
    await page.getByRole('heading', { name: 'Masks', level: 1 }).waitFor();
    const form = page.getByRole('form', { name: 'Create a mask from points' });
    await form.getByLabel('Name', { exact: true }).fill('KB-T25 tweeter ±2 dB');
    await form.getByLabel('Row 2 Frequency (Hz)').fill('50');
    await form.getByRole('button', { name: 'Create mask' }).click();
    const message = form.getByText('Must be above the row before (100 Hz).');
    await message.waitFor();
    const cell = form.getByLabel('Row 2 Frequency (Hz)');
    expect(await cell.getAttribute('aria-invalid')).toBe('true');
    expect(await cell.evaluate((input) => input === document.activeElement)).toBe(true);
    await page.locator('#create-mask').screenshot({ path: 'test-artifacts/screenshots/pcm-04-mask-editor-invalid.png' });

    await cell.fill('2000');
    await form.getByLabel('Row 1 Lower limit (dB)').fill('-2');
    await form.getByLabel('Row 1 Upper limit (dB)').fill('2');
    await form.getByRole('button', { name: 'Insert a row after row 3' }).click();
    await form.getByLabel('Row 4 Frequency (Hz)').fill('20000');
    await form.getByLabel('Row 4 Lower limit (dB)').fill('-6');
    await form.getByLabel('Row 4 Upper limit (dB)').fill('2');
    await form.locator('canvas').first().waitFor();
    await form.getByRole('button', { name: 'Create mask' }).click();
    await page.getByRole('heading', { name: 'KB-T25 tweeter ±2 dB', level: 1 }).waitFor();
    await page.locator('#mask-band canvas').first().waitFor();
    expect(await page.getByRole('table', { name: 'Versions of the mask' }).innerText()).toMatch(/dB re the curve at 1 kHz[\s\S]*Entered points/);
    await saveScreenshot(page, 'pcm-05-mask-detail');
  });

  it('derives a mask from the golden units of the lot', async () => {
    await page.goto('/masks');
    const form = page.getByRole('form', { name: 'Derive a mask from golden units' });
    await form.getByLabel('Lot', { exact: true }).fill('LOT-2026-12A');
    await form.getByRole('button', { name: 'Find analyses' }).click();
    for (const serial of ['KB65-24-000301', 'KB65-24-000302', 'KB65-24-000304']) {
      await form.getByRole('checkbox', { name: new RegExp(serial) }).check();
    }
    await form.getByText('(3 picked)').waitFor();
    await form.getByLabel('Name', { exact: true }).fill('KB-65 golden units 2026-12');
    await form.getByLabel('Coverage factor k').fill('3');
    await form.getByLabel('Minimum half-width (dB)').fill('1.5');
    await saveScreenshot(page, 'pcm-06-derive-form');
    await form.getByRole('button', { name: 'Derive mask' }).click();
    await page.getByRole('heading', { name: 'KB-65 golden units 2026-12', level: 1 }).waitFor();
    const band = page.locator('#mask-band');
    await band.locator('canvas').first().waitFor();
    expect(await band.innerText()).toMatch(/Mean of 3 golden units/);
    expect(await page.getByRole('table', { name: 'Versions of the mask' }).innerText()).toMatch(/Derived: k = 3, min ±1\.5 dB, 3 units/);
    await saveScreenshot(page, 'pcm-07-derived-mask');
  });

  it('stayed on the loopback host and raised no page errors', () => {
    expect(requests.filter((url) => !isLoopbackUrl(url))).toEqual([]);
    expect(pageErrors).toEqual([]);
  });
});
