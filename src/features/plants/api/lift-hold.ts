import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PlantDetail } from '../../../../shared/schemas/register';
import { api } from '../../../lib/api-client';
import { plantKeys } from './keys';

export type LiftHoldInput = { id: string; to: 'clean' | 'watch'; reason: string };

/** Coordinator only: the one way a plant leaves hold. */
export function liftHold({ id, to, reason }: LiftHoldInput) {
  return api.post<PlantDetail>(`/api/mother-plants/${encodeURIComponent(id)}/lift-hold`, { to, reason });
}

export function useLiftHold() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: liftHold,
    onSuccess: (plant) => {
      queryClient.setQueryData(plantKeys.detail(plant.id), plant);
      return queryClient.invalidateQueries({ queryKey: plantKeys.lists() });
    },
  });
}
