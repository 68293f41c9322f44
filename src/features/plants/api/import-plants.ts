import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PlantCsvReport } from '../../../../shared/schemas/plants-csv';
import { plantKeys } from './keys';
import { jsonOrThrow, sendWithProgress, type Progress } from './send-with-progress';

export type ImportInput = { csv: string; dryRun: boolean; onProgress?: (progress: Progress) => void };

/**
 * Sends the file's text. A file with problems comes back as 400 with the full report; that
 * is an answer to show row by row, not a failure, so it resolves with the report.
 */
export async function importPlants({ csv, dryRun, onProgress }: ImportInput): Promise<PlantCsvReport> {
  const response = await sendWithProgress(`/api/mother-plants/import?dryRun=${dryRun}`, {
    body: csv,
    headers: { 'Content-Type': 'text/csv' },
    onProgress,
  });
  if (response.status === 400) {
    try {
      const body = JSON.parse(response.text) as { report?: PlantCsvReport };
      if (body.report) return body.report;
    } catch {
      // Not a report: fall through to the usual error.
    }
  }
  return jsonOrThrow<PlantCsvReport>(response);
}

export function useImportPlants() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: importPlants,
    onSuccess: (report) => {
      if (!report.dryRun && report.created > 0) return queryClient.invalidateQueries({ queryKey: plantKeys.all });
    },
  });
}
