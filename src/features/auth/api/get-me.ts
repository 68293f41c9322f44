import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Me } from '../../../../shared/schemas/members';
import { api, ApiError } from '../../../lib/api-client';
import { meKeys } from './keys';

/** The signed-in person, or null when nobody is (the server answers 401). */
export async function getMe(signal?: AbortSignal): Promise<Me | null> {
  try {
    return await api.get<Me>('/api/me', { signal });
  } catch (error) {
    if (error instanceof ApiError && error.status === 401) return null;
    throw error;
  }
}

export const meQueryOptions = () =>
  queryOptions({
    queryKey: meKeys.all,
    queryFn: ({ signal }) => getMe(signal),
    staleTime: 60_000,
  });

export function useMe() {
  return useQuery(meQueryOptions());
}
