import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Variety } from '../../../../shared/schemas/register';
import { api } from '../../../lib/api-client';
import { speciesKeys } from './keys';

export function updateVariety({ id, patch }: { id: string; patch: { name?: string; description?: string | null } }) {
  return api.patch<Variety>(`/api/species/varieties/${encodeURIComponent(id)}`, patch);
}

export function useUpdateVariety() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateVariety,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: speciesKeys.all }),
  });
}
