import type { Calibration } from '@shared/schemas/calibrations';

/** How far ahead a calibration's end is worth a look on the overview. */
export const EXPIRY_NOTICE_DAYS = 14;

type CalibrationFields = Pick<Calibration, 'id' | 'rigId' | 'inputChannel' | 'validUntil' | 'status'>;

export type CalibrationAttention = {
  calibration: CalibrationFields;
  /**
   * expired: no valid calibration of that rig input is left (absolute levels need a new one);
   * expiring: valid, ending within the notice period; replaced: expired, but a later one of that input holds.
   */
  state: 'expired' | 'expiring' | 'replaced';
  /** Whole days until the end (negative: days since). */
  daysLeft: number;
};

const DAY_MS = 24 * 3600 * 1000;
const ORDER: Record<CalibrationAttention['state'], number> = { expired: 0, expiring: 1, replaced: 2 };
const inputOf = (c: CalibrationFields) => `${c.rigId}#${c.inputChannel}`;

/**
 * The calibrations worth a look: expired ones (first those no later calibration of the same rig input replaced)
 * and valid ones ending within `noticeDays`; within each group by the nearest end.
 */
export function calibrationsNeedingAttention(calibrations: readonly CalibrationFields[], now: Date = new Date(), noticeDays = EXPIRY_NOTICE_DAYS): CalibrationAttention[] {
  const inputsWithValid = new Set(calibrations.filter((c) => c.status === 'valid').map(inputOf));
  const attention: CalibrationAttention[] = [];
  for (const calibration of calibrations) {
    if (!calibration.validUntil) continue;
    const daysLeft = Math.floor((new Date(calibration.validUntil).getTime() - now.getTime()) / DAY_MS);
    if (calibration.status === 'expired') attention.push({ calibration, state: inputsWithValid.has(inputOf(calibration)) ? 'replaced' : 'expired', daysLeft });
    else if (calibration.status === 'valid' && daysLeft < noticeDays) attention.push({ calibration, state: 'expiring', daysLeft });
  }
  return attention.sort((a, b) => ORDER[a.state] - ORDER[b.state] || (a.state === 'expiring' ? a.daysLeft - b.daysLeft : b.daysLeft - a.daysLeft));
}

/** The valid calibration that ends first (null when none ends). */
export function nextCalibrationEnd(calibrations: readonly CalibrationFields[]): CalibrationFields | null {
  const ending = calibrations.filter((c) => c.status === 'valid' && c.validUntil);
  ending.sort((a, b) => Date.parse(a.validUntil!) - Date.parse(b.validUntil!));
  return ending[0] ?? null;
}
