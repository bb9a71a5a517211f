export const webhookKeys = {
  all: ['webhooks'] as const,
  lists: () => [...webhookKeys.all, 'list'] as const,
  list: (filters: { limit: number }) => [...webhookKeys.lists(), filters] as const,
  details: () => [...webhookKeys.all, 'detail'] as const,
  detail: (endpointId: string) => [...webhookKeys.details(), endpointId] as const,
  deliveries: (endpointId: string) => [...webhookKeys.detail(endpointId), 'deliveries'] as const,
};
