import { buildApiUrl } from '@console/lib/api-client';
import { ApiProblem, networkProblem, toProblemBody } from '@console/lib/api-problem';

export type ExportFormat = 'csv' | 'json';

/**
 * The export of one analysis as text (JSON: the stored result verbatim; CSV: curves as columns after `#` lines
 * stating the conventions). Not a query: exports are fetched on demand and handed to the browser as a file.
 */
export async function getAnalysisExport(analysisId: string, format: ExportFormat): Promise<string> {
  let response: Response;
  try {
    response = await fetch(buildApiUrl(`/analyses/${encodeURIComponent(analysisId)}/export`, { format }), {
      credentials: 'same-origin',
      headers: { Accept: format === 'csv' ? 'text/csv, application/problem+json' : 'application/json, application/problem+json' },
    });
  } catch {
    throw networkProblem();
  }
  const text = await response.text();
  if (!response.ok) {
    let body: unknown;
    try {
      body = JSON.parse(text);
    } catch {
      body = undefined;
    }
    throw new ApiProblem(toProblemBody(response.status, response.statusText, body));
  }
  return text;
}

/** Where the stored capture can be downloaded (the session cookie authorises the plain link). */
export const captureDownloadHref = (captureId: string) => buildApiUrl(`/captures/${encodeURIComponent(captureId)}/download`);
