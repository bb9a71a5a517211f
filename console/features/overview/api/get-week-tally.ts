import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import type { Page } from '@shared/schemas/pagination';
import { PAGE_LIMIT_MAX } from '@shared/schemas/pagination';
import { tallyAnalyses, type AnalysisTally, type TalliedAnalysis } from '../utils/week-tally';
import { overviewKeys } from './keys';

/** Pages read at most for the tally; past this the counts say "at least". */
export const TALLY_MAX_PAGES = 5;

/** Start of the rolling seven days, to the minute (so the query key stays the same while the page is open). */
export function tallyStart(now: Date = new Date()): string {
  const start = new Date(now.getTime() - 7 * 24 * 3600 * 1000);
  start.setUTCSeconds(0, 0);
  return start.toISOString();
}

async function getWeekTally(createdFrom: string): Promise<AnalysisTally> {
  const rows: TalliedAnalysis[] = [];
  let cursor: string | undefined;
  for (let page = 0; page < TALLY_MAX_PAGES; page++) {
    const answer = await apiClient.get<Page<TalliedAnalysis>>('/analyses', { query: { createdFrom, limit: PAGE_LIMIT_MAX, cursor } });
    rows.push(...answer.data);
    if (!answer.hasMore || !answer.nextCursor) return tallyAnalyses(rows, false);
    cursor = answer.nextCursor;
  }
  return tallyAnalyses(rows, true);
}

export const getWeekTallyQueryOptions = (createdFrom: string) =>
  queryOptions({ queryKey: overviewKeys.weekTally(createdFrom), queryFn: () => getWeekTally(createdFrom), staleTime: 60_000 });

export const useWeekTally = (createdFrom: string, enabled: boolean) => useQuery({ ...getWeekTallyQueryOptions(createdFrom), enabled });
