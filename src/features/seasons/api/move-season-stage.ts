import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SeasonStage } from '../../../../shared/domain';
import type { Season } from '../../../../shared/schemas/seasons';
import { api } from '../../../lib/api-client';
import { seasonKeys } from './keys';

export function moveSeasonStage({ seasonId, stage }: { seasonId: string; stage: SeasonStage }) {
  return api.post<Season>(`/api/seasons/${encodeURIComponent(seasonId)}/stage`, { stage });
}

export function useMoveSeasonStage() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: moveSeasonStage,
    onSuccess: (season) => {
      queryClient.setQueryData(seasonKeys.detail(season.id), season);
      // The stage decides what every other page of the season allows, so all of it refreshes.
      return queryClient.invalidateQueries({ queryKey: seasonKeys.all });
    },
  });
}
