import type { ReactNode } from 'react';
import { Link } from 'react-router';
import { ProblemAlert } from '@console/components/ui/alert';
import { Badge } from '@console/components/ui/badge';
import { paths } from '@console/config/paths';
import { ApiProblem, toProblemBody } from '@console/lib/api-problem';
import { formatDateTime } from '@console/utils/format-date';
import type { Analysis } from '@shared/schemas/analyses';
import { kindLabel } from '../utils/labels';
import { StatusBadge, VerdictBadge } from './status-badge';

function Item({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div className="space-y-0.5">
      <dt className="font-mono text-eyebrow font-semibold text-ink-500 uppercase">{label}</dt>
      <dd className="text-sm text-ink-900">{children}</dd>
    </div>
  );
}

/** What was measured, when, and how the job went. */
export function AnalysisSummary({ analysis }: { analysis: Analysis }) {
  return (
    <div className="space-y-4">
      <dl className="grid grid-cols-2 gap-4 rounded-lg border border-ink-200 bg-surface px-5 py-4 shadow-panel md:grid-cols-3 xl:grid-cols-6">
        <Item label="Kind">{kindLabel[analysis.kind]}</Item>
        <Item label="Status">
          <StatusBadge status={analysis.status} progress={analysis.progress} />
        </Item>
        <Item label="Verdict">
          <VerdictBadge verdict={analysis.verdict} />
        </Item>
        <Item label="Lot">{analysis.dut.lot ?? '—'}</Item>
        <Item label="Created">
          <time dateTime={analysis.createdAt}>{formatDateTime(analysis.createdAt)}</time>
        </Item>
        <Item label="Origin">
          {analysis.rerunOf ? (
            <Link className="font-mono text-xs underline" to={paths.app.analysis.getHref(analysis.rerunOf)}>
              re-run of {analysis.rerunOf}
            </Link>
          ) : (
            <span className="text-ink-600">first run</span>
          )}
        </Item>
      </dl>
      {analysis.tags.length > 0 && (
        <div className="flex flex-wrap gap-1.5" aria-label="Tags">
          {analysis.tags.map((tag) => (
            <Badge key={tag}>{tag}</Badge>
          ))}
        </div>
      )}
      {analysis.status === 'failed' && analysis.error && <ProblemAlert error={new ApiProblem(toProblemBody(422, 'Analysis failed', analysis.error))} />}
    </div>
  );
}
