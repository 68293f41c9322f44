import type { MapFilters } from './types';

export const mapKeys = {
  all: ['map'] as const,
  features: () => [...mapKeys.all, 'features'] as const,
  featureList: (filters: MapFilters) => [...mapKeys.features(), filters] as const,
  tileMeta: () => [...mapKeys.all, 'tile-meta'] as const,
};
