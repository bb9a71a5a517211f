import { Badge, type BadgeTone } from '@console/components/ui/badge';
import { Spinner } from '@console/components/ui/spinner';
import type { AnalysisStatus } from '@shared/schemas/analyses';
import type { Verdict } from '../utils/filters';
import { statusLabel, verdictLabel } from '../utils/labels';

const statusTone: Record<AnalysisStatus, BadgeTone> = { queued: 'neutral', running: 'accent', succeeded: 'ok', failed: 'danger', canceled: 'neutral' };
const verdictTone: Record<Verdict, BadgeTone> = { pass: 'ok', fail: 'danger', incomplete: 'warning' };
const verdictMark: Record<Verdict, string> = { pass: '✓', fail: '✕', incomplete: '◐' };

export function StatusBadge({ status, progress }: { status: AnalysisStatus; progress?: number }) {
  const running = status === 'running' || status === 'queued';
  return (
    <Badge tone={statusTone[status]}>
      {running && <Spinner className="size-3" />}
      {statusLabel[status]}
      {status === 'running' && progress !== undefined && progress > 0 && <span className="tabular">{Math.round(progress * 100)} %</span>}
    </Badge>
  );
}

export function VerdictBadge({ verdict }: { verdict: Verdict | null }) {
  if (!verdict) return <span className="text-xs text-ink-500">No mask</span>;
  return (
    <Badge tone={verdictTone[verdict]}>
      <span aria-hidden="true">{verdictMark[verdict]}</span>
      {verdictLabel[verdict]}
    </Badge>
  );
}
