import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { StrikeReportCreate, StrikeReportView } from '../../../../shared/schemas/strike-reports';
import { api } from '../../../lib/api-client';
import { strikeReportKeys } from './keys';

export function fileStrikeReport({ bundleId, input }: { bundleId: string; input: StrikeReportCreate }) {
  return api.post<StrikeReportView>(`/api/bundles/${encodeURIComponent(bundleId)}/strike-reports`, input);
}

/** Files a report; the bundle list and every strike rate change with it. */
export function useFileStrikeReport(onChanged?: () => void) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: fileStrikeReport,
    onSuccess: async () => {
      onChanged?.();
      await queryClient.invalidateQueries({ queryKey: strikeReportKeys.all });
    },
  });
}
