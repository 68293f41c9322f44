import { LABELS } from '../../../../shared/domain';
import type { WoodRequest } from '../../../../shared/schemas/seasons';
import { StatusBadge } from '../../../components/ui/status-badge';
import { formDateTimeSafe } from '../lib/words';
import { planText } from '../lib/request-lines';

/** The request as the server holds it: status, destination and the lines. */
export function RequestSummary({ request }: { request: WoodRequest }) {
  const total = request.lines.reduce((sum, l) => sum + l.cuttings, 0);
  // One caution per restriction, naming the species it concerns.
  const byNote = new Map<string, string[]>();
  for (const l of request.lines) {
    if (!l.restrictionNote) continue;
    const names = byNote.get(l.restrictionNote) ?? [];
    if (!names.includes(l.speciesName)) names.push(l.speciesName);
    byNote.set(l.restrictionNote, names);
  }
  const cautions = [...byNote.entries()];
  return (
    <section aria-labelledby="request-summary-title" className="flex flex-col gap-4 rounded-card border border-paper-edge bg-white/60 p-5 sm:p-6">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h2 id="request-summary-title" className="text-xl font-semibold">
          Your request as saved
        </h2>
        <StatusBadge status={request.status} />
      </div>
      <p className="text-ink-soft">
        Last changed {formDateTimeSafe(request.updatedAt)}. {total.toLocaleString('en')} cuttings in {request.lines.length} line{request.lines.length === 1 ? '' : 's'}, for{' '}
        {request.destinationLabel || `${request.destinationLat}, ${request.destinationLon}`}, from farms within {request.maxDistanceKm} km.
      </p>
      <ul aria-label="Lines of your request" className="flex flex-col divide-y divide-paper-edge rounded-lg border border-paper-edge bg-white/70">
        {request.lines.map((line, i) => {
          const plan = planText(line.plan);
          return (
            <li key={line.id} className="flex flex-col gap-1 px-4 py-3 sm:flex-row sm:items-start sm:justify-between sm:gap-6">
              <div>
                <p className="font-semibold">
                  <span className="sr-only">Line {i + 1}: </span>
                  {line.speciesName} · {line.varietyName ?? 'any variety'}
                </p>
                <p className="text-ink-soft">
                  {LABELS.treatment[line.treatment]} · substitutes {line.substitutesAllowed ? 'allowed' : 'not allowed'}
                </p>
                {plan ? <p className="text-sm text-ink-soft">{plan}</p> : null}
              </div>
              <p className="shrink-0 text-lg">
                <strong className="tabular-nums" data-testid="line-cuttings">
                  {line.cuttings.toLocaleString('en')}
                </strong>{' '}
                cuttings
              </p>
            </li>
          );
        })}
      </ul>
      {cautions.map(([note, names]) => (
        <div key={note} className="flex gap-2 rounded-lg border-l-4 border-amber bg-amber-light px-3 py-2 text-sm">
          <svg width="16" height="16" viewBox="0 0 20 20" aria-hidden="true" focusable="false" className="mt-0.5 shrink-0 text-amber">
            <polygon points="10,1.5 19,18 1,18" fill="currentColor" />
            <rect x="9" y="7" width="2" height="6" fill="white" />
            <rect x="9" y="14.5" width="2" height="2" fill="white" />
          </svg>
          <p>
            <span className="font-semibold">Caution ({names.join(', ')}): </span>
            {note}
          </p>
        </div>
      ))}
      {request.notes ? <p className="whitespace-pre-wrap text-ink-soft">Notes: {request.notes}</p> : null}
    </section>
  );
}
