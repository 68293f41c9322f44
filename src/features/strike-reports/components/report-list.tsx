import { useState } from 'react';
import type { StrikeReportView } from '../../../../shared/schemas/strike-reports';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { errorMessage } from '../../../lib/api-client';
import { formatDay } from '../../../lib/format';
import { useDeleteStrikeReport } from '../api/delete-strike-report';
import { rootedWords, treatmentWords } from '../lib/words';

/** The reports filed on one bundle, each with "Delete" for one filed by mistake. */
export function ReportList({ reports, bundleCode, onChanged }: { reports: StrikeReportView[]; bundleCode: string | null; onChanged?: () => void }) {
  const remove = useDeleteStrikeReport(onChanged);
  const [asking, setAsking] = useState<StrikeReportView | null>(null);

  if (reports.length === 0) return <p className="text-ink-soft">No strike report on this bundle yet.</p>;

  const confirm = async () => {
    if (!asking) return;
    try {
      await remove.mutateAsync(asking.id);
      setAsking(null);
    } catch {
      setAsking(null);
    }
  };

  return (
    <>
      {remove.isError ? (
        <Alert tone="danger" title="The report was not deleted" className="mb-3">
          {errorMessage(remove.error)}
        </Alert>
      ) : null}
      <ul className="flex flex-col gap-2" aria-label={`Strike reports on bundle ${bundleCode ?? ''}`.trim()}>
        {reports.map((r) => (
          <li key={r.id} className="flex flex-wrap items-start justify-between gap-3 rounded-lg border border-paper-edge bg-white px-3 py-2" data-testid="strike-report">
            <div className="min-w-0">
              <p>
                <span className="font-semibold tabular-nums">{rootedWords(r.rooted, r.stuck)}</span>
                <span className="text-ink-soft"> · {treatmentWords(r.treatment)}</span>
              </p>
              <p className="text-sm text-ink-soft">
                Counted on <time dateTime={r.assessedOn}>{formatDay(r.assessedOn)}</time>
                {r.reporterName ? ` · reported by ${r.reporterName}` : ''}
              </p>
              {r.notes ? <p className="mt-1 whitespace-pre-wrap text-sm">{r.notes}</p> : null}
            </div>
            <Button variant="danger" size="sm" onClick={() => setAsking(r)} aria-label={`Delete the report of ${formatDay(r.assessedOn)}: ${rootedWords(r.rooted, r.stuck)}`}>
              Delete
            </Button>
          </li>
        ))}
      </ul>
      <Dialog open={asking !== null} onClose={() => setAsking(null)} title="Delete this strike report?">
        {asking ? (
          <div className="flex flex-col gap-4">
            <p>
              {rootedWords(asking.rooted, asking.stuck)}, counted on {formatDay(asking.assessedOn)}. The strike rates go back to what they were without it. Delete it only
              if it was filed by mistake; you can file a corrected one afterwards.
            </p>
            <div className="flex flex-wrap gap-2">
              <Button variant="danger" onClick={confirm} busy={remove.isPending}>
                Yes, delete the report
              </Button>
              <Button variant="secondary" onClick={() => setAsking(null)}>
                Keep it
              </Button>
            </div>
          </div>
        ) : null}
      </Dialog>
    </>
  );
}
