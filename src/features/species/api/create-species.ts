import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Species, SpeciesInput } from '../../../../shared/schemas/register';
import { api } from '../../../lib/api-client';
import { speciesKeys } from './keys';

export function createSpecies(input: SpeciesInput) {
  return api.post<Omit<Species, 'varieties'>>('/api/species', input);
}

export function useCreateSpecies() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createSpecies,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: speciesKeys.all }),
  });
}
