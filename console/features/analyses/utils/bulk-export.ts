import type { ExportFormat } from '../api/get-analysis-export';

export interface ExportedAnalysis {
  analysisId: string;
  text: string;
}

/**
 * One file for a selection. JSON: `{ analyses: [{ id, result }] }` with each stored result verbatim. CSV: the
 * exports one after another, each opened by a `# analysis: <id>` comment line and separated by a blank line, so
 * a reader that skips `#` lines (as the single export already needs) can split them again.
 */
export function combineExports(format: ExportFormat, exports: readonly ExportedAnalysis[], exportedAt: Date): string {
  if (format === 'json') {
    return JSON.stringify({ exportedAt: exportedAt.toISOString(), analyses: exports.map((item) => ({ id: item.analysisId, result: JSON.parse(item.text) as unknown })) }, null, 2);
  }
  return exports.map((item) => `# analysis: ${item.analysisId}\n${item.text.replace(/\s+$/, '')}\n`).join('\n');
}

export function exportFileName(format: ExportFormat, count: number, exportedAt: Date): string {
  const stamp = exportedAt.toISOString().slice(0, 19).replace(/[:T]/g, '-');
  return `sweepline-${count === 1 ? 'analysis' : `${count}-analyses`}-${stamp}.${format}`;
}

/** Hands text to the browser as a downloaded file. */
export function downloadText(fileName: string, text: string, mimeType: string): void {
  const url = URL.createObjectURL(new Blob([text], { type: mimeType }));
  const link = document.createElement('a');
  link.href = url;
  link.download = fileName;
  link.click();
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}
