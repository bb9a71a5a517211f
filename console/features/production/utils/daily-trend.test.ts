import { describe, expect, it } from 'vitest';
import type { ProductionUnit } from '@shared/schemas/production';
import { dailyTrend } from './daily-trend';

const unit = (createdAt: string, verdict: ProductionUnit['verdict'], dbSpl: number | null): ProductionUnit => ({
  analysisId: `ana_${createdAt}`,
  serial: null,
  createdAt,
  verdict,
  sensitivity: { dbSplAt2p83VoltsOneMetre: dbSpl, dbSplPerVolt: null, millivoltsPerPascal: null },
  thdFAtOneKilohertzPercent: null,
});

describe('daily trend', () => {
  it('hand-computed: yield and mean sensitivity per UTC day', () => {
    const units = [
      unit('2026-11-30T23:59:00.000Z', 'pass', 88),
      unit('2026-11-29T08:00:00.000Z', 'pass', 87),
      unit('2026-11-30T10:00:00.000Z', 'fail', 84),
      unit('2026-11-30T11:00:00.000Z', 'pass', 86),
      unit('2026-11-30T12:00:00.000Z', 'incomplete', null),
      unit('2026-12-01T00:00:00.000Z', null, 90),
    ];
    const trend = dailyTrend(units, (u) => u.sensitivity.dbSplAt2p83VoltsOneMetre);
    expect(trend).toEqual([
      { day: '2026-11-29', units: 1, pass: 1, fail: 0, yieldPercent: 100, meanSensitivity: 87 },
      // 2 pass of 3 judged pass/fail → 66.67 %; mean of 88, 84, 86 = 86 (the incomplete unit has no value).
      { day: '2026-11-30', units: 4, pass: 2, fail: 1, yieldPercent: (100 * 2) / 3, meanSensitivity: 86 },
      { day: '2026-12-01', units: 1, pass: 0, fail: 0, yieldPercent: null, meanSensitivity: 90 },
    ]);
  });
});
