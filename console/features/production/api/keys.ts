import type { ProductionQuery } from '../utils/production-filter';

export const productionKeys = {
  all: ['production'] as const,
  lots: () => [...productionKeys.all, 'lots'] as const,
  summary: (query: ProductionQuery) => [...productionKeys.all, 'summary', query] as const,
  units: (query: ProductionQuery) => [...productionKeys.all, 'units', query] as const,
};
