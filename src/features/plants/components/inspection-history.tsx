import { useState } from 'react';
import { Link } from 'react-router-dom';
import type { InspectionView } from '../../../../shared/schemas/register';
import { Button } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { StatusBadge } from '../../../components/ui/status-badge';
import { formatDay } from '../../../lib/format';
import { StaysOutOfWoodNote, TravelsInWoodMark } from './wood-mark';
import { SEVERITY_LABELS } from './words';

/** The latest few are what a grower looks at; older years open on request. */
export const INSPECTIONS_SHOWN = 5;

export function InspectionHistory({
  inspections,
  canInspect,
  exposureHref,
}: {
  inspections: InspectionView[];
  canInspect: boolean;
  /** Coordinator: where a finding that travels in wood leads (what may carry it, and the notice). */
  exposureHref?: (findingId: string) => string;
}) {
  const [all, setAll] = useState(false);
  if (inspections.length === 0) {
    return (
      <EmptyState title="No inspections recorded yet">
        {canInspect
          ? 'Record the first inspection above. Wood is only offered from plants that are clean and inspected within the look-back.'
          : 'The farm records inspections here.'}
      </EmptyState>
    );
  }
  const shown = all ? inspections : inspections.slice(0, INSPECTIONS_SHOWN);
  return (
    <div className="flex flex-col gap-3">
      <ol className="flex flex-col gap-3">
        {shown.map((inspection) => (
          <li key={inspection.id} className="rounded-lg border border-paper-edge bg-white/70 p-4">
            <div className="flex flex-wrap items-baseline justify-between gap-2">
              <p className="font-semibold">
                <time dateTime={inspection.inspectedOn}>{formatDay(inspection.inspectedOn)}</time>
                {inspection.inspectorName ? <span className="font-normal text-ink-soft"> · by {inspection.inspectorName}</span> : null}
              </p>
              {inspection.statusAfter ? <StatusBadge status={inspection.statusAfter} /> : null}
            </div>
            {inspection.findings.length === 0 ? (
              <p className="mt-1 text-ink-soft">No findings.</p>
            ) : (
              <ul className="mt-2 flex flex-col gap-2">
                {inspection.findings.map((finding) => (
                  <li key={finding.id} className="flex flex-col gap-1 border-l-4 border-paper-edge pl-3">
                    <p className="flex flex-wrap items-center gap-x-2 gap-y-1">
                      <span className="font-medium">{finding.pestName}</span>
                      <span className="text-sm text-ink-soft">{SEVERITY_LABELS[finding.severity]}</span>
                      {finding.travelsInWood ? <TravelsInWoodMark /> : <StaysOutOfWoodNote />}
                    </p>
                    {finding.notes ? <p className="text-ink-soft">{finding.notes}</p> : null}
                    {finding.travelsInWood && exposureHref ? (
                      <p>
                        <Link to={exposureHref(finding.id)}>Where its wood went, and notices</Link>
                      </p>
                    ) : null}
                  </li>
                ))}
              </ul>
            )}
            {inspection.notes ? <p className="mt-2 whitespace-pre-wrap">{inspection.notes}</p> : null}
          </li>
        ))}
      </ol>
      {inspections.length > INSPECTIONS_SHOWN ? (
        <div>
          <Button variant="secondary" size="sm" onClick={() => setAll((v) => !v)}>
            {all ? `Show the latest ${INSPECTIONS_SHOWN}` : `Show all ${inspections.length} inspections`}
          </Button>
        </div>
      ) : null}
    </div>
  );
}
