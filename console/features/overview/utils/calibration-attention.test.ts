import { describe, expect, it } from 'vitest';
import { calibrationsNeedingAttention, nextCalibrationEnd } from './calibration-attention';

// Which calibrations to show on the overview: a rule of the product, checked on hand-made dates (common
// practice, no source: a lab recalibrates before the end, and an expired chain with no successor is the urgent one).
const now = new Date('2026-12-02T12:00:00.000Z');
const day = (offsetDays: number) => new Date(now.getTime() + offsetDays * 24 * 3600 * 1000).toISOString();
const calibration = (id: string, rigId: string, status: 'valid' | 'expired' | 'not_yet_valid', validUntil: string | null, inputChannel = 0) => ({ id, rigId, inputChannel, status, validUntil });

describe('calibrations needing attention', () => {
  it('puts an expired input without a successor first, then ends within 14 days, then replaced ones', () => {
    const list = [
      calibration('cal_new', 'line1', 'valid', day(76)),
      calibration('cal_old', 'line1', 'expired', day(-14)),
      calibration('cal_soon', 'line2', 'valid', day(5.5)),
      calibration('cal_later', 'line2', 'valid', day(9), 1),
      calibration('cal_gone', 'line3', 'expired', day(-2)),
      calibration('cal_far', 'line4', 'valid', day(40)),
      calibration('cal_open', 'line5', 'valid', null),
    ];
    const attention = calibrationsNeedingAttention(list, now);
    expect(attention.map((a) => [a.calibration.id, a.state, a.daysLeft])).toEqual([
      ['cal_gone', 'expired', -2],
      ['cal_soon', 'expiring', 5],
      ['cal_later', 'expiring', 9],
      ['cal_old', 'replaced', -14],
    ]);
  });

  it('tells the same rig on another input apart', () => {
    const attention = calibrationsNeedingAttention([calibration('a', 'rig', 'valid', day(60), 0), calibration('b', 'rig', 'expired', day(-1), 1)], now);
    expect(attention).toMatchObject([{ calibration: { id: 'b' }, state: 'expired' }]);
  });

  it('names the valid calibration that ends first', () => {
    const list = [calibration('x', 'a', 'valid', day(47)), calibration('y', 'b', 'valid', day(20)), calibration('z', 'c', 'expired', day(-3)), calibration('w', 'd', 'valid', null)];
    expect(nextCalibrationEnd(list)?.id).toBe('y');
    expect(nextCalibrationEnd([])).toBeNull();
  });
});
