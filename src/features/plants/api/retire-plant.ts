import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PlantDetail } from '../../../../shared/schemas/register';
import { api } from '../../../lib/api-client';
import { plantKeys } from './keys';

export function retirePlant({ id, reason }: { id: string; reason: string }) {
  return api.post<PlantDetail>(`/api/mother-plants/${encodeURIComponent(id)}/retire`, { reason });
}

export function useRetirePlant() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: retirePlant,
    onSuccess: (plant) => {
      queryClient.setQueryData(plantKeys.detail(plant.id), plant);
      return queryClient.invalidateQueries({ queryKey: plantKeys.lists() });
    },
  });
}
