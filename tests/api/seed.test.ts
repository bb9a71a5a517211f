import request from 'supertest';
import { count, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { analyses, calibrations, captures, maskVersions, masks, stimuli, usageCharges, usageCounters, webhookDeliveries, webhookDeliveryAttempts, webhookEndpoints, webhookEvents } from '@server/db/tables';
import { DEMO_PRODUCTS, KB65, KB65_GOLDEN, KBH40, KBT25, serialOf, type FailureMode, type ProductPlan } from '@server/db/seed/demo-products';
import { DEMO_USERS } from '@server/db/seed/demo-scenario';
import { seedDemo, type SeedStep } from '@server/db/seed/seed';
import { bearer, browserAgent, type Agent } from '../support/actors';
import { createTestContext, type TestContext } from '../support/test-app';

let context: TestContext;
let owner: Agent;
let organisationId: string;
beforeAll(async () => {
  context = await createTestContext();
});
afterAll(async () => {
  await context?.close();
});

const SEED_TIMEOUT_MS = 240_000;
const plannedUnits = DEMO_PRODUCTS.reduce((sum, product) => sum + product.lots.reduce((lots, lot) => lots + lot.unitCount, 0), 0);

/** Rows of every table the workspace writes, for the demo organisation. */
async function tableCounts(orgId: string) {
  const of = async (table: typeof analyses | typeof captures | typeof calibrations | typeof masks | typeof maskVersions | typeof stimuli | typeof webhookEndpoints | typeof webhookEvents | typeof webhookDeliveries | typeof webhookDeliveryAttempts | typeof usageCharges | typeof usageCounters) => {
    const [row] = await context.deps.db.select({ n: count() }).from(table).where(eq(table.organisationId, orgId));
    return row.n;
  };
  return {
    analyses: await of(analyses),
    captures: await of(captures),
    calibrations: await of(calibrations),
    masks: await of(masks),
    maskVersions: await of(maskVersions),
    stimuli: await of(stimuli),
    webhookEndpoints: await of(webhookEndpoints),
    webhookEvents: await of(webhookEvents),
    webhookDeliveries: await of(webhookDeliveries),
    webhookAttempts: await of(webhookDeliveryAttempts),
    usageCharges: await of(usageCharges),
    usagePeriods: await of(usageCounters),
  };
}

interface AnalysisSummary {
  id: string;
  kind: string;
  verdict: string | null;
  dut: { serial: string };
  tags: string[];
}

async function analysesOf(query: Record<string, string>): Promise<AnalysisSummary[]> {
  const response = await owner.get('/v1/analyses').query({ limit: 100, ...query });
  expect(response.status).toBe(200);
  return response.body.data;
}

async function resultOf(serial: string, kind: 'response_and_distortion' | 'sensitivity') {
  const [summary] = await analysesOf({ serial, kind });
  const response = await owner.get(`/v1/analyses/${summary.id}`);
  expect(response.status).toBe(200);
  return response.body as { verdict: string | null; status: string; result: { figures: Record<string, any>; warnings: { code: string }[] } };
}

function failingSerials(product: ProductPlan, mode: FailureMode): string[] {
  return product.lots.flatMap((lot) => Object.entries(lot.failures).filter(([, failure]) => failure === mode).map(([index]) => serialOf(product, lot.firstSerial + Number(index))));
}

function lotSerials(product: ProductPlan, lotName: string): string[] {
  const lot = product.lots.find((each) => each.lot === lotName)!;
  return Array.from({ length: lot.unitCount }, (_, index) => serialOf(product, lot.firstSerial + index));
}

const median = (values: number[]) => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)];

describe('demo seed', () => {
  it(
    'creates Kestrel Bay Acoustics with one user per role and a demo key shown once',
    async () => {
      const started = Date.now();
      const cpu = process.cpuUsage();
      const first = await seedDemo(context.deps);
      // Not a timing assertion: the figures are for the record (npm start logs its own progress lines).
      const cpuSeconds = (process.cpuUsage(cpu).user + process.cpuUsage(cpu).system) / 1e6;
      process.stderr.write(`[seed.test] first seed: ${((Date.now() - started) / 1000).toFixed(1)} s wall, ${cpuSeconds.toFixed(1)} s CPU in this process\n`);
      organisationId = first.organisationId;
      expect(first.createdOrganisation).toBe(true);
      expect(first.members.map((member) => member.role)).toEqual(['owner', 'admin', 'analyst', 'viewer']);
      expect(first.apiKeySecret).toMatch(/^swl_live_/);

      for (const user of DEMO_USERS) {
        const agent = browserAgent(context);
        const session = await agent.post('/v1/auth/sign-in').send({ email: user.email, password: user.password });
        expect(session.status, user.email).toBe(200);
        expect(session.body.activeOrganisation).toMatchObject({ name: 'Kestrel Bay Acoustics', role: user.role });
      }
      const key = await request(context.app).get('/v1/api-keys/current').set(bearer(first.apiKeySecret!));
      expect(key.status).toBe(200);
      expect(key.body.apiKey.scopes).toContain('analyses:write');
      expect(key.body.organisation.id).toBe(first.organisationId);

      owner = browserAgent(context);
      await owner.post('/v1/auth/sign-in').send({ email: 'owner@kestrelbay.example', password: 'kestrel-owner-demo' }).expect(200);
    },
    SEED_TIMEOUT_MS,
  );

  it('measures every planned unit of every model and lot, each analysis finished by the engine', async () => {
    for (const product of DEMO_PRODUCTS) {
      for (const lot of product.lots) {
        const summary = await owner.get('/v1/production-summary').query({ model: product.model, lot: lot.lot });
        expect(summary.status).toBe(200);
        // One response-and-distortion and one sensitivity analysis per unit, all succeeded.
        expect(summary.body.counts, `${product.model} ${lot.lot}`).toMatchObject({
          analyses: 2 * lot.unitCount,
          succeeded: 2 * lot.unitCount,
          failed: 0,
          pending: 0,
          serials: lot.unitCount,
          withoutVerdict: lot.unitCount,
        });
        expect(summary.body.counts.pass + summary.body.counts.fail).toBe(lot.unitCount);
      }
    }
    const goldens = await analysesOf({ lot: KB65_GOLDEN.lot });
    expect(goldens).toHaveLength(KB65_GOLDEN.unitCount);
    // 55 units: 50 production units with two analyses each, 5 golden units with one: inside the 60–120 budget.
    const all = await context.deps.db.select({ n: count() }).from(analyses);
    expect(all[0].n).toBe(2 * plannedUnits + KB65_GOLDEN.unitCount);
    expect(2 * plannedUnits + KB65_GOLDEN.unitCount).toBeGreaterThanOrEqual(60);
    expect(2 * plannedUnits + KB65_GOLDEN.unitCount).toBeLessThanOrEqual(120);
  });

  it('spreads the measurements over the last weeks, before the seed clock', async () => {
    const now = Date.now();
    const rows = await context.deps.db.select({ createdAt: analyses.createdAt, finishedAt: analyses.finishedAt }).from(analyses);
    const ages = rows.map((row) => (now - row.createdAt.getTime()) / 86_400_000);
    expect(Math.min(...ages)).toBeGreaterThan(1);
    expect(Math.max(...ages)).toBeLessThan(43);
    expect(Math.max(...ages) - Math.min(...ages)).toBeGreaterThan(28);
    expect(new Set(rows.map((row) => row.createdAt.toISOString().slice(0, 10))).size).toBeGreaterThan(20);
    expect(rows.every((row) => row.finishedAt !== null && row.finishedAt > row.createdAt)).toBe(true);
  });

  it('gives every good unit a pass and every planned failure a fail, with the failing limit and region in the result', async () => {
    const planned = new Map<string, FailureMode>();
    for (const product of DEMO_PRODUCTS) for (const mode of ['low_sensitivity', 'breakup_peak', 'dome_resonance', 'cushion_leak', 'rub_and_buzz', 'high_thd'] as FailureMode[]) for (const serial of failingSerials(product, mode)) planned.set(serial, mode);
    const maskFailures = new Set<FailureMode>(['low_sensitivity', 'breakup_peak', 'dome_resonance', 'cushion_leak']);
    for (const product of DEMO_PRODUCTS) {
      const judged = await analysesOf({ model: product.model, kind: 'response_and_distortion' });
      for (const analysis of judged.filter((each) => !each.tags.includes('golden'))) {
        const mode = planned.get(analysis.dut.serial);
        expect(analysis.verdict, `${analysis.dut.serial} (${mode ?? 'good'})`).toBe(mode && maskFailures.has(mode) ? 'fail' : 'pass');
      }
    }

    // Low sensitivity: below the woofer's absolute (dB SPL) lower limit, and a low figure of its own.
    const [weak] = failingSerials(KB65, 'low_sensitivity');
    const weakResponse = await resultOf(weak, 'response_and_distortion');
    expect(weakResponse.result.figures.mask.lower.pass).toBe(false);
    const lotSensitivities = await Promise.all(lotSerials(KB65, 'KB65-2611B').map(async (serial) => (await resultOf(serial, 'sensitivity')).result.figures.dbSplAt2p83VoltsOneMetre as number));
    const weakSensitivity = (await resultOf(weak, 'sensitivity')).result.figures.dbSplAt2p83VoltsOneMetre as number;
    expect(weakSensitivity).toBeLessThan(median(lotSensitivities) - 2.5);

    // Break-up peak moved up and louder: over the upper limit around 2.3 kHz.
    const peak = await resultOf(failingSerials(KB65, 'breakup_peak')[0], 'response_and_distortion');
    expect(peak.result.figures.mask.upper.pass).toBe(false);
    expect(peak.result.figures.mask.upper.worstMarginFrequencyHz).toBeGreaterThan(1800);
    expect(peak.result.figures.mask.upper.worstMarginFrequencyHz).toBeLessThan(3200);

    // Tweeter dome resonance near 7 kHz over the drawn upper limit; headphone cushion leak under the lower one in the bass.
    const dome = await resultOf(failingSerials(KBT25, 'dome_resonance')[0], 'response_and_distortion');
    expect(dome.result.figures.mask.upper.failingRegionsHz.some(([from, to]: [number, number]) => from < 7000 && to > 7000)).toBe(true);
    const leak = await resultOf(failingSerials(KBH40, 'cushion_leak')[0], 'response_and_distortion');
    expect(leak.result.figures.mask.lower.failingRegionsHz.some(([from]: [number, number]) => from < 200)).toBe(true);
  });

  it('shows the distortion failures in their distortion figures (masks judge the response only)', async () => {
    const thdAtOneKilohertz = async (serial: string) => (await resultOf(serial, 'response_and_distortion')).result.figures.distortion.thdF.atReference.valuePercent as number;
    const screeningMaximum = async (serial: string) => (await resultOf(serial, 'response_and_distortion')).result.figures.distortion.screening.maximum.valuePercent as number;

    const [highThd] = failingSerials(KB65, 'high_thd');
    const others = lotSerials(KB65, 'KB65-2612A').filter((serial) => serial !== highThd);
    const typicalThd = median(await Promise.all(others.map(thdAtOneKilohertz)));
    expect(await thdAtOneKilohertz(highThd)).toBeGreaterThan(1);
    expect(await thdAtOneKilohertz(highThd)).toBeGreaterThan(4 * typicalThd);

    const [rubbing] = failingSerials(KB65, 'rub_and_buzz');
    const quiet = lotSerials(KB65, 'KB65-2611A').filter((serial) => serial !== rubbing);
    const typicalScreening = median(await Promise.all(quiet.map(screeningMaximum)));
    expect(await screeningMaximum(rubbing)).toBeGreaterThan(4 * typicalScreening);
  });

  it('states a production yield of passed / judged units for a lot', async () => {
    const lot = KB65.lots.find((each) => each.lot === 'KB65-2611B')!;
    const summary = (await owner.get('/v1/production-summary').query({ model: KB65.model, lot: lot.lot })).body;
    const judged = await analysesOf({ model: KB65.model, lot: lot.lot, kind: 'response_and_distortion' });
    const passed = judged.filter((analysis) => analysis.verdict === 'pass').length;
    expect(judged).toHaveLength(lot.unitCount);
    expect(summary.counts.pass).toBe(passed);
    expect(summary.counts.fail).toBe(lot.unitCount - passed);
    expect(summary.yieldPercent).toBeCloseTo((100 * passed) / lot.unitCount, 10);
    expect(passed).toBe(lot.unitCount - Object.keys(lot.failures).length);
    expect(summary.sensitivity.dbSplAt2p83VoltsOneMetre.count).toBe(lot.unitCount);
    expect(summary.thdFAtOneKilohertzPercent.count).toBe(lot.unitCount);
  });

  it('records calibrations per rig input, one of them expired and superseded', async () => {
    const list = (await owner.get('/v1/calibrations').query({ limit: 100 })).body.data as { rigId: string; status: string; source: string; validUntil: string }[];
    expect(new Set(list.map((calibration) => calibration.rigId))).toEqual(new Set(DEMO_PRODUCTS.map((product) => product.rig.rigId)));
    expect(list.filter((calibration) => calibration.status === 'expired')).toHaveLength(1);
    expect(list.filter((calibration) => calibration.rigId === KB65.rig.rigId).map((calibration) => calibration.status).sort()).toEqual(['expired', 'valid']);
    expect(new Set(list.map((calibration) => calibration.source))).toEqual(new Set(['calibrator_capture', 'entered_microphone', 'entered_dbfs']));
    // The woofer line's calibrator captures were analysed by the engine: the simulated chain reads -38 dBFS at 1 Pa.
    for (const calibration of list.filter((each) => each.source === 'calibrator_capture') as unknown as { dbfsAtOnePascal: number }[]) {
      expect(calibration.dbfsAtOnePascal).toBeCloseTo(KB65.rig.dbfsAtOnePascal, 1);
    }
    const weak = await resultOf(failingSerials(KB65, 'low_sensitivity')[0], 'sensitivity');
    expect(weak.result.warnings.map((warning) => warning.code)).not.toContain('calibration_expired');
  });

  it('derives the woofer mask from golden units in two versions', async () => {
    const list = (await owner.get('/v1/masks').query({ limit: 100 })).body.data as { id: string; name: string; latestVersion: number }[];
    expect(list).toHaveLength(3);
    const golden = list.find((mask) => mask.name === KB65_GOLDEN.maskName)!;
    expect(golden.latestVersion).toBe(2);
    const versions = (await owner.get(`/v1/masks/${golden.id}/versions`)).body.data as { version: number; levelReference: string; derivation: { analysisIds: string[]; k: number } }[];
    expect(versions.map((version) => version.version)).toEqual([2, 1]);
    expect(versions.map((version) => version.derivation.analysisIds.length)).toEqual([KB65_GOLDEN.unitCount, KB65_GOLDEN.firstBatch]);
    expect(versions.every((version) => version.levelReference === 'absolute')).toBe(true);
    // The first lot was judged by version 1, the later ones by version 2.
    const firstLot = await resultOf(serialOf(KB65, KB65.lots[0].firstSerial), 'response_and_distortion');
    const lastLot = await resultOf(serialOf(KB65, KB65.lots[2].firstSerial), 'response_and_distortion');
    expect(firstLot.result.figures.mask.version).toBe(1);
    expect(lastLot.result.figures.mask.version).toBe(2);
  });

  it('leaves the webhook receivers disabled with a finished delivery history (nothing for the dispatcher)', async () => {
    const endpoints = (await owner.get('/v1/webhook-endpoints')).body.data as { id: string; url: string; enabled: boolean }[];
    expect(endpoints).toHaveLength(2);
    for (const endpoint of endpoints) {
      expect(endpoint.url.startsWith('https://hooks.kestrelbay.example/')).toBe(true);
      expect(endpoint.enabled).toBe(false);
      const deliveries = (await owner.get(`/v1/webhook-endpoints/${endpoint.id}/deliveries`)).body.data as { status: string; attempts: unknown[] }[];
      expect(deliveries.length).toBeGreaterThan(0);
      expect(deliveries.some((delivery) => delivery.status === 'pending')).toBe(false);
    }
    const pending = await context.deps.db.select({ n: count() }).from(webhookDeliveries).where(eq(webhookDeliveries.status, 'pending'));
    expect(pending[0].n).toBe(0);
  });

  it('charges the analyses of the current period to its usage', async () => {
    const usage = (await owner.get('/v1/usage')).body;
    const since = new Date(usage.period.start);
    const rows = await context.deps.db.select({ createdAt: analyses.createdAt }).from(analyses);
    const inPeriod = rows.filter((row) => row.createdAt >= since).length;
    // The period starts 15 days before the seed: the recent lots are in it, the older ones in the previous period.
    expect(inPeriod).toBeGreaterThan(20);
    expect(inPeriod).toBeLessThan(rows.length);
    expect(usage.analyses.used).toBe(inPeriod);
    expect(usage.storageBytes.used).toBeGreaterThan(0);
  });

  it(
    'is idempotent: a second run adds nothing, changes nothing and shows no secret',
    async () => {
      const before = await tableCounts(organisationId);
      const ran: string[] = [];
      const extra: SeedStep = { name: 'probe', run: async ({ organisationId, members }) => void ran.push(`${organisationId}:${members.analyst.email}`) };
      const second = await seedDemo(context.deps, [extra]);
      expect(second.createdOrganisation).toBe(false);
      expect(second.apiKeySecret).toBeNull();
      expect(ran).toEqual([`${second.organisationId}:analyst@kestrelbay.example`]);
      expect(await tableCounts(second.organisationId)).toEqual(before);
      expect(before.analyses).toBe(2 * plannedUnits + KB65_GOLDEN.unitCount);

      const session = await owner.post('/v1/auth/sign-in').send({ email: 'owner@kestrelbay.example', password: 'kestrel-owner-demo' });
      expect(session.body.memberships.map((membership: { organisationName: string }) => membership.organisationName).sort()).toEqual([
        'Kestrel Bay Acoustics',
        'Kestrel Bay Service Lab',
      ]);
      const members = await owner.get('/v1/members');
      expect(members.body.data).toHaveLength(4);
      const keys = await owner.get('/v1/api-keys');
      expect(keys.body.data).toHaveLength(1);
    },
    SEED_TIMEOUT_MS,
  );
});
