import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Season, SeasonCreate } from '../../../../shared/schemas/seasons';
import { api } from '../../../lib/api-client';
import { seasonKeys } from './keys';

export function createSeason(input: SeasonCreate) {
  return api.post<Season>('/api/seasons', input);
}

export function useCreateSeason() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createSeason,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: seasonKeys.lists() }),
  });
}
