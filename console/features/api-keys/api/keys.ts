export const apiKeyKeys = {
  all: ['api-keys'] as const,
  lists: () => [...apiKeyKeys.all, 'list'] as const,
  list: (filters: { limit: number }) => [...apiKeyKeys.lists(), filters] as const,
};
