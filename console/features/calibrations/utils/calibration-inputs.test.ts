import { describe, expect, it } from 'vitest';
import type { Calibration } from '@shared/schemas/calibrations';
import { groupByRigInput } from './calibration-inputs';

const calibration = (id: string, rigId: string, inputChannel: number, validFrom: string, validUntil: string | null): Calibration => ({
  id,
  rigId,
  inputChannel,
  source: 'entered_dbfs',
  dbfsAtOnePascal: -38,
  details: {},
  warnings: [],
  notes: null,
  validFrom,
  validUntil,
  status: 'valid',
  createdBy: 'test',
  createdAt: validFrom,
});

const now = new Date('2026-12-02T12:00:00.000Z');

describe('calibrations per rig input', () => {
  it('groups by rig and channel and picks the one an analysis would apply', () => {
    const groups = groupByRigInput(
      [
        calibration('cal_old', 'kb-line2-rig1', 0, '2026-01-01T00:00:00.000Z', null),
        calibration('cal_expired_newer', 'kb-line2-rig1', 0, '2026-06-01T00:00:00.000Z', '2026-09-01T00:00:00.000Z'),
        calibration('cal_future', 'kb-line2-rig1', 0, '2027-01-01T00:00:00.000Z', null),
        calibration('cal_ch1_expired', 'kb-line2-rig1', 1, '2026-01-01T00:00:00.000Z', '2026-02-01T00:00:00.000Z'),
        calibration('cal_rig0', 'kb-line1-rig1', 0, '2026-11-01T00:00:00.000Z', null),
      ],
      now,
    );
    expect(groups.map((group) => [group.rigId, group.inputChannel, group.currentId])).toEqual([
      ['kb-line1-rig1', 0, 'cal_rig0'],
      // The newest started one has expired, so the older open-ended one applies; the future one has not started.
      ['kb-line2-rig1', 0, 'cal_old'],
      // Only an expired one exists: analyses still name it (and warn or are refused).
      ['kb-line2-rig1', 1, 'cal_ch1_expired'],
    ]);
    expect(groups[1].calibrations.map((c) => c.id)).toEqual(['cal_future', 'cal_expired_newer', 'cal_old']);
  });

  it('has no current calibration when none has started', () => {
    expect(groupByRigInput([calibration('cal_future', 'rig', 0, '2027-01-01T00:00:00.000Z', null)], now)[0].currentId).toBeNull();
  });
});
