/** The overview's own query keys: its requests are smaller than the full screens' (few rows, one period). */
export const overviewKeys = {
  all: ['overview'] as const,
  recentAnalyses: (limit: number) => [...overviewKeys.all, 'recent-analyses', limit] as const,
  weekTally: (fromIso: string) => [...overviewKeys.all, 'week-tally', fromIso] as const,
  calibrations: () => [...overviewKeys.all, 'calibrations'] as const,
  usage: () => [...overviewKeys.all, 'usage'] as const,
};
