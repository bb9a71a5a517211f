import { okabeIto } from '@console/components/charts/chart-palette';
import { Panel } from '@console/components/ui/panel';
import { EmptyState } from '@console/components/ui/states';
import type { DailyFigures } from '../utils/daily-trend';
import { BarChart } from './bar-chart';

const shortDay = (day: string) => day.slice(5);

/** Yield per UTC day; days without a pass or fail verdict show as hatched, not as 0 %. */
export function TrendPanel({ days, sensitivityUnit }: { days: DailyFigures[]; sensitivityUnit: string | null }) {
  return (
    <Panel id="production-trend" title="Yield per day" description="Each UTC day that has succeeded analyses; hatched: no pass or fail verdict that day.">
      {days.length === 0 ? (
        <EmptyState title="No days to show">No succeeded analysis in this selection.</EmptyState>
      ) : (
        <BarChart
          bars={days.map((day) => ({
            label: shortDay(day.day),
            value: day.yieldPercent,
            valueText:
              (day.yieldPercent === null ? 'no verdict' : `${day.yieldPercent.toFixed(1)} % (${day.pass} pass, ${day.fail} fail)`) +
              ` · ${day.units} unit${day.units === 1 ? '' : 's'}` +
              (day.meanSensitivity !== null && sensitivityUnit ? ` · mean sensitivity ${day.meanSensitivity.toFixed(2)} ${sensitivityUnit}` : ''),
          }))}
          xLabel="Day (UTC, month-day)"
          yLabel="Yield (%)"
          yMax={100}
          colour={okabeIto.bluishGreen}
          tableHeading="Day (UTC)"
          summary={`Yield per day over ${days.length} day${days.length === 1 ? '' : 's'} from ${days[0].day} to ${days[days.length - 1].day}.`}
        />
      )}
    </Panel>
  );
}
