import { useState, type ReactNode } from 'react';
import { ProblemAlert } from '@console/components/ui/alert';
import { Button } from '@console/components/ui/button';
import { getAnalysisExport, type ExportFormat } from '../api/get-analysis-export';
import { combineExports, downloadText, exportFileName } from '../utils/bulk-export';

const PARALLEL_REQUESTS = 4;

async function fetchAll(analysisIds: readonly string[], format: ExportFormat) {
  const texts: string[] = new Array(analysisIds.length);
  let next = 0;
  const worker = async () => {
    while (next < analysisIds.length) {
      const index = next++;
      texts[index] = await getAnalysisExport(analysisIds[index], format);
    }
  };
  await Promise.all(Array.from({ length: Math.min(PARALLEL_REQUESTS, analysisIds.length) }, worker));
  return analysisIds.map((analysisId, i) => ({ analysisId, text: texts[i] }));
}

type BulkExportBarProps = { selectedIds: string[]; onClear: () => void; children?: ReactNode };

/** What can be done with the selected rows: export them as one file, or compare them (passed in by the page). */
export function BulkExportBar({ selectedIds, onClear, children }: BulkExportBarProps) {
  const [pending, setPending] = useState<ExportFormat | null>(null);
  const [error, setError] = useState<unknown>(null);

  const exportSelection = async (format: ExportFormat) => {
    setPending(format);
    setError(null);
    try {
      const now = new Date();
      const combined = combineExports(format, await fetchAll(selectedIds, format), now);
      downloadText(exportFileName(format, selectedIds.length, now), combined, format === 'csv' ? 'text/csv' : 'application/json');
    } catch (caught) {
      setError(caught);
    } finally {
      setPending(null);
    }
  };

  if (selectedIds.length === 0) return null;
  return (
    <div className="space-y-3 border-b border-ink-100 bg-signal-50/50 px-5 py-3" role="region" aria-label="Selected analyses">
      <div className="flex flex-wrap items-center gap-2">
        <span className="mr-2 text-sm font-semibold text-ink-800 tabular">{selectedIds.length} selected</span>
        <Button size="sm" variant="secondary" isPending={pending === 'csv'} disabled={pending !== null} onClick={() => exportSelection('csv')}>
          Export CSV
        </Button>
        <Button size="sm" variant="secondary" isPending={pending === 'json'} disabled={pending !== null} onClick={() => exportSelection('json')}>
          Export JSON
        </Button>
        {children}
        <Button size="sm" variant="ghost" onClick={onClear}>
          Clear selection
        </Button>
      </div>
      {error ? <ProblemAlert error={error} /> : null}
    </div>
  );
}
