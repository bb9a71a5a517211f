import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { webhookEvents } from '@server/db/tables';
import { auth, idempotencyKey, measureContext, type MeasureContext } from './analyses-fixtures';

let m: MeasureContext;
beforeAll(async () => {
  m = await measureContext();
});
afterAll(async () => {
  await m?.close();
});

// The analysis.succeeded event carries the analysis's own verdict, incomplete included (a flat curve against flat
// limits: inside them everywhere it is measured; "incomplete" when the curve does not reach the mask's 100 Hz start).
describe('analysis.succeeded webhook verdict', () => {
  it('sends pass, incomplete and null (no mask) exactly as the analysis states them', async () => {
    const endpoint = await m.owner.agent.post('/v1/webhook-endpoints').send({ url: 'http://127.0.0.1:9/kb-mes', eventTypes: ['analysis.succeeded'] });
    expect(endpoint.status, JSON.stringify(endpoint.body)).toBe(201);
    const mask = await m.owner.agent.post('/v1/masks').set(idempotencyKey()).send({
      name: 'KB-T25 flat limits',
      levelReference: 'absolute',
      upper: [{ frequencyHz: 100, levelDb: 95 }, { frequencyHz: 10_000, levelDb: 95 }],
      lower: [{ frequencyHz: 100, levelDb: 85 }, { frequencyHz: 10_000, levelDb: 85 }],
    });
    const run = async (startsAtHz: number, masked: boolean) => {
      const frequenciesHz = [startsAtHz, 500, 1000, 2000, 5000, 10_000, 20_000];
      const response = await m.api().post('/v1/analyses').set(auth(m.key)).set(idempotencyKey()).set('Prefer', 'wait=30').send({
        kind: 'spectrum',
        spectrum: { frequenciesHz, magnitudeDb: frequenciesHz.map(() => 90), magnitudeReference: 'db_spl' },
        options: { thirdOctaveTable: false },
        ...(masked ? { mask: { maskId: mask.body.id } } : {}),
      });
      expect(response.body.status, JSON.stringify(response.body.error)).toBe('succeeded');
      return response.body as { id: string; verdict: string | null };
    };
    const analyses = [await run(50, true), await run(200, true), await run(50, false)];
    expect(analyses.map((a) => a.verdict)).toEqual(['pass', 'incomplete', null]);

    const rows = await m.context.deps.db.select().from(webhookEvents).where(eq(webhookEvents.organisationId, m.owner.organisationId));
    const verdictOf = new Map(rows.map((row) => JSON.parse(row.body) as { type: string; data: { id: string; verdict?: string | null } }).map((event) => [event.data.id, event.data.verdict]));
    for (const analysis of analyses) expect(verdictOf.get(analysis.id), analysis.id).toBe(analysis.verdict);
  });
});
