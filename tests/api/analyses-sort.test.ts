import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ANALYSIS_SORTS, type AnalysisSort } from '@shared/schemas/analyses';
import { setOrganisationPlan } from '@server/modules/usage/organisation-plan.service';
import { auth, idempotencyKey, measureContext, type MeasureContext } from './analyses-fixtures';

let m: MeasureContext;
beforeAll(async () => {
  m = await measureContext();
  // Paging every sort twice takes more requests than a minute's rate limit allows.
  await setOrganisationPlan(m.context.deps, m.owner.organisationId, { planId: 'plant', limitOverrides: { requestsPerMinute: 100_000 } });
});
afterAll(async () => {
  await m?.close();
});

// Flat absolute mask 85..95 dB SPL over 100 Hz–10 kHz.
const MASK_UPPER_DB = 95;
const MASK_LOWER_DB = 85;

interface Unit {
  levelDbSpl: number;
  model?: string;
  serial?: string;
  masked: boolean;
  /** The spectrum starts at 200 Hz, so it does not cover the mask's 100 Hz start: verdict incomplete. */
  shortSpan?: boolean;
}

// Labels use one case pattern and ASCII, so the database collation orders them as code units do.
const UNITS: Unit[] = [
  { levelDbSpl: 90, model: 'KB-65 woofer', serial: 'KB65-24-000123', masked: true },
  { levelDbSpl: 96, model: 'KB-65 woofer', serial: 'KB65-24-000124', masked: true },
  { levelDbSpl: 88, model: 'KB-T25 tweeter', serial: 'KBT25-24-000007', masked: true },
  { levelDbSpl: 84, model: 'KB-T25 tweeter', masked: true },
  { levelDbSpl: 90, model: 'KB-H40 headphone', serial: 'KBH40-24-000300', masked: true, shortSpan: true },
  { levelDbSpl: 88, serial: 'KB65-24-000125', masked: true },
  { levelDbSpl: 91, model: 'KB-65 woofer', serial: 'KB65-24-000126', masked: false },
  { levelDbSpl: 92, masked: false },
  { levelDbSpl: 86, model: 'KB-M10 measurement mic', serial: 'KBM10-24-000042', masked: true },
  { levelDbSpl: 93, model: 'KB-65 woofer', masked: true },
  { levelDbSpl: 87, model: 'KB-H40 headphone', serial: 'KBH40-24-000301', masked: false },
];

interface Listed {
  id: string;
  dut: { model: string | null; serial: string | null };
  verdict: string | null;
  worstMarginDb: number | null;
  createdAt: string;
}

/** Closed form for a flat curve at L against flat limits: margins U − L and L − Lo, the worst is the smaller. */
const expectedMarginDb = (unit: Unit) => (unit.masked ? Math.min(MASK_UPPER_DB - unit.levelDbSpl, unit.levelDbSpl - MASK_LOWER_DB) : null);
const expectedVerdict = (unit: Unit) => {
  if (!unit.masked) return null;
  if (expectedMarginDb(unit)! < 0) return 'fail';
  return unit.shortSpan ? 'incomplete' : 'pass';
};

type Key = string | number | null;
function keyOf(item: Listed, field: string): Key {
  switch (field) {
    case 'createdAt':
      return item.createdAt;
    case 'model':
      return item.dut.model;
    case 'serial':
      return item.dut.serial;
    case 'verdict':
      return item.verdict;
    default:
      return item.worstMarginDb;
  }
}

/** The documented order, computed here: key in the direction, ties by id in the same direction, missing keys last. */
function sortedLocally(items: Listed[], sort: AnalysisSort): string[] {
  const descending = sort.startsWith('-');
  const field = descending ? sort.slice(1) : sort;
  const sign = descending ? -1 : 1;
  const compare = (a: Key, b: Key) => (a === b ? 0 : (a as string | number) < (b as string | number) ? -1 : 1);
  return [...items]
    .sort((a, b) => {
      const ka = keyOf(a, field);
      const kb = keyOf(b, field);
      if (ka === null && kb !== null) return 1;
      if (kb === null && ka !== null) return -1;
      return sign * compare(ka, kb) || sign * compare(a.id, b.id);
    })
    .map((item) => item.id);
}

async function pagesOf(sort: string, limit: number): Promise<string[]> {
  const ids: string[] = [];
  let cursor: string | undefined;
  for (let page = 0; page < 50; page++) {
    const response = await m.api().get('/v1/analyses').query({ sort, limit, tag: 'sort-check', ...(cursor ? { cursor } : {}) }).set(auth(m.key));
    expect(response.status, JSON.stringify(response.body)).toBe(200);
    ids.push(...(response.body.data as Listed[]).map((item) => item.id));
    if (!response.body.hasMore) {
      expect(response.body.nextCursor).toBeUndefined();
      return ids;
    }
    cursor = response.body.nextCursor;
  }
  throw new Error('no last page');
}

describe('GET /v1/analyses?sort=', () => {
  let all: Listed[] = [];
  const unitOf = new Map<string, Unit>();

  beforeAll(async () => {
    const mask = await m.owner.agent.post('/v1/masks').send({
      name: 'KB line flat limits',
      levelReference: 'absolute',
      upper: [{ frequencyHz: 100, levelDb: MASK_UPPER_DB }, { frequencyHz: 10_000, levelDb: MASK_UPPER_DB }],
      lower: [{ frequencyHz: 100, levelDb: MASK_LOWER_DB }, { frequencyHz: 10_000, levelDb: MASK_LOWER_DB }],
    });
    expect(mask.status, JSON.stringify(mask.body)).toBe(201);
    for (const unit of UNITS) {
      const frequenciesHz = (unit.shortSpan ? [200] : [50, 100, 200]).concat([500, 1000, 2000, 5000, 10_000, 20_000]);
      const response = await m.api().post('/v1/analyses').set(auth(m.key)).set(idempotencyKey()).set('Prefer', 'wait=30').send({
        kind: 'spectrum',
        spectrum: { frequenciesHz, magnitudeDb: frequenciesHz.map(() => unit.levelDbSpl), magnitudeReference: 'db_spl' },
        options: { thirdOctaveTable: false },
        ...(unit.masked ? { mask: { maskId: mask.body.id } } : {}),
        ...(unit.model || unit.serial ? { dut: { ...(unit.model ? { model: unit.model } : {}), ...(unit.serial ? { serial: unit.serial } : {}) } } : {}),
        tags: ['sort-check'],
      });
      expect(response.status, JSON.stringify(response.body)).toBe(200);
      expect(response.body.status, JSON.stringify(response.body.error)).toBe('succeeded');
      unitOf.set(response.body.id, unit);
    }
    const full = await m.api().get('/v1/analyses').query({ tag: 'sort-check', limit: 100 }).set(auth(m.key));
    all = full.body.data;
  });

  it('lists each analysis with the verdict and worst margin of the closed form', () => {
    expect(all).toHaveLength(UNITS.length);
    for (const item of all) {
      const unit = unitOf.get(item.id)!;
      expect(item.verdict, `${unit.levelDbSpl} dB`).toBe(expectedVerdict(unit));
      const margin = expectedMarginDb(unit);
      if (margin === null) expect(item.worstMarginDb).toBeNull();
      else expect(item.worstMarginDb).toBeCloseTo(margin, 9);
    }
  });

  it.each(ANALYSIS_SORTS.map((sort) => [sort]))('pages of 3 concatenated equal the whole list sorted by %s', async (sort) => {
    const expected = sortedLocally(all, sort);
    expect(await pagesOf(sort, 3)).toEqual(expected);
    // Another page size gives the same order (the cursor carries the key and the id tiebreak).
    expect(await pagesOf(sort, 4)).toEqual(expected);
  });

  it('defaults to -createdAt (newest first)', async () => {
    const plain = await m.api().get('/v1/analyses').query({ tag: 'sort-check', limit: 100 }).set(auth(m.key));
    expect(plain.body.data.map((item: Listed) => item.id)).toEqual(sortedLocally(all, '-createdAt'));
  });

  it('refuses an unknown sort with 400 and a cursor from another sort with 400 invalid_cursor', async () => {
    const unknown = await m.api().get('/v1/analyses').query({ sort: 'levelDb' }).set(auth(m.key));
    expect(unknown.status).toBe(400);
    expect(unknown.body.code).toBe('validation_failed');
    expect(unknown.body.errors[0].pointer).toBe('#/sort');
    const first = await m.api().get('/v1/analyses').query({ sort: 'model', limit: 2, tag: 'sort-check' }).set(auth(m.key));
    expect(first.body.nextCursor).toBeDefined();
    const crossed = await m.api().get('/v1/analyses').query({ sort: '-model', limit: 2, tag: 'sort-check', cursor: first.body.nextCursor }).set(auth(m.key));
    expect(crossed.status).toBe(400);
    expect(crossed.body.code).toBe('invalid_cursor');
    const tampered = await m.api().get('/v1/analyses').query({ sort: 'model', limit: 2, tag: 'sort-check', cursor: `${first.body.nextCursor}x` }).set(auth(m.key));
    expect(tampered.status).toBe(400);
  });
});
