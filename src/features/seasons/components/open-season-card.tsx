// The home page's season card. The home page is in the first load, so this file keeps to
// plain JavaScript dates and leaves the date library to the season pages.
import { Link } from 'react-router-dom';
import type { Me } from '../../../../shared/schemas/members';
import type { Season } from '../../../../shared/schemas/seasons';
import { paths } from '../../../app/paths';
import { ButtonLink } from '../../../components/ui/button';
import { StatusBadge } from '../../../components/ui/status-badge';
import { takesRequests } from '../lib/season-facts';

/** Home-page card for the season members act on now. */
export function OpenSeasonCard({ season, me }: { season: Season; me: Me }) {
  const open = takesRequests(season);
  const farm = me.farms[0];
  return (
    <section aria-labelledby="open-season-title" className="rounded-card border border-currant/40 bg-currant-light/50 p-5 sm:p-6">
      <div className="mb-2 flex flex-wrap items-start justify-between gap-2">
        <h2 id="open-season-title" className="text-lg font-semibold">
          {season.name}
        </h2>
        <StatusBadge status={season.stage} />
      </div>
      <p>{season.rules.text}</p>
      <p className="mt-1 text-ink-soft">
        {open ? `Requests close ${new Date(season.requestDeadline).toLocaleDateString('en-GB', { day: 'numeric', month: 'long', year: 'numeric' })}. ` : ''}
        {season.offerCount} {season.offerCount === 1 ? 'plant offers' : 'plants offer'} {season.cuttingsOffered.toLocaleString('en')} cuttings so far.
      </p>
      <div className="mt-4 flex flex-wrap gap-3">
        {open ? (
          <ButtonLink to={paths.seasonRequest(season.id)}>Request wood</ButtonLink>
        ) : null}
        {farm && season.rules.offers ? (
          <ButtonLink variant="secondary" to={paths.seasonOffers(season.id, farm.farmId)}>
            Offer wood
          </ButtonLink>
        ) : null}
        <Link to={paths.season(season.id)} className="inline-flex min-h-touch items-center px-2 font-semibold">
          About this season
        </Link>
      </div>
    </section>
  );
}
