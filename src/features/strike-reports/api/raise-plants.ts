import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { RaisedPlant, RaisePlantsInput } from '../../../../shared/schemas/strike-reports';
import { api } from '../../../lib/api-client';
import { strikeReportKeys } from './keys';

export function raisePlants({ bundleId, input }: { bundleId: string; input: RaisePlantsInput }) {
  return api.post<{ items: RaisedPlant[]; total: number }>(`/api/bundles/${encodeURIComponent(bundleId)}/raise-plants`, input);
}

/** Registers rooted cuttings of a bundle as new mother plants. */
export function useRaisePlants(onChanged?: () => void) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: raisePlants,
    onSuccess: async () => {
      onChanged?.();
      await queryClient.invalidateQueries({ queryKey: strikeReportKeys.myBundles() });
    },
  });
}
