import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { Page } from '../../../../shared/schemas/common';
import type { Member } from '../../../../shared/schemas/members';
import { api } from '../../../lib/api-client';
import { memberKeys, type MemberListFilters } from './keys';

export function getMembers(filters: MemberListFilters, signal?: AbortSignal) {
  return api.get<Page<Member>>('/api/members', { query: filters, signal });
}

export const membersQueryOptions = (filters: MemberListFilters) =>
  queryOptions({
    queryKey: memberKeys.list(filters),
    queryFn: ({ signal }) => getMembers(filters, signal),
    // Keep the current page on screen while the next one loads, so the table does not jump.
    placeholderData: keepPreviousData,
  });

export function useMembers(filters: MemberListFilters) {
  return useQuery(membersQueryOptions(filters));
}

/** How many applications wait for a coordinator: one row asked for, the total read. */
export function usePendingMemberCount() {
  return useQuery({
    ...membersQueryOptions({ status: 'pending', page: 1, pageSize: 1 }),
    select: (page) => page.total,
  });
}
