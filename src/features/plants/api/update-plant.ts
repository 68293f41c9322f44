import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PlantDetail, PlantUpdate } from '../../../../shared/schemas/register';
import { api } from '../../../lib/api-client';
import { plantKeys } from './keys';

/** Edit fields, set the position, or (coordinator) move the plant to another farm with a reason. */
export function updatePlant({ id, patch }: { id: string; patch: PlantUpdate }) {
  return api.patch<PlantDetail>(`/api/mother-plants/${encodeURIComponent(id)}`, patch);
}

export function useUpdatePlant() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updatePlant,
    onSuccess: (plant) => {
      queryClient.setQueryData(plantKeys.detail(plant.id), plant);
      return queryClient.invalidateQueries({ queryKey: plantKeys.lists() });
    },
  });
}
