import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { mapKeys } from './keys';

/** Sets a plant's position through the register's own edit (same permissions). */
export function movePlant(input: { id: string; lat: number; lon: number }) {
  return api.patch<{ id: string; lat: number | null; lon: number | null }>(`/api/mother-plants/${encodeURIComponent(input.id)}`, {
    lat: input.lat,
    lon: input.lon,
  });
}

export function useMovePlant(onMoved?: (id: string) => void) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: movePlant,
    onSuccess: (plant) => {
      onMoved?.(plant.id);
      return queryClient.invalidateQueries({ queryKey: mapKeys.features() });
    },
  });
}
