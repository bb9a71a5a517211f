import { useMemo } from 'react';
import { Link } from 'react-router';
import { Panel } from '@console/components/ui/panel';
import { paths } from '@console/config/paths';
import { cn } from '@console/utils/cn';
import { tallyStart, useWeekTally } from '../api/get-week-tally';
import { passRatePercent, type AnalysisTally } from '../utils/week-tally';
import { CardQuery, NotForRole } from './card-states';

type Figure = { key: keyof AnalysisTally; label: string; tone: string; filter?: string };

const FIGURES: Figure[] = [
  { key: 'pass', label: 'Pass', tone: 'border-ok-600 text-ok-700', filter: 'verdict=pass' },
  { key: 'fail', label: 'Fail', tone: 'border-danger-600 text-danger-700', filter: 'verdict=fail' },
  { key: 'incomplete', label: 'Incomplete', tone: 'border-signal-600 text-signal-800', filter: 'verdict=incomplete' },
  { key: 'noVerdict', label: 'No mask', tone: 'border-ink-300 text-ink-800' },
  { key: 'notRun', label: 'Failed to run', tone: 'border-ink-300 text-ink-800', filter: 'status=failed' },
  { key: 'inProgress', label: 'In progress', tone: 'border-ink-300 text-ink-800' },
];

function Tally({ tally, fromDay }: { tally: AnalysisTally; fromDay: string }) {
  const rate = passRatePercent(tally);
  const atLeast = tally.truncated ? '≥ ' : '';
  return (
    <div className="space-y-4">
      <dl className="grid grid-cols-3 gap-3 lg:grid-cols-6">
        {FIGURES.map((figure) => {
          const value = tally[figure.key] as number;
          const text = `${atLeast}${value}`;
          return (
            <div key={figure.key} className={cn('border-l-4 pl-3', figure.tone)}>
              <dt className="text-xs font-semibold text-ink-600">{figure.label}</dt>
              <dd className="font-mono text-2xl font-bold tabular">
                {figure.filter && value > 0 ? (
                  <Link
                    to={paths.app.analyses.getHref(`${figure.filter}&createdFrom=${fromDay}`)}
                    className="rounded-sm underline decoration-1 underline-offset-4 hover:decoration-2 focus-visible:outline-2 focus-visible:outline-signal-700"
                    aria-label={`${figure.label}: ${text}, show them`}
                  >
                    {text}
                  </Link>
                ) : (
                  text
                )}
              </dd>
            </div>
          );
        })}
      </dl>
      <p className="text-sm text-ink-700">
        {tally.total === 0
          ? 'No analyses in the last seven days.'
          : `${atLeast}${tally.total} analyses in the last seven days${rate === null ? '.' : `; ${rate.toFixed(rate === 100 ? 0 : 1)} % of the judged units passed their mask.`}`}
      </p>
    </div>
  );
}

/** Outcomes of the organisation's analyses over the last seven days, each count a link to those rows. */
export function WeekTallyCard({ canRead }: { canRead: boolean }) {
  const createdFrom = useMemo(() => tallyStart(), []);
  const query = useWeekTally(createdFrom, canRead);
  return (
    <Panel id="overview-week" title="Last seven days" description="Mask verdicts of the analyses created since this time last week.">
      {!canRead ? (
        <NotForRole>Your role does not read analyses.</NotForRole>
      ) : (
        <CardQuery query={query} loadingLabel="Counting this week’s analyses…">
          {(tally) => <Tally tally={tally} fromDay={createdFrom.slice(0, 10)} />}
        </CardQuery>
      )}
    </Panel>
  );
}
