import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { FarmRole } from '../../../../shared/domain';
import { api } from '../../../lib/api-client';
import { memberKeys } from './keys';

export type FarmMembershipInput = { farmId: string; userId: string; farmRole: FarmRole };

/** Adds a member to a farm, or changes their role there (the server treats both the same). */
export function setFarmMembership({ farmId, userId, farmRole }: FarmMembershipInput) {
  return api.put<unknown>(`/api/farms/${encodeURIComponent(farmId)}/members/${encodeURIComponent(userId)}`, { farmRole });
}

export function useSetFarmMembership() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: setFarmMembership,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: memberKeys.lists() }),
  });
}
