export const maskKeys = {
  all: ['masks'] as const,
  lists: () => [...maskKeys.all, 'list'] as const,
  list: (filters: { limit: number }) => [...maskKeys.lists(), filters] as const,
  details: () => [...maskKeys.all, 'detail'] as const,
  detail: (maskId: string) => [...maskKeys.details(), maskId] as const,
  versions: (maskId: string) => [...maskKeys.detail(maskId), 'versions'] as const,
  goldenCandidates: (filters: { model?: string; lot?: string }) => [...maskKeys.all, 'golden-candidates', filters] as const,
};
