import { permissionsOfRole } from '@shared/schemas/permissions';
import type { Principal } from '@server/http/principal';
import type { AppDeps } from '@server/deps';
import { engineThreadCount } from '@server/jobs/engine-pool';
import { setOrganisationPlan } from '@server/modules/usage/organisation-plan.service';
import { findOrganisationPlan } from '@server/modules/usage/organisation-plans.repo';
import { at, startDemoEngine } from './demo-measure';
import { ensureProduction } from './demo-production';
import { ensureCalibrations, ensureDrawnMasks, ensureStimuli } from './demo-reference-data';
import { ensureWebhooks } from './demo-webhooks';
import type { SeedContext, SeedStep } from './seed';

const DAY_MS = 86_400_000;

/**
 * The free plan with monthly periods starting 15 days before the first seed (as if the organisation had signed up
 * on that day of the month), so the current period holds the recent lots and the previous one the older lots.
 * Only when the organisation has no plan row yet: set before any analysis is charged.
 */
async function ensureUsagePeriod(deps: AppDeps, orgId: string, now: Date): Promise<void> {
  if (await findOrganisationPlan(deps.db, orgId)) return;
  const start = new Date(now.getTime() - 15 * DAY_MS);
  const periodAnchor = new Date(Date.UTC(start.getUTCFullYear(), start.getUTCMonth(), start.getUTCDate()));
  await setOrganisationPlan(at(deps, new Date(now.getTime() - 44 * DAY_MS)), orgId, { planId: 'bench', periodAnchor });
}

/**
 * The living workspace of the demo organisation: line stimuli, calibrations per rig input (one expired), tolerance
 * masks (the woofer's derived from golden units, in two versions), some 55 units of three models in seven lots
 * measured over the last six weeks with a few failing ones, two webhook receivers with their delivery history,
 * and the usage all that charged. Times are relative to the seed's clock on its first run; later runs find
 * everything (by name, rig input, serial or URL) and add nothing.
 */
export const demoWorkspace: SeedStep = {
  name: 'demo workspace',
  async run(context: SeedContext) {
    const { deps, organisationId: orgId, members } = context;
    const now = deps.clock.now();
    const started = Date.now();
    const log = (message: string, details: Record<string, unknown> = {}) => deps.logger.info(details, `demo seed: ${message}`);
    const analyst: Principal = {
      organisationId: orgId,
      permissions: new Set(permissionsOfRole('analyst')),
      actor: { type: 'user', id: members.analyst.userId, label: members.analyst.displayName, membershipId: members.analyst.membershipId, role: 'analyst' },
    };

    await ensureUsagePeriod(deps, orgId, now);
    const stimulusIds = await ensureStimuli(deps, orgId, now);
    const calibrations = await ensureCalibrations(deps, analyst, now);
    if (calibrations > 0) log('calibrations recorded', { calibrations });
    const maskIds = await ensureDrawnMasks(deps, orgId, now);

    // As many engine threads as the job runner uses; this thread simulates the next captures meanwhile.
    const threads = engineThreadCount(deps.config.jobs.engineThreads);
    let engine: ReturnType<typeof startDemoEngine> | null = null;
    const lazyEngine = {
      analyse: (...args: Parameters<ReturnType<typeof startDemoEngine>['analyse']>) => (engine ??= startDemoEngine(threads)).analyse(...args),
      close: async () => engine?.close(),
    };
    try {
      const measured = await ensureProduction({ deps, orgId, now, engine: lazyEngine, parallelUnits: threads + 1, stimulusIds, maskIds, log });
      const webhooks = await ensureWebhooks(deps, orgId, now);
      if (measured.units > 0 || webhooks > 0 || calibrations > 0) {
        log('workspace ready', { units: measured.units, analyses: measured.analyses, webhookEndpoints: webhooks, seconds: (Date.now() - started) / 1000 });
      }
    } finally {
      await lazyEngine.close();
    }
  },
};
