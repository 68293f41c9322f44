import type { UserStatus } from '../../../../shared/domain';

export type MemberListFilters = { status?: UserStatus; q?: string; page: number; pageSize: number };

export const memberKeys = {
  all: ['members'] as const,
  lists: () => [...memberKeys.all, 'list'] as const,
  list: (filters: MemberListFilters) => [...memberKeys.lists(), filters] as const,
  details: () => [...memberKeys.all, 'detail'] as const,
  detail: (id: string) => [...memberKeys.details(), id] as const,
};
