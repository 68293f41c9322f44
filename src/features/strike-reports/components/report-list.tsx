import { useState } from 'react';
import type { StrikeReportPhotoView, StrikeReportView } from '../../../../shared/schemas/strike-reports';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { DeletePhotoDialog } from '../../../components/ui/delete-photo-dialog';
import { Dialog } from '../../../components/ui/dialog';
import { errorMessage } from '../../../lib/api-client';
import { formatDay } from '../../../lib/format';
import { useDeleteReportPhoto } from '../api/delete-report-photo';
import { useDeleteStrikeReport } from '../api/delete-strike-report';
import { rootedWords, treatmentWords } from '../lib/words';

/** What a screen reader says for a report's photo: its caption, or which report it shows. */
export const reportPhotoAlt = (photo: Pick<StrikeReportPhotoView, 'caption'>, report: Pick<StrikeReportView, 'assessedOn'>) =>
  photo.caption || `Photo of the strike report of ${formatDay(report.assessedOn)}`;

/** The photos of one report as thumbnails opening the full photo; the reporter may delete them. */
function ReportPhotos({ report }: { report: StrikeReportView }) {
  const remove = useDeleteReportPhoto();
  const [removing, setRemoving] = useState<StrikeReportPhotoView | null>(null);
  if (report.photos.length === 0) return null;
  return (
    <>
      <ul className="mt-2 flex flex-wrap gap-3" aria-label={`Photos of the strike report of ${formatDay(report.assessedOn)}`}>
        {report.photos.map((photo) => (
          <li key={photo.id} className="flex w-28 flex-col gap-1">
            <a href={photo.url} target="_blank" rel="noopener" className="block overflow-hidden rounded-lg border border-paper-edge bg-paper-deep">
              <img src={photo.thumbUrl} alt={reportPhotoAlt(photo, report)} loading="lazy" className="aspect-square w-full object-cover" />
            </a>
            {report.mine ? (
              <button
                type="button"
                className="min-h-touch self-start rounded px-2 text-sm font-medium text-rust underline underline-offset-2 hover:bg-rust-light"
                onClick={() => setRemoving(photo)}
                aria-label={`Delete the photo: ${reportPhotoAlt(photo, report)}`}
              >
                Delete photo
              </button>
            ) : null}
          </li>
        ))}
      </ul>
      <DeletePhotoDialog
        photo={removing}
        consequence="The photo is removed from the strike report for good; the report stays."
        busy={remove.isPending}
        error={remove.isError ? errorMessage(remove.error) : null}
        onClose={() => setRemoving(null)}
        onDelete={(photoId) => remove.mutateAsync(photoId)}
      />
    </>
  );
}

/** The reports filed on one bundle, with their photos, each with "Delete" for one filed by mistake. */
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
              <ReportPhotos report={r} />
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
              if it was filed by mistake; you can file a corrected one afterwards.{asking.photos.length ? ' Its photos are deleted with it.' : ''}
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
