import type { BadgeTone } from '@console/components/ui/badge';
import type { RecentAnalysis } from '../api/get-recent-analyses';

/** One word for where an analysis stands: its verdict once finished with a mask, else its status. */
export function outcomeOf(analysis: Pick<RecentAnalysis, 'status' | 'verdict'>): { label: string; tone: BadgeTone } {
  if (analysis.status === 'queued') return { label: 'Queued', tone: 'neutral' };
  if (analysis.status === 'running') return { label: 'Running', tone: 'accent' };
  if (analysis.status === 'failed') return { label: 'Failed to run', tone: 'danger' };
  if (analysis.status === 'canceled') return { label: 'Canceled', tone: 'neutral' };
  if (analysis.verdict === 'pass') return { label: 'Pass', tone: 'ok' };
  if (analysis.verdict === 'fail') return { label: 'Fail', tone: 'danger' };
  if (analysis.verdict === 'incomplete') return { label: 'Incomplete', tone: 'warning' };
  return { label: 'Finished', tone: 'neutral' };
}

const KIND_WORDS: Record<string, string> = {
  frequency_response: 'Frequency response',
  distortion: 'Distortion',
  response_and_distortion: 'Response and distortion',
};

export function kindWords(kind: string): string {
  const words = KIND_WORDS[kind] ?? kind.replace(/_/g, ' ');
  return words.charAt(0).toUpperCase() + words.slice(1);
}
