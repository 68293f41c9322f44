import { paths } from '../../../app/paths';
import { ButtonLink } from '../../../components/ui/button';
import { plural } from '../../../lib/format';
import { useMyPickupsFor } from '../api/get-my-pickups';

/** Home-page card: a link to each pickup slip the person has in a season still under way. */
export function PickupsHomeCard({ seasons }: { seasons: { id: string; name: string }[] }) {
  const results = useMyPickupsFor(seasons.map((s) => s.id));
  const slips = seasons.flatMap((s, i) => {
    const slip = results[i]?.data?.slip;
    return slip ? [{ season: s, slip }] : [];
  });
  if (slips.length === 0) return null;
  return (
    <section aria-labelledby="home-pickups-title" className="rounded-card border border-leaf/40 bg-leaf-light/50 p-5 sm:p-6">
      <h2 id="home-pickups-title" className="mb-2 text-lg font-semibold">
        Wood to collect
      </h2>
      <ul className="flex flex-col gap-3">
        {slips.map(({ season, slip }) => {
          const bundles = slip.stops.reduce((n, s) => n + s.bundles.length, 0);
          return (
            <li key={season.id} className="flex flex-wrap items-center justify-between gap-3">
              <p>
                {season.name}: {plural(bundles, 'bundle')} at {plural(slip.stops.length, 'farm')}.
              </p>
              <ButtonLink to={paths.seasonPickups(season.id)}>My pickups</ButtonLink>
            </li>
          );
        })}
      </ul>
    </section>
  );
}
