import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Variety } from '../../../../shared/schemas/register';
import { api } from '../../../lib/api-client';
import { speciesKeys } from './keys';

export type VarietyInput = { speciesId: string; name: string; description?: string | null };

export function createVariety(input: VarietyInput) {
  return api.post<Variety>('/api/species/varieties', input);
}

export function useCreateVariety() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createVariety,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: speciesKeys.all }),
  });
}
