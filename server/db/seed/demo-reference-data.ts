import type { CreateCalibrationRequest } from '@shared/schemas/calibrations';
import { createCalibrationRequestSchema } from '@shared/schemas/calibrations';
import type { AppDeps } from '@server/deps';
import type { Principal } from '@server/http/principal';
import { createCalibration } from '@server/modules/calibrations/calibrations.service';
import { listCalibrations } from '@server/modules/calibrations/calibrations.repo';
import { createMask } from '@server/modules/masks/masks.service';
import { listMasks } from '@server/modules/masks/masks.repo';
import { createStimulus } from '@server/modules/stimuli/stimuli.service';
import { listStimuli } from '@server/modules/stimuli/stimuli.repo';
import { drawnMaskContent, type DrawnMaskPlan } from './demo-masks';
import { at, storeDemoCapture } from './demo-measure';
import { DEMO_PRODUCTS, KB65, KBH40, KBT25, type ProductPlan } from './demo-products';
import { calibratorWavOf } from './demo-units';

const DAY_MS = 86_400_000;
const daysAgo = (now: Date, days: number) => new Date(now.getTime() - days * DAY_MS);

/** The line stimuli by product model, created (once) six weeks back. */
export async function ensureStimuli(deps: AppDeps, orgId: string, now: Date): Promise<Map<string, string>> {
  const existing = await listStimuli(deps.db, orgId, { limit: 100 });
  const ids = new Map<string, string>();
  for (const product of DEMO_PRODUCTS) {
    const found = existing.find((row) => row.name === product.stimulusName);
    const id = found?.id ?? (await createStimulus(at(deps, daysAgo(now, 42)), orgId, { type: 'sweep', name: product.stimulusName, parameters: product.sweep })).id;
    ids.set(product.model, id);
  }
  return ids;
}

interface CalibrationPlan {
  product: ProductPlan;
  /** Identifies the calibration on a later run (with the rig input). */
  notes: string;
  validFromDaysAgo: number;
  validForDays: number;
  source: 'calibrator_capture' | 'entered_microphone' | 'entered_dbfs';
}

/**
 * Line 1's first calibration ran out two weeks ago and was replaced (the expired one of the demo); line 2 was
 * entered from the microphone's data sheet, the ear simulator's chain sensitivity typed in.
 */
const CALIBRATIONS: CalibrationPlan[] = [
  { product: KB65, notes: 'Class 1 calibrator KBC-0042, 94 dB at 1 kHz; microphone M-07 on preamp input 1', validFromDaysAgo: 43, validForDays: 29, source: 'calibrator_capture' },
  { product: KB65, notes: 'Recalibrated after the monthly check; calibrator KBC-0042, 94 dB at 1 kHz', validFromDaysAgo: 14, validForDays: 90, source: 'calibrator_capture' },
  { product: KBT25, notes: 'Microphone M-11 data sheet sensitivity; interface full scale 1 V RMS', validFromDaysAgo: 43, validForDays: 90, source: 'entered_microphone' },
  { product: KBH40, notes: 'Ear simulator chain from the quarterly lab calibration report', validFromDaysAgo: 43, validForDays: 90, source: 'entered_dbfs' },
];

async function calibrationRequest(deps: AppDeps, orgId: string, plan: CalibrationPlan, validFrom: Date): Promise<CreateCalibrationRequest> {
  const { rigId, inputChannel, dbfsAtOnePascal } = plan.product.rig;
  const validity = { validFrom: validFrom.toISOString(), validUntil: new Date(validFrom.getTime() + plan.validForDays * DAY_MS).toISOString(), notes: plan.notes };
  if (plan.source === 'calibrator_capture') {
    const wav = calibratorWavOf(dbfsAtOnePascal, 94, `${rigId}/${plan.validFromDaysAgo}`);
    const capture = await storeDemoCapture(deps, orgId, `${rigId}-calibrator-94dB.wav`, wav);
    return createCalibrationRequestSchema.parse({ source: 'calibrator_capture', rigId, inputChannel, captureId: capture.id, statedLevelDbSpl: 94, ...validity });
  }
  if (plan.source === 'entered_microphone') {
    const fullScaleVoltsRms = 1;
    const millivoltsPerPascal = Math.round(1000 * fullScaleVoltsRms * 10 ** (dbfsAtOnePascal / 20) * 100) / 100;
    return createCalibrationRequestSchema.parse({ source: 'entered_microphone', rigId, inputChannel, microphoneMillivoltsPerPascal: millivoltsPerPascal, adcFullScaleVoltsRms: fullScaleVoltsRms, ...validity });
  }
  return createCalibrationRequestSchema.parse({ source: 'entered_dbfs', rigId, inputChannel, dbfsAtOnePascal, ...validity });
}

/** Calibrations per rig input, created through the calibration service by the analyst. Returns how many were added. */
export async function ensureCalibrations(deps: AppDeps, analyst: Principal, now: Date): Promise<number> {
  const orgId = analyst.organisationId;
  let added = 0;
  for (const plan of CALIBRATIONS) {
    const { rigId, inputChannel } = plan.product.rig;
    const existing = await listCalibrations(deps.db, orgId, { rigId, inputChannel }, { limit: 100 });
    if (existing.some((row) => row.notes === plan.notes)) continue;
    const validFrom = daysAgo(now, plan.validFromDaysAgo);
    const then = at(deps, new Date(validFrom.getTime() + 600_000));
    await createCalibration(then, analyst, await calibrationRequest(then, orgId, plan, validFrom));
    added++;
  }
  return added;
}

/** Hand-drawn limits for the tweeter and the headphone (the woofer's mask is derived from golden units). */
export const DRAWN_MASKS: DrawnMaskPlan[] = [
  { name: 'KB-T25 tweeter response limits', product: KBT25, referenceHz: 4000, fromHz: 2000, toHz: 18_000, toleranceDb: 2, note: 'Design curve ±2 dB re 4 kHz, 2–18 kHz' },
  { name: 'KB-H40 headphone response limits', product: KBH40, referenceHz: 1000, fromHz: 40, toHz: 8000, toleranceDb: 3, note: 'Design curve ±3 dB re 1 kHz on the ear simulator, 40 Hz–8 kHz' },
];

/** Mask ids by product model for the drawn masks. */
export async function ensureDrawnMasks(deps: AppDeps, orgId: string, now: Date): Promise<Map<string, string>> {
  const existing = await listMasks(deps.db, orgId, { limit: 100 });
  const ids = new Map<string, string>();
  for (const plan of DRAWN_MASKS) {
    const found = existing.find((row) => row.name === plan.name);
    const id = found?.id ?? (await createMask(at(deps, daysAgo(now, 42)), orgId, { name: plan.name, ...drawnMaskContent(plan) })).id;
    ids.set(plan.product.model, id);
  }
  return ids;
}
