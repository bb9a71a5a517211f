import { Link } from 'react-router';
import { Badge } from '@console/components/ui/badge';
import { Panel } from '@console/components/ui/panel';
import { EmptyState } from '@console/components/ui/states';
import { paths } from '@console/config/paths';
import { formatRelativeTime } from '@console/utils/format-date';
import { useRecentAnalyses, type RecentAnalysis } from '../api/get-recent-analyses';
import { CardQuery, NotForRole } from './card-states';
import { kindWords, outcomeOf } from './outcome-words';

function Row({ analysis }: { analysis: RecentAnalysis }) {
  const outcome = outcomeOf(analysis);
  const device = [analysis.dut.model, analysis.dut.serial].filter(Boolean).join(' · ') || analysis.id;
  return (
    <li>
      <Link
        to={paths.app.analysis.getHref(analysis.id)}
        className="grid grid-cols-[minmax(0,1fr)_auto] items-center gap-x-3 px-5 py-2.5 hover:bg-ink-50 focus-visible:bg-ink-50 focus-visible:outline-2 focus-visible:-outline-offset-2 focus-visible:outline-signal-700"
      >
        <span className="min-w-0">
          <span className="block truncate text-sm font-semibold text-ink-900">{device}</span>
          <span className="block truncate text-xs text-ink-600">
            {kindWords(analysis.kind)}
            {analysis.dut.lot ? ` · ${analysis.dut.lot}` : ''} · <time dateTime={analysis.createdAt}>{formatRelativeTime(analysis.createdAt)}</time>
          </span>
        </span>
        <span className="flex items-center gap-2">
          {analysis.worstMarginDb !== null && (
            <span className="hidden font-mono text-xs text-ink-600 tabular sm:inline" title="Smallest margin to the mask limits">
              {analysis.worstMarginDb >= 0 ? '+' : '\u2212'}
              {Math.abs(analysis.worstMarginDb).toFixed(1)} dB
            </span>
          )}
          <Badge tone={outcome.tone}>{outcome.label}</Badge>
        </span>
      </Link>
    </li>
  );
}

/** The newest analyses of the organisation, each a link to its detail. */
export function RecentAnalysesCard({ canRead }: { canRead: boolean }) {
  const query = useRecentAnalyses(canRead);
  return (
    <Panel
      id="overview-recent"
      title="Latest analyses"
      description="Newest first; open one for its curves and figures."
      flush
      actions={
        canRead && (
          <Link to={paths.app.analyses.getHref()} className="text-sm font-semibold text-ink-700 underline underline-offset-2 hover:text-ink-900">
            Full history
          </Link>
        )
      }
    >
      {!canRead ? (
        <NotForRole>Your role does not read analyses.</NotForRole>
      ) : (
        <CardQuery query={query} loadingLabel="Loading the latest analyses…">
          {(page) =>
            page.data.length === 0 ? (
              <EmptyState title="No analyses yet">A rig posts a capture and asks for an analysis; it shows up here within seconds.</EmptyState>
            ) : (
              <ul className="divide-y divide-ink-100" aria-label="Latest analyses">
                {page.data.map((analysis) => (
                  <Row key={analysis.id} analysis={analysis} />
                ))}
              </ul>
            )
          }
        </CardQuery>
      )}
    </Panel>
  );
}
