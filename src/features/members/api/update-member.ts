import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Member, MemberPatch } from '../../../../shared/schemas/members';
import { api } from '../../../lib/api-client';
import { memberKeys } from './keys';

/** Admit (status active), suspend, reinstate, or change the cooperative role. */
export function updateMember(input: { id: string; patch: MemberPatch }) {
  return api.patch<Member>(`/api/members/${encodeURIComponent(input.id)}`, input.patch);
}

export function useUpdateMember() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateMember,
    // Every list may change (a member moves between status tabs), so the whole list level goes.
    onSuccess: (_member, { id }) =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: memberKeys.lists() }),
        queryClient.invalidateQueries({ queryKey: memberKeys.detail(id) }),
      ]),
  });
}
