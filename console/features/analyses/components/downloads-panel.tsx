import { useState } from 'react';
import { ProblemAlert } from '@console/components/ui/alert';
import { Button, buttonClasses } from '@console/components/ui/button';
import { Panel } from '@console/components/ui/panel';
import type { Analysis } from '@shared/schemas/analyses';
import { captureDownloadHref, getAnalysisExport, type ExportFormat } from '../api/get-analysis-export';
import { downloadText } from '../utils/bulk-export';

/** The stored capture as uploaded, and the result as JSON (verbatim) or CSV (curves as columns). */
export function DownloadsPanel({ analysis }: { analysis: Analysis }) {
  const [pending, setPending] = useState<ExportFormat | null>(null);
  const [error, setError] = useState<unknown>(null);
  const finished = analysis.status === 'succeeded';

  const download = async (format: ExportFormat) => {
    setPending(format);
    setError(null);
    try {
      const text = await getAnalysisExport(analysis.id, format);
      downloadText(`${analysis.id}.${format}`, text, format === 'csv' ? 'text/csv' : 'application/json');
    } catch (caught) {
      setError(caught);
    } finally {
      setPending(null);
    }
  };

  return (
    <Panel title="Downloads">
      <div className="flex flex-wrap gap-2">
        {analysis.captureId && (
          <a href={captureDownloadHref(analysis.captureId)} download className={buttonClasses('secondary', 'sm')}>
            Capture (WAV)
          </a>
        )}
        <Button size="sm" variant="secondary" disabled={!finished || pending !== null} isPending={pending === 'json'} onClick={() => download('json')}>
          Result (JSON)
        </Button>
        <Button size="sm" variant="secondary" disabled={!finished || pending !== null} isPending={pending === 'csv'} onClick={() => download('csv')}>
          Curves (CSV)
        </Button>
      </div>
      {error ? <ProblemAlert error={error} className="mt-3" /> : null}
    </Panel>
  );
}
