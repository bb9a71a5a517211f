import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { analyses } from '@server/db/tables';
import { manualClock } from '@server/lib/clock';
import { newId } from '@server/lib/ids';
import { signUp, type SignedUp } from '../support/actors';
import { createTestContext, type TestContext } from '../support/test-app';

const DAY_MS = 86_400_000;
const clock = manualClock(new Date(Math.ceil(Date.now() / 60_000) * 60_000));
let context: TestContext;
let kb: SignedUp;
let other: SignedUp;
const ids: Record<string, string> = {};

interface Unit {
  key: string;
  model: string | null;
  lot: string | null;
  status?: string;
  verdict?: 'pass' | 'fail' | null;
  sensitivityDb?: number;
  thdPercent?: number;
  daysAgo: number;
}

/** A stored analysis whose figures are shaped as the response_and_distortion kind writes them. */
async function stored(orgId: string, unit: Unit) {
  const id = newId('analysis');
  ids[unit.key] = id;
  const status = unit.status ?? 'succeeded';
  const figures = {
    sensitivity: unit.sensitivityDb === undefined ? null : { bandMean: { dbSplAt2p83VoltsOneMetre: unit.sensitivityDb, fromHz: 300, toHz: 3000, average: 'power' } },
    distortion: unit.thdPercent === undefined ? undefined : { thdF: { atReference: { frequencyHz: 1000, valuePercent: unit.thdPercent, isUpperBound: false } } },
  };
  const createdAt = new Date(clock.now().getTime() - unit.daysAgo * DAY_MS);
  await context.deps.db.insert(analyses).values({
    id,
    organisationId: orgId,
    kind: 'response_and_distortion',
    status,
    progress: 1,
    request: { kind: 'response_and_distortion' },
    dutModel: unit.model,
    dutSerial: `KB65-24-${unit.key}`,
    dutLot: unit.lot,
    tags: [],
    audioSeconds: 2,
    attempts: 1,
    cancelRequested: 0,
    resultJson: status === 'succeeded' ? JSON.stringify({ kind: 'response_and_distortion', figures, curves: {} }) : null,
    verdict: status === 'succeeded' ? (unit.verdict ?? null) : null,
    createdAt,
    updatedAt: createdAt,
  });
}

beforeAll(async () => {
  context = await createTestContext({ clock });
  kb = await signUp(context);
  other = await signUp(context, { organisationName: 'Other Lab' });
  const units: Unit[] = [
    { key: '000201', model: 'KB-65 woofer', lot: 'LOT-A', verdict: 'pass', sensitivityDb: 87.5, thdPercent: 0.4, daysAgo: 3 },
    { key: '000202', model: 'KB-65 woofer', lot: 'LOT-A', verdict: 'fail', sensitivityDb: 84.25, daysAgo: 2 },
    { key: '000203', model: 'KB-65 woofer', lot: 'LOT-A', status: 'failed', daysAgo: 1 },
    { key: '000204', model: 'KB-65 woofer', lot: 'LOT-B', verdict: 'pass', sensitivityDb: 88, daysAgo: 10 },
    { key: '000205', model: 'KB-T25 tweeter', lot: null, verdict: null, thdPercent: 0.2, daysAgo: 0 },
    { key: '000206', model: null, lot: 'LOT-A', daysAgo: 0 },
  ];
  for (const unit of units) await stored(kb.organisationId, unit);
  await stored(other.organisationId, { key: '900001', model: 'KB-65 woofer', lot: 'LOT-Z', verdict: 'pass', sensitivityDb: 70, daysAgo: 0 });
});
afterAll(async () => {
  await context?.close();
});

describe('GET /v1/production-lots', () => {
  it('lists the organisation\'s model/lot pairs, most recently measured first, without model-less analyses', async () => {
    const response = await kb.agent.get('/v1/production-lots');
    expect(response.status, JSON.stringify(response.body)).toBe(200);
    const day = (daysAgo: number) => new Date(clock.now().getTime() - daysAgo * DAY_MS).toISOString();
    expect(response.body).toEqual({
      data: [
        { model: 'KB-T25 tweeter', lot: null, analyses: 1, firstCreatedAt: day(0), lastCreatedAt: day(0) },
        { model: 'KB-65 woofer', lot: 'LOT-A', analyses: 3, firstCreatedAt: day(3), lastCreatedAt: day(1) },
        { model: 'KB-65 woofer', lot: 'LOT-B', analyses: 1, firstCreatedAt: day(10), lastCreatedAt: day(10) },
      ],
      truncated: false,
    });
  });

  it('narrows to one model; another organisation sees only its own', async () => {
    const woofer = await kb.agent.get('/v1/production-lots').query({ model: 'KB-65 woofer' });
    expect(woofer.body.data.map((pair: { lot: string }) => pair.lot)).toEqual(['LOT-A', 'LOT-B']);
    const theirs = await other.agent.get('/v1/production-lots');
    expect(theirs.body.data).toEqual([expect.objectContaining({ model: 'KB-65 woofer', lot: 'LOT-Z', analyses: 1 })]);
    const unknownField = await kb.agent.get('/v1/production-lots').query({ colour: 'blue' });
    expect(unknownField.status).toBe(400);
  });
});

describe('GET /v1/production-units', () => {
  it('gives each succeeded unit of the lot with its verdict and figures, newest first', async () => {
    const response = await kb.agent.get('/v1/production-units').query({ model: 'KB-65 woofer', lot: 'LOT-A' });
    expect(response.status, JSON.stringify(response.body)).toBe(200);
    expect(response.body.truncated).toBe(false);
    expect(response.body.data).toEqual([
      {
        analysisId: ids['000202'],
        serial: 'KB65-24-000202',
        createdAt: new Date(clock.now().getTime() - 2 * DAY_MS).toISOString(),
        verdict: 'fail',
        sensitivity: { dbSplAt2p83VoltsOneMetre: 84.25, dbSplPerVolt: null, millivoltsPerPascal: null },
        thdFAtOneKilohertzPercent: null,
      },
      {
        analysisId: ids['000201'],
        serial: 'KB65-24-000201',
        createdAt: new Date(clock.now().getTime() - 3 * DAY_MS).toISOString(),
        verdict: 'pass',
        sensitivity: { dbSplAt2p83VoltsOneMetre: 87.5, dbSplPerVolt: null, millivoltsPerPascal: null },
        thdFAtOneKilohertzPercent: 0.4,
      },
    ]);
  });

  it('honours the time range, refuses a backwards one and needs a model', async () => {
    const from = new Date(clock.now().getTime() - 2.5 * DAY_MS).toISOString();
    const recent = await kb.agent.get('/v1/production-units').query({ model: 'KB-65 woofer', from });
    expect(recent.body.data.map((unit: { serial: string }) => unit.serial)).toEqual(['KB65-24-000202']);
    const backwards = await kb.agent.get('/v1/production-units').query({ model: 'KB-65 woofer', from, to: '2020-01-01T00:00:00.000Z' });
    expect(backwards.status).toBe(400);
    expect(backwards.headers['content-type']).toMatch(/application\/problem\+json/);
    expect((await kb.agent.get('/v1/production-units')).status).toBe(400);
    const theirs = await other.agent.get('/v1/production-units').query({ model: 'KB-65 woofer', lot: 'LOT-A' });
    expect(theirs.body.data).toEqual([]);
  });
});
