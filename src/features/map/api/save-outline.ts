import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { mapKeys } from './keys';
import type { OutlineCollection } from './types';

/** Replaces a farm's outline, beds and rows (its farm lead, or a coordinator). */
export function saveOutline(input: { farmId: string; outline: OutlineCollection }) {
  return api.put<{ farmId: string; outline: OutlineCollection | null }>(`/api/farms/${encodeURIComponent(input.farmId)}/outline`, input.outline);
}

export function useSaveOutline() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: saveOutline,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: mapKeys.features() }),
  });
}
