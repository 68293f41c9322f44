import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { BundleStatus } from '../../../../shared/domain';
import type { FarmCollection } from '../../../../shared/schemas/allocation';
import { api } from '../../../lib/api-client';
import { collectionKeys } from './keys';

export type CollectionMark = { bundleId: string; collected: boolean; seasonId: string; farmId: string };

export function markCollection({ bundleId, collected }: CollectionMark) {
  return api.post<{ id: string; status: BundleStatus }>(`/api/bundles/${encodeURIComponent(bundleId)}/collection`, { collected });
}

export function useMarkCollection() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: markCollection,
    onSuccess: (bundle, { seasonId, farmId }) => {
      // Show the new status at once, then read the list again from the server.
      const key = collectionKeys.list(seasonId, farmId);
      queryClient.setQueryData<{ items: FarmCollection[]; total: number }>(key, (old) =>
        old ? { ...old, items: old.items.map((b) => (b.bundleId === bundle.id ? { ...b, status: bundle.status } : b)) } : old,
      );
      return queryClient.invalidateQueries({ queryKey: key });
    },
  });
}
