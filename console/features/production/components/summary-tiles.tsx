import type { ReactNode } from 'react';
import type { ProductionSummary } from '@shared/schemas/production';
import { cn } from '@console/utils/cn';

function Tile({ label, children, note, emphasis }: { label: string; children: ReactNode; note?: ReactNode; emphasis?: boolean }) {
  return (
    <div className={cn('space-y-0.5 rounded-md border border-ink-100 px-4 py-3', emphasis && 'border-ink-300 bg-ink-50')}>
      <dt className="font-mono text-eyebrow font-semibold text-ink-500 uppercase">{label}</dt>
      <dd className={cn('font-extrabold tracking-tight text-ink-900 tabular', emphasis ? 'text-3xl' : 'text-xl')}>{children}</dd>
      {note && <dd className="text-xs text-ink-600">{note}</dd>}
    </div>
  );
}

/** Yield first, then how the analyses split by verdict and by job status. */
export function SummaryTiles({ summary }: { summary: ProductionSummary }) {
  const { counts } = summary;
  return (
    <dl className="grid grid-cols-2 gap-3 sm:grid-cols-4 xl:grid-cols-[repeat(4,minmax(0,1fr))]">
      <Tile label="Yield" emphasis note="pass ÷ (pass + fail)">
        {summary.yieldPercent === null ? '—' : `${summary.yieldPercent.toFixed(1)} %`}
      </Tile>
      <Tile label="Pass" note="inside the mask">
        {counts.pass}
      </Tile>
      <Tile label="Fail" note="outside the mask somewhere">
        {counts.fail}
      </Tile>
      <Tile label="Units" note={`${counts.succeeded} succeeded analyses`}>
        {counts.serials}
      </Tile>
      <Tile label="Incomplete" note="curve did not cover the mask">
        {counts.incomplete}
      </Tile>
      <Tile label="No verdict" note="judged against no mask">
        {counts.withoutVerdict}
      </Tile>
      <Tile label="Analyses failed" note="no result; not a unit verdict">
        {counts.failed}
      </Tile>
      <Tile label="Queued or running" note={counts.canceled > 0 ? `${counts.canceled} canceled` : undefined}>
        {counts.pending}
      </Tile>
    </dl>
  );
}
