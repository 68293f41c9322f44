import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { strikeReportKeys } from './keys';

export function deleteStrikeReport(reportId: string) {
  return api.delete(`/api/strike-reports/${encodeURIComponent(reportId)}`);
}

/** Removes a report filed by mistake (refused while plants raised from the bundle rest on it). */
export function useDeleteStrikeReport(onChanged?: () => void) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteStrikeReport,
    onSuccess: async () => {
      onChanged?.();
      await queryClient.invalidateQueries({ queryKey: strikeReportKeys.all });
    },
  });
}
