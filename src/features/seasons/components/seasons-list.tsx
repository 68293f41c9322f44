import { Link } from 'react-router-dom';
import type { Season } from '../../../../shared/schemas/seasons';
import { paths } from '../../../app/paths';
import { EmptyState } from '../../../components/ui/empty-state';
import { StatusBadge } from '../../../components/ui/status-badge';
import { TableShell, td, th } from '../../../components/ui/table-shell';
import { formatDay } from '../../../lib/format';
import { SeasonFacts } from './season-facts';

function CurrentSeason({ season }: { season: Season }) {
  return (
    <li className="flex flex-col gap-3 rounded-card border border-paper-edge bg-white/60 p-5">
      <div className="flex flex-wrap items-start justify-between gap-2">
        <h3 className="text-xl font-semibold">
          <Link to={paths.season(season.id)}>{season.name}</Link>
        </h3>
        <StatusBadge status={season.stage} />
      </div>
      <p>{season.rules.text}</p>
      <SeasonFacts season={season} compact />
    </li>
  );
}

/** Seasons under way as cards; closed ones in a compact table below. */
export function SeasonsList({ seasons, isCoordinator }: { seasons: Season[]; isCoordinator: boolean }) {
  if (seasons.length === 0) {
    return (
      <EmptyState title="No seasons yet">
        {isCoordinator
          ? 'Open the first season with the button above: choose its kind and Heelwood suggests the dates for your hemisphere.'
          : 'A coordinator opens each cutting season. When one opens, it appears here and on your home page.'}
      </EmptyState>
    );
  }
  const current = seasons.filter((s) => s.stage !== 'closed');
  const past = seasons.filter((s) => s.stage === 'closed');
  return (
    <div className="flex flex-col gap-8">
      <section aria-labelledby="seasons-current-title">
        <h2 id="seasons-current-title" className="mb-3 text-xl font-semibold">
          Under way
        </h2>
        {current.length ? (
          <ul className="grid gap-4 lg:grid-cols-2">
            {current.map((season) => (
              <CurrentSeason key={season.id} season={season} />
            ))}
          </ul>
        ) : (
          <p className="text-ink-soft">
            No season is under way.{' '}
            {isCoordinator ? 'Open the next one with the button above.' : 'The coordinator opens the next one; it will appear here.'}
          </p>
        )}
      </section>
      {past.length ? (
        <section aria-labelledby="seasons-past-title">
          <h2 id="seasons-past-title" className="mb-3 text-xl font-semibold">
            Past seasons
          </h2>
          <TableShell caption="Past seasons and their figures" tableClassName="min-w-[40rem]">
            <thead>
              <tr>
                <th scope="col" className={th}>
                  Season
                </th>
                <th scope="col" className={th}>
                  Collections
                </th>
                <th scope="col" className={`${th} text-right`}>
                  Cuttings offered
                </th>
                <th scope="col" className={`${th} text-right`}>
                  Cuttings asked
                </th>
                <th scope="col" className={th}>
                  Stage
                </th>
              </tr>
            </thead>
            <tbody>
              {past.map((s) => (
                <tr key={s.id}>
                  <td className={td}>
                    <Link to={paths.season(s.id)} className="font-semibold">
                      {s.name}
                    </Link>
                  </td>
                  <td className={td}>
                    {formatDay(s.collectionStart)} to {formatDay(s.collectionEnd)}
                  </td>
                  <td className={`${td} text-right tabular-nums`}>{s.cuttingsOffered.toLocaleString('en')}</td>
                  <td className={`${td} text-right tabular-nums`}>{s.cuttingsAsked.toLocaleString('en')}</td>
                  <td className={td}>
                    <StatusBadge status={s.stage} />
                  </td>
                </tr>
              ))}
            </tbody>
          </TableShell>
        </section>
      ) : null}
    </div>
  );
}
