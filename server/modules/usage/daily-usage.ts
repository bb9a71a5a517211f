import type { DailyUsage } from '@shared/schemas/usage';
import type { AppDeps } from '@server/deps';
import { usagePeriodAt } from './billing-period';
import { sumChargesPerDay } from './daily-usage.repo';
import { getOrganisationPlan } from './organisation-plan.service';

const DAY_MS = 86_400_000;

const utcDay = (date: Date) => date.toISOString().slice(0, 10);

/** Every UTC day from the period's first to today (or the period's last), with zeros where nothing was charged. */
export async function getDailyUsage(deps: AppDeps, organisationId: string): Promise<DailyUsage> {
  const plan = await getOrganisationPlan(deps, organisationId);
  const now = deps.clock.now();
  const period = usagePeriodAt(plan.periodAnchor, now);
  const charged = new Map((await sumChargesPerDay(deps.db, organisationId, period.start)).map((row) => [row.day, row]));
  const lastDay = utcDay(new Date(Math.min(now.getTime(), period.end.getTime() - 1)));
  const days: DailyUsage['days'] = [];
  for (let time = Date.parse(`${utcDay(period.start)}T00:00:00.000Z`); ; time += DAY_MS) {
    const date = utcDay(new Date(time));
    const row = charged.get(date);
    days.push({ date, analyses: row?.analyses ?? 0, audioMinutes: Math.round(((row?.audioSeconds ?? 0) / 60) * 1000) / 1000 });
    if (date >= lastDay) break;
  }
  return { period: { start: period.start.toISOString(), end: period.end.toISOString() }, days };
}
