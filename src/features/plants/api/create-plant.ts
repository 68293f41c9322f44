import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PlantCreate, PlantDetail } from '../../../../shared/schemas/register';
import { api } from '../../../lib/api-client';
import { plantKeys } from './keys';

export function createPlant(input: PlantCreate) {
  return api.post<PlantDetail>('/api/mother-plants', input);
}

export function useCreatePlant() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createPlant,
    onSuccess: (plant) => {
      queryClient.setQueryData(plantKeys.detail(plant.id), plant);
      return queryClient.invalidateQueries({ queryKey: plantKeys.lists() });
    },
  });
}
