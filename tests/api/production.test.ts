import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { analyses } from '@server/db/tables';
import { manualClock } from '@server/lib/clock';
import { newId } from '@server/lib/ids';
import { distributionOf } from '@server/modules/production/statistics';
import { organisationWithRoles, signUp, type OrganisationWithRoles, type SignedUp } from '../support/actors';
import { createTestContext, type TestContext } from '../support/test-app';

const clock = manualClock(new Date(Math.ceil(Date.now() / 60_000) * 60_000));
let context: TestContext;
let kb: OrganisationWithRoles;
let other: SignedUp;

interface Unit {
  model?: string;
  lot?: string;
  status?: string;
  verdict?: 'pass' | 'fail' | 'incomplete' | null;
  sensitivityDb?: number;
  thdPercent?: number;
  lowerHz?: number;
  upperHz?: number | null;
  createdAt?: Date;
}

/** A stored analysis with figures shaped as the response_and_distortion kind writes them. */
async function stored(orgId: string, unit: Unit) {
  const id = newId('analysis');
  const status = unit.status ?? 'succeeded';
  const figures = {
    sensitivity: unit.sensitivityDb === undefined ? null : { bandMean: { dbSplAt2p83VoltsOneMetre: unit.sensitivityDb, fromHz: 300, toHz: 3000, average: 'power' } },
    distortion: unit.thdPercent === undefined ? undefined : { thdF: { atReference: { frequencyHz: 1000, valuePercent: unit.thdPercent, valueDb: 20 * Math.log10(unit.thdPercent / 100), isUpperBound: false } } },
    bandLimits:
      unit.lowerHz === undefined
        ? null
        : {
            limits: [
              {
                dropDb: 3,
                thresholdDb: 85,
                lower: { status: 'found', frequencyHz: unit.lowerHz },
                upper: unit.upperHz === null ? { status: 'beyond_measured_range', measuredEdgeHz: 20_000 } : { status: 'found', frequencyHz: unit.upperHz },
              },
            ],
          },
  };
  const createdAt = unit.createdAt ?? clock.now();
  await context.deps.db.insert(analyses).values({
    id,
    organisationId: orgId,
    kind: 'response_and_distortion',
    status,
    progress: 1,
    request: { kind: 'response_and_distortion' },
    dutModel: unit.model ?? 'KB-65 woofer',
    dutSerial: `KB65-24-${id.slice(-6)}`,
    dutLot: unit.lot ?? 'LOT-2024-11A',
    tags: [],
    audioSeconds: 2,
    attempts: 1,
    cancelRequested: 0,
    resultJson: status === 'succeeded' ? JSON.stringify({ kind: 'response_and_distortion', figures, curves: { frequencyHz: [1, 2], magnitudeDb: [0, 0] } }) : null,
    verdict: status === 'succeeded' ? (unit.verdict ?? null) : null,
    createdAt,
    updatedAt: createdAt,
  });
}

beforeAll(async () => {
  context = await createTestContext({ clock });
  kb = await organisationWithRoles(context);
  other = await signUp(context, { organisationName: 'Other Lab' });
  const units: Unit[] = [
    { sensitivityDb: 86, thdPercent: 0.5, lowerHz: 50, upperHz: 3000, verdict: 'pass' },
    { sensitivityDb: 87, thdPercent: 0.6, lowerHz: 52, upperHz: 3100, verdict: 'pass' },
    { sensitivityDb: 88, thdPercent: 0.7, lowerHz: 54, upperHz: 3200, verdict: 'pass' },
    { sensitivityDb: 89, thdPercent: 0.8, lowerHz: 56, upperHz: 3300, verdict: 'fail' },
    { sensitivityDb: 90, thdPercent: 1.4, lowerHz: 58, upperHz: null, verdict: 'incomplete' },
    { status: 'failed' },
    { status: 'queued' },
  ];
  for (const unit of units) await stored(kb.organisationId, unit);
  // Outside the filter: another lot, another model, another organisation, and a unit from last year.
  await stored(kb.organisationId, { lot: 'LOT-2024-12B', sensitivityDb: 70, verdict: 'fail' });
  await stored(kb.organisationId, { model: 'KB-T25 tweeter', sensitivityDb: 92, verdict: 'pass' });
  await stored(other.organisationId, { sensitivityDb: 60, verdict: 'fail' });
  await stored(kb.organisationId, { sensitivityDb: 50, verdict: 'fail', createdAt: new Date(clock.now().getTime() - 365 * 86_400_000) });
});
afterAll(async () => {
  await context?.close();
});

describe('GET /v1/production-summary', () => {
  it('counts, yield and distributions by hand-computed values', async () => {
    const from = new Date(clock.now().getTime() - 86_400_000).toISOString();
    const response = await kb.viewer.agent.get('/v1/production-summary').query({ model: 'KB-65 woofer', lot: 'LOT-2024-11A', from });
    expect(response.status, JSON.stringify(response.body)).toBe(200);
    const summary = response.body;
    expect(summary.counts).toEqual({ analyses: 7, succeeded: 5, failed: 1, pending: 1, canceled: 0, serials: 5, pass: 3, fail: 1, incomplete: 1, withoutVerdict: 0 });
    expect(summary.yieldPercent).toBe(75); // 3 / (3 + 1)

    // Sensitivity 86…90 dB: mean 88; σ = √(10/4) = 1.5811; type-7 percentiles h = 4p: p5 = 86.2, p50 = 88, p95 = 89.8.
    const sensitivity = summary.sensitivity.dbSplAt2p83VoltsOneMetre;
    expect(sensitivity.count).toBe(5);
    expect(sensitivity.mean).toBeCloseTo(88, 12);
    expect(sensitivity.standardDeviation).toBeCloseTo(Math.sqrt(2.5), 12);
    expect([sensitivity.min, sensitivity.p5, sensitivity.p50, sensitivity.p95, sensitivity.max].map((v: number) => Number(v.toFixed(10)))).toEqual([86, 86.2, 88, 89.8, 90]);
    expect(summary.sensitivity.dbSplPerVolt).toBeNull();
    expect(summary.sensitivity.millivoltsPerPascal).toBeNull();

    // THD 0.5, 0.6, 0.7, 0.8, 1.4 %: mean 0.8; σ = √(0.5/4) = 0.35355; p5 = 0.52, p50 = 0.7, p95 = 0.8 + 0.8·0.6 = 1.28.
    const thd = summary.thdFAtOneKilohertzPercent;
    expect(thd.mean).toBeCloseTo(0.8, 12);
    expect(thd.standardDeviation).toBeCloseTo(Math.sqrt(0.125), 12);
    expect(thd.p5).toBeCloseTo(0.52, 12);
    expect(thd.p50).toBeCloseTo(0.7, 12);
    expect(thd.p95).toBeCloseTo(1.28, 12);

    // −3 dB points: lower 50…58 Hz (mean 54), upper found on 4 units 3000…3300 Hz (mean 3150, p50 3150).
    expect(summary.bandLimits).toHaveLength(1);
    const [limits] = summary.bandLimits;
    expect(limits.dropDb).toBe(3);
    expect(limits.lowerHz).toMatchObject({ count: 5, mean: 54, min: 50, max: 58, p50: 54 });
    expect(limits.upperHz).toMatchObject({ count: 4, mean: 3150, p50: 3150 });
    expect(limits.upperHz.p95).toBeCloseTo(3285, 9); // h = 3·0.95 = 2.85 → 3200 + 0.85·100
  });

  it('without lot or range takes every lot and date; another organisation sees nothing', async () => {
    const all = await kb.owner.agent.get('/v1/production-summary').query({ model: 'KB-65 woofer' });
    expect(all.body.counts.analyses).toBe(9);
    expect(all.body.sensitivity.dbSplAt2p83VoltsOneMetre.min).toBe(50);
    const theirs = await other.agent.get('/v1/production-summary').query({ model: 'KB-65 woofer', lot: 'LOT-2024-11A' });
    expect(theirs.body.counts.analyses).toBe(1);
    expect(theirs.body.sensitivity.dbSplAt2p83VoltsOneMetre.mean).toBe(60);
    const none = await kb.owner.agent.get('/v1/production-summary').query({ model: 'KB-H40 headphone' });
    expect(none.body).toMatchObject({ yieldPercent: null, thdFAtOneKilohertzPercent: null, bandLimits: [] });
    const missingModel = await kb.owner.agent.get('/v1/production-summary');
    expect(missingModel.status).toBe(400);
    const backwards = await kb.owner.agent.get('/v1/production-summary').query({ model: 'KB-65 woofer', from: clock.now().toISOString(), to: '2020-01-01T00:00:00.000Z' });
    expect(backwards.status).toBe(400);
  });
});

describe('distribution statistics', () => {
  it('matches type-7 quantiles and the sample standard deviation', () => {
    // Hyndman & Fan (1996) definition 7 on 1…10: p5 = 1 + 0.45 = 1.45, p50 = 5.5, p95 = 9 + 0.55 = 9.55;
    // sample σ of 1…10 = √(82.5/9) = 3.02765 (closed form n(n+1)/12 for the variance of 1…n).
    const values = [10, 9, 8, 7, 6, 5, 4, 3, 2, 1];
    const d = distributionOf(values)!;
    expect(d.p5).toBeCloseTo(1.45, 12);
    expect(d.p50).toBeCloseTo(5.5, 12);
    expect(d.p95).toBeCloseTo(9.55, 12);
    expect(d.standardDeviation).toBeCloseTo(Math.sqrt((10 * 11) / 12), 12);
    expect(distributionOf([4])).toMatchObject({ count: 1, mean: 4, standardDeviation: null, p5: 4, p95: 4 });
    expect(distributionOf([])).toBeNull();
  });
});
