import type { ProductionUnit } from '@shared/schemas/production';

export interface DailyFigures {
  /** YYYY-MM-DD in UTC. */
  day: string;
  units: number;
  pass: number;
  fail: number;
  /** pass / (pass + fail) × 100, as the summary defines yield; null on a day without a pass or fail verdict. */
  yieldPercent: number | null;
  /** Arithmetic mean of the day's sensitivity values in the chosen unit; null when none. */
  meanSensitivity: number | null;
}

/** One entry per UTC day that has units, oldest first. */
export function dailyTrend(units: readonly ProductionUnit[], sensitivityOf: (unit: ProductionUnit) => number | null): DailyFigures[] {
  const byDay = new Map<string, ProductionUnit[]>();
  for (const unit of units) {
    const day = unit.createdAt.slice(0, 10);
    byDay.set(day, [...(byDay.get(day) ?? []), unit]);
  }
  return [...byDay.entries()]
    .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0))
    .map(([day, dayUnits]) => {
      const pass = dayUnits.filter((unit) => unit.verdict === 'pass').length;
      const fail = dayUnits.filter((unit) => unit.verdict === 'fail').length;
      const sensitivities = dayUnits.map(sensitivityOf).filter((value): value is number => value !== null);
      return {
        day,
        units: dayUnits.length,
        pass,
        fail,
        yieldPercent: pass + fail > 0 ? (100 * pass) / (pass + fail) : null,
        meanSensitivity: sensitivities.length > 0 ? sensitivities.reduce((sum, value) => sum + value, 0) / sensitivities.length : null,
      };
    });
}
