export const usageKeys = {
  all: ['usage'] as const,
  summary: () => [...usageKeys.all, 'summary'] as const,
  daily: () => [...usageKeys.all, 'daily'] as const,
};
