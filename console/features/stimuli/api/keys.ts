export const stimulusKeys = {
  all: ['stimuli'] as const,
  lists: () => [...stimulusKeys.all, 'list'] as const,
  list: (filters: { limit: number }) => [...stimulusKeys.lists(), filters] as const,
};
