import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import type { districtNoteSchema } from '../../../../shared/schemas/health';
import { api } from '../../../lib/api-client';
import { healthKeys } from './keys';

export type DistrictNoteInput = z.input<typeof districtNoteSchema>;

/** Any active member may note what they saw in the district; the coordinator reads them. */
export function addDistrictNote(input: DistrictNoteInput) {
  return api.post<{ id: string }>('/api/health/notes', input);
}

export function useAddDistrictNote() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: addDistrictNote,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: healthKeys.all }),
  });
}
