export const calibrationKeys = {
  all: ['calibrations'] as const,
  lists: () => [...calibrationKeys.all, 'list'] as const,
  list: (filters: { limit: number }) => [...calibrationKeys.lists(), filters] as const,
};
