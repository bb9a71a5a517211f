import { deriveMaskRequestSchema } from '@shared/schemas/masks';
import type { CreateAnalysisRequest } from '@shared/schemas/analyses';
import type { AppDeps } from '@server/deps';
import { deriveMask } from '@server/modules/masks/mask-derivation';
import { listMasks } from '@server/modules/masks/masks.repo';
import { analysesOfSerials, at, inBatches, storeDemoCapture, type DemoEngine } from './demo-measure';
import { DEMO_PRODUCTS, KB65, KB65_GOLDEN, serialOf, type ProductPlan } from './demo-products';
import { captureWavOf, demoUnit, measuringTimes, renderLineSweep, type DemoUnit } from './demo-units';

const DAY_MS = 86_400_000;

export interface ProductionContext {
  deps: AppDeps;
  orgId: string;
  now: Date;
  engine: DemoEngine;
  /** Units measured at once (engine threads + one, so the next capture is simulated while the engine runs). */
  parallelUnits: number;
  stimulusIds: Map<string, string>;
  /** Drawn masks by product model (the KB-65's derived mask is found or made here). */
  maskIds: Map<string, string>;
  log: (message: string, details?: Record<string, unknown>) => void;
}

interface UnitJob {
  product: ProductPlan;
  unit: DemoUnit;
  golden: boolean;
  mask: { maskId: string; version?: number } | null;
}

const sweeps = new Map<string, Float64Array>();
function lineSweep(product: ProductPlan): Float64Array {
  let sweep = sweeps.get(product.model);
  if (!sweep) sweeps.set(product.model, (sweep = renderLineSweep(product)));
  return sweep;
}

function baseRequest(context: ProductionContext, job: UnitJob): Omit<CreateAnalysisRequest, 'kind'> {
  const { product, unit } = job;
  return {
    stimulusId: context.stimulusIds.get(product.model)!,
    channels: { measurement: 0, reference: null },
    conditions: product.conditions,
    calibration: { rigId: product.rig.rigId, inputChannel: product.rig.inputChannel },
    dut: { model: product.model, serial: unit.serial, lot: unit.lot },
    tags: job.golden ? [...product.tags, 'golden'] : product.tags,
  };
}

/** One unit on its rig: the capture, then response and distortion (judged by the mask) and, for production units, sensitivity. */
async function measureUnit(context: ProductionContext, job: UnitJob): Promise<{ responseId: string; analyses: number }> {
  const { deps, orgId, engine } = context;
  const { product, unit } = job;
  const wav = captureWavOf(product, unit, lineSweep(product));
  const capture = await storeDemoCapture(at(deps, unit.measuredAt), orgId, `${unit.serial}.wav`, wav);
  const base = baseRequest(context, job);
  const later = (seconds: number) => at(deps, new Date(unit.measuredAt.getTime() + seconds * 1000));
  const response = engine.analyse(
    later(4),
    orgId,
    { ...base, kind: 'response_and_distortion', options: { response: product.responseOptions, distortion: product.distortionOptions }, ...(job.mask ? { mask: job.mask } : {}) },
    capture,
    wav,
  );
  const sensitivity = job.golden
    ? null
    : engine.analyse(
        later(5),
        orgId,
        { ...base, kind: 'sensitivity', options: product.responseOptions, sensitivity: { deviceType: product.deviceType, bandHz: product.sensitivityBandHz } },
        capture,
        wav,
        1,
      );
  const [finished] = await Promise.all([response, sensitivity]);
  return { responseId: finished.id, analyses: sensitivity ? 2 : 1 };
}

function goldenJobs(now: Date): UnitJob[] {
  const times = [
    ...measuringTimes(now, KB65_GOLDEN.firstBatchDaysAgo, KB65_GOLDEN.firstBatchDaysAgo, KB65_GOLDEN.firstBatch, 'golden-1'),
    ...measuringTimes(now, KB65_GOLDEN.secondBatchDaysAgo, KB65_GOLDEN.secondBatchDaysAgo, KB65_GOLDEN.unitCount - KB65_GOLDEN.firstBatch, 'golden-2'),
  ];
  return times.map((measuredAt, index) => ({
    product: KB65,
    unit: demoUnit(KB65, KB65_GOLDEN.lot, serialOf(KB65, KB65_GOLDEN.firstSerial + index), measuredAt, null),
    golden: true,
    mask: null,
  }));
}

function productionJobs(now: Date): Omit<UnitJob, 'mask'>[] {
  return DEMO_PRODUCTS.flatMap((product) =>
    product.lots.flatMap((lot) =>
      measuringTimes(now, lot.fromDaysAgo, lot.toDaysAgo, lot.unitCount, lot.lot).map((measuredAt, index) => ({
        product,
        unit: demoUnit(product, lot.lot, serialOf(product, lot.firstSerial + index), measuredAt, lot.failures[index] ?? null),
        golden: false,
      })),
    ),
  );
}

/** When mask versions 1 and 2 of the KB-65 were derived: a few hours after each golden batch. */
function maskVersionTimes(now: Date) {
  return {
    first: new Date(now.getTime() - KB65_GOLDEN.firstBatchDaysAgo * DAY_MS + 3 * 3_600_000),
    second: new Date(now.getTime() - KB65_GOLDEN.secondBatchDaysAgo * DAY_MS + 2 * 3_600_000),
  };
}

async function deriveGoldenMask(context: ProductionContext, when: Date, analysisIds: string[], maskId?: string) {
  const request = deriveMaskRequestSchema.parse({
    name: KB65_GOLDEN.maskName,
    analysisIds,
    k: KB65_GOLDEN.coverageFactor,
    minHalfWidthDb: KB65_GOLDEN.minHalfWidthDb,
    ...(maskId ? { maskId } : {}),
  });
  return deriveMask(at(context.deps, when), context.orgId, request);
}

/**
 * The KB-65 golden units and the mask derived from them (version 1 from the first three, version 2 from all
 * five), then every production unit. Units already in the organisation (by serial) are left alone.
 */
export async function ensureProduction(context: ProductionContext): Promise<{ units: number; analyses: number }> {
  const { deps, orgId, now } = context;
  const goldens = goldenJobs(now);
  const production = productionJobs(now);
  const existing = await analysesOfSerials(deps, orgId, [...goldens, ...production].map((job) => job.unit.serial));
  const measured = new Set(existing.map((row) => row.serial));
  const responseIds = new Map(existing.filter((row) => row.kind === 'response_and_distortion').map((row) => [row.serial, row.id]));
  let units = 0;
  let analyses = 0;
  const run = async (jobs: UnitJob[]) => {
    const todo = jobs.filter((job) => !measured.has(job.unit.serial));
    const results = await inBatches(todo, context.parallelUnits, (job) => measureUnit(context, job));
    results.forEach((result, index) => {
      responseIds.set(todo[index].unit.serial, result.responseId);
      units++;
      analyses += result.analyses;
    });
    return todo.length;
  };

  const times = maskVersionTimes(now);
  const idsOf = (jobs: UnitJob[]) => jobs.map((job) => responseIds.get(job.unit.serial)!);
  const firstBatch = goldens.slice(0, KB65_GOLDEN.firstBatch);
  await run(firstBatch);
  let mask = (await listMasks(deps.db, orgId, { limit: 100 })).find((row) => row.name === KB65_GOLDEN.maskName);
  const maskId = mask?.id ?? (await deriveGoldenMask(context, times.first, idsOf(firstBatch))).id;
  await run(goldens.slice(KB65_GOLDEN.firstBatch));
  mask = (await listMasks(deps.db, orgId, { limit: 100 })).find((row) => row.id === maskId);
  if (mask && mask.latestVersion < 2) await deriveGoldenMask(context, times.second, idsOf(goldens), maskId);
  if (units > 0) context.log('KB-65 golden units measured and the mask derived from them', { units, maskVersions: 2 });

  const jobs: UnitJob[] = production.map((job) => {
    if (job.product === KB65) return { ...job, mask: { maskId, version: job.unit.measuredAt < times.second ? 1 : 2 } };
    const drawn = context.maskIds.get(job.product.model);
    return { ...job, mask: drawn ? { maskId: drawn } : null };
  });
  for (const product of DEMO_PRODUCTS) {
    for (const lot of product.lots) {
      const started = Date.now();
      const count = await run(jobs.filter((job) => job.product === product && job.unit.lot === lot.lot));
      if (count > 0) context.log(`${product.model}, lot ${lot.lot}: ${count} units measured`, { seconds: (Date.now() - started) / 1000 });
    }
  }
  return { units, analyses };
}
