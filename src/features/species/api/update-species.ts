import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Species, SpeciesInput } from '../../../../shared/schemas/register';
import { api } from '../../../lib/api-client';
import { speciesKeys } from './keys';

export function updateSpecies({ id, patch }: { id: string; patch: Partial<SpeciesInput> }) {
  return api.patch<Omit<Species, 'varieties'>>(`/api/species/${encodeURIComponent(id)}`, patch);
}

export function useUpdateSpecies() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateSpecies,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: speciesKeys.all }),
  });
}
