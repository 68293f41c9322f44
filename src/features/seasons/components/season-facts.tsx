import type { Season } from '../../../../shared/schemas/seasons';
import { plural } from '../../../lib/format';
import { collectionWindow, deadlineText, kindLabel } from '../lib/season-dates';
import { takesRequests } from '../lib/season-facts';

/** Dates and totals of a season as a short description list. */
export function SeasonFacts({ season, compact = false }: { season: Season; compact?: boolean }) {
  const open = takesRequests(season);
  const rows: Array<[string, string]> = [
    ['Kind', kindLabel(season)],
    [open ? 'Requests close' : 'Request deadline', deadlineText(season)],
    ['Collection window', collectionWindow(season)],
    ['On offer', `${season.cuttingsOffered.toLocaleString('en')} cuttings from ${plural(season.offerCount, 'plant')}`],
    ['Asked for', `${season.cuttingsAsked.toLocaleString('en')} cuttings in ${plural(season.requestCount, 'filed request')}`],
  ];
  if (!compact) rows.push(['Health look-back', `plants inspected clean within ${plural(season.lookbackMonths, 'month')}`]);
  return (
    <dl className="grid gap-x-6 gap-y-2 sm:grid-cols-[auto_1fr]">
      {rows.map(([term, value]) => (
        <div key={term} className="contents">
          <dt className="font-medium text-ink-soft">{term}</dt>
          <dd className="mb-1 sm:mb-0">{value}</dd>
        </div>
      ))}
    </dl>
  );
}

/** What the stage lets members do, in the server's own sentence, with yes/no per part. */
export function StageRules({ season }: { season: Season }) {
  const { rules } = season;
  const open = takesRequests(season);
  const parts: Array<[string, boolean]> = [
    ['Farms change wood offers', rules.offers],
    ['Farm leads set pickup windows', rules.windows],
    ['Members file or change requests', open],
  ];
  return (
    <div>
      <p className="text-lg">{rules.text}</p>
      {rules.requests && !open ? <p className="mt-1 text-ink-soft">The request deadline has passed, so requests can no longer change.</p> : null}
      <ul className="mt-3 flex flex-col gap-1.5">
        {parts.map(([label, allowed]) => (
          <li key={label} className="flex items-center gap-2">
            {allowed ? (
              <svg width="16" height="16" viewBox="0 0 16 16" aria-hidden="true" focusable="false" className="shrink-0 text-leaf">
                <circle cx="8" cy="8" r="7" fill="currentColor" />
                <path d="M4.5 8.3l2.3 2.3 4.7-5" fill="none" stroke="white" strokeWidth="1.8" strokeLinecap="round" strokeLinejoin="round" />
              </svg>
            ) : (
              <svg width="16" height="16" viewBox="0 0 16 16" aria-hidden="true" focusable="false" className="shrink-0 text-ink-faint">
                <circle cx="8" cy="8" r="6.5" fill="none" stroke="currentColor" strokeWidth="1.6" />
                <path d="M5 8h6" stroke="currentColor" strokeWidth="1.8" strokeLinecap="round" />
              </svg>
            )}
            <span>
              {label}: <span className="font-semibold">{allowed ? 'yes' : 'not now'}</span>
            </span>
          </li>
        ))}
      </ul>
    </div>
  );
}
