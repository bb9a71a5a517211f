import type { Calibration } from '@shared/schemas/calibrations';

export interface RigInput {
  rigId: string;
  inputChannel: number;
  /** Latest start first, as analyses pick them. */
  calibrations: Calibration[];
  /** The calibration an analysis naming this rig input would use now; null when none has started. */
  currentId: string | null;
}

const byLatestStart = (a: Calibration, b: Calibration) =>
  b.validFrom.localeCompare(a.validFrom) || b.createdAt.localeCompare(a.createdAt) || b.id.localeCompare(a.id);

/**
 * Groups calibrations per rig input. The current one follows the API's rule for analyses that name a rig input:
 * the latest that has started and not expired; else the latest that has started (which is then expired).
 */
export function groupByRigInput(calibrations: readonly Calibration[], now: Date): RigInput[] {
  const groups = new Map<string, Calibration[]>();
  for (const calibration of calibrations) {
    const key = `${calibration.rigId}\u0000${calibration.inputChannel}`;
    groups.set(key, [...(groups.get(key) ?? []), calibration]);
  }
  return [...groups.values()]
    .map((members) => {
      const sorted = [...members].sort(byLatestStart);
      const started = sorted.filter((calibration) => new Date(calibration.validFrom).getTime() <= now.getTime());
      const unexpired = started.find((calibration) => !calibration.validUntil || new Date(calibration.validUntil).getTime() > now.getTime());
      return { rigId: sorted[0].rigId, inputChannel: sorted[0].inputChannel, calibrations: sorted, currentId: (unexpired ?? started[0])?.id ?? null };
    })
    .sort((a, b) => a.rigId.localeCompare(b.rigId) || a.inputChannel - b.inputChannel);
}
