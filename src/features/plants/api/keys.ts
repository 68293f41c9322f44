import type { HealthStatus, PlantRole } from '../../../../shared/domain';
import type { PlantSort } from '../../../../shared/schemas/register';

/** What the plant list asks the server for; every field is also a URL search parameter. */
export type PlantListParams = {
  q?: string;
  farmId?: string;
  speciesId?: string;
  varietyId?: string;
  status?: HealthStatus[];
  role?: PlantRole;
  yearFrom?: number;
  yearTo?: number;
  inspected?: 'never' | 'stale' | 'recent';
  mine?: boolean;
  sort: PlantSort;
  dir: 'asc' | 'desc';
  page: number;
  pageSize: number;
};

export const plantKeys = {
  all: ['plants'] as const,
  lists: () => [...plantKeys.all, 'list'] as const,
  list: (params: PlantListParams) => [...plantKeys.lists(), params] as const,
  details: () => [...plantKeys.all, 'detail'] as const,
  detail: (id: string) => [...plantKeys.details(), id] as const,
};

/** The pest and disease catalogue changes rarely; one entry for all of it. */
export const pestKeys = {
  all: ['pests'] as const,
};
