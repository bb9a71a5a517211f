import type { AppDeps } from '@server/deps';
import { newId } from '@server/lib/ids';
import { findAnalyses, type AnalysisRow } from '@server/modules/analyses/analyses.repo';
import { insertAttempt, updateDelivery } from '@server/modules/webhook-endpoints/webhook-deliveries.repo';
import { listEndpoints, updateEndpoint } from '@server/modules/webhook-endpoints/webhook-endpoints.repo';
import { createEndpoint, emitEvent, updateEndpointSettings } from '@server/modules/webhook-endpoints/webhooks.service';
import { analysesOfSerials, at } from './demo-measure';
import { KB65, KBH40, serialOf } from './demo-products';

const DAY_MS = 86_400_000;

/**
 * Two receivers at an invented host, with a delivery history and both disabled by the end of it: one paused by
 * a person, one disabled by the service after its receiver answered 410 Gone. Every seeded delivery is final
 * (succeeded or failed), so the dispatcher finds nothing to send at any start and never retries the demo host.
 */
interface ReceiverAnswer {
  status: number;
  excerpt: string;
  outcome: 'succeeded' | 'retry:server_error' | 'disable_endpoint';
  durationMs: number;
}

const OK = (durationMs: number): ReceiverAnswer => ({ status: 200, excerpt: '{"received":true}', outcome: 'succeeded', durationMs });
const UNAVAILABLE: ReceiverAnswer = { status: 503, excerpt: 'Service Unavailable: MES bridge restarting', outcome: 'retry:server_error', durationMs: 2140 };
const GONE: ReceiverAnswer = { status: 410, excerpt: 'Gone: this dashboard was retired', outcome: 'disable_endpoint', durationMs: 95 };

function dutOf(row: AnalysisRow) {
  return row.dutModel && row.dutSerial ? { model: row.dutModel, serial: row.dutSerial, ...(row.dutLot ? { lot: row.dutLot } : {}) } : undefined;
}

/** The analysis.succeeded event of a finished analysis, as the job processor emits it, and the receiver's answers to it. */
async function deliverHistory(deps: AppDeps, orgId: string, row: AnalysisRow, answers: ReceiverAnswer[]) {
  const finishedAt = row.finishedAt ?? row.createdAt;
  const verdict = row.verdict === 'pass' || row.verdict === 'fail' ? row.verdict : null;
  const emitted = await emitEvent(at(deps, finishedAt), orgId, 'analysis.succeeded', {
    id: row.id,
    kind: row.kind,
    status: 'succeeded',
    captureId: row.captureId ?? undefined,
    dut: dutOf(row),
    verdict,
    url: `/v1/analyses/${row.id}`,
  });
  for (const deliveryId of emitted.deliveryIds) {
    let attemptedAt = new Date(finishedAt.getTime() + 400);
    for (const [index, answer] of answers.entries()) {
      await insertAttempt(deps.db, orgId, {
        id: newId('webhookAttempt'),
        deliveryId,
        attemptNumber: index + 1,
        outcome: answer.outcome,
        responseStatus: answer.status,
        responseExcerpt: answer.excerpt,
        error: null,
        durationMs: answer.durationMs,
        attemptedAt,
      });
      const last = index === answers.length - 1;
      await updateDelivery(deps.db, orgId, deliveryId, {
        status: last ? (answer.outcome === 'succeeded' ? 'succeeded' : 'failed') : 'pending',
        attempts: index + 1,
        nextAttemptAt: last ? null : new Date(attemptedAt.getTime() + 5000),
        lastAttemptAt: attemptedAt,
        lastResponseStatus: answer.status,
        lastResponseExcerpt: answer.excerpt,
        lastError: null,
        lockedUntil: null,
        updatedAt: attemptedAt,
      });
      attemptedAt = new Date(attemptedAt.getTime() + 5000 + answer.durationMs);
    }
  }
}

async function responseRowsOf(deps: AppDeps, orgId: string, serials: string[], after: Date): Promise<AnalysisRow[]> {
  const ids = (await analysesOfSerials(deps, orgId, serials)).filter((row) => row.kind === 'response_and_distortion').map((row) => row.id);
  const rows = await findAnalyses(deps.db, orgId, ids);
  return rows.filter((row) => row.createdAt > after).sort((a, b) => a.createdAt.getTime() - b.createdAt.getTime());
}

const MES_URL = 'https://hooks.kestrelbay.example/sweepline/line1-mes';
const DASHBOARD_URL = 'https://hooks.kestrelbay.example/sweepline/quality-dashboard';

/** Returns how many endpoints were added. */
export async function ensureWebhooks(deps: AppDeps, orgId: string, now: Date): Promise<number> {
  const existing = await listEndpoints(deps.db, orgId, { limit: 100 });
  let added = 0;
  if (!existing.some((row) => row.url === MES_URL)) {
    const created = new Date(now.getTime() - 12 * DAY_MS);
    const { endpoint } = await createEndpoint(at(deps, created), orgId, {
      url: MES_URL,
      eventTypes: ['analysis.succeeded', 'analysis.failed'],
      description: 'Line 1 MES bridge: woofer verdicts to the line controller',
    });
    const lot = KB65.lots[2];
    const serials = Array.from({ length: lot.unitCount }, (_, index) => serialOf(KB65, lot.firstSerial + index));
    const rows = await responseRowsOf(deps, orgId, serials, created);
    for (const [index, row] of rows.entries()) await deliverHistory(deps, orgId, row, index === 2 ? [UNAVAILABLE, OK(88)] : [OK(60 + 7 * index)]);
    await updateEndpointSettings(at(deps, new Date(now.getTime() - 3 * DAY_MS)), orgId, endpoint.id, {
      enabled: false,
      description: 'Line 1 MES bridge: paused while the line controller is upgraded',
    });
    added++;
  }
  if (!existing.some((row) => row.url === DASHBOARD_URL)) {
    const created = new Date(now.getTime() - 5 * DAY_MS);
    const { endpoint } = await createEndpoint(at(deps, created), orgId, {
      url: DASHBOARD_URL,
      eventTypes: ['analysis.succeeded'],
      description: 'Old quality dashboard (headphone cell)',
    });
    const lot = KBH40.lots[1];
    const serials = Array.from({ length: lot.unitCount }, (_, index) => serialOf(KBH40, lot.firstSerial + index));
    const [first] = await responseRowsOf(deps, orgId, serials, created);
    if (first) {
      await deliverHistory(deps, orgId, first, [GONE]);
      // What the dispatcher does on 410 Gone: the receiver wants no more events.
      const when = new Date((first.finishedAt ?? first.createdAt).getTime() + 500);
      await updateEndpoint(deps.db, orgId, endpoint.id, { enabled: false, disabledReason: 'gone', updatedAt: when });
    }
    added++;
  }
  return added;
}
