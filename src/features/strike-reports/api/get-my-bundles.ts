import { queryOptions, useQuery } from '@tanstack/react-query';
import type { MyBundles } from '../../../../shared/schemas/strike-reports';
import { api } from '../../../lib/api-client';
import { strikeReportKeys } from './keys';

/** The signed-in person's collected bundles across seasons, newest first, with their reports. */
export function getMyBundles(signal?: AbortSignal) {
  return api.get<MyBundles>('/api/my/bundles', { signal });
}

export const myBundlesQueryOptions = () =>
  queryOptions({
    queryKey: strikeReportKeys.myBundles(),
    queryFn: ({ signal }) => getMyBundles(signal),
  });

export function useMyBundles() {
  return useQuery(myBundlesQueryOptions());
}
