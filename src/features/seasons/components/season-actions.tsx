import { Link } from 'react-router-dom';
import type { Me } from '../../../../shared/schemas/members';
import type { Season } from '../../../../shared/schemas/seasons';
import { paths } from '../../../app/paths';
import { takesRequests } from '../lib/season-facts';

type Action = { to: string; title: string; body: string };

/** Where to go from a season's page, for this person: the board, their request, their farm's offers. */
export function SeasonActions({ season, me }: { season: Season; me: Me }) {
  const open = takesRequests(season);
  const coordinator = me.user.role === 'coordinator';
  const actions: Action[] = [
    {
      to: paths.seasonBoard(season.id),
      title: 'Wood board',
      body: `What is on offer by species and variety, what is asked, and where wood is scarce (${season.cuttingsOffered.toLocaleString('en')} cuttings offered).`,
    },
    {
      to: paths.seasonRequest(season.id),
      title: 'My wood request',
      body: open ? 'Ask for cuttings by variety, or any variety of a species, from farms within your distance.' : 'See what you asked for this season.',
    },
  ];
  // After approval: pickups for growers, collections for farms, rounds for the coordinator.
  const afterApproval = season.stage === 'allocating' || season.stage === 'collections' || season.stage === 'closed';
  if (afterApproval) {
    actions.push({
      to: paths.seasonPickups(season.id),
      title: 'My pickups',
      body: 'Your pickup slip: which farms to visit, when, in which order, and which bundles to collect.',
    });
  }
  actions.push({
    to: paths.seasonFigures(season.id),
    title: 'Season figures',
    body: coordinator
      ? 'Wood offered, asked, allocated and collected; fill, travel, strike rates and the value of plants raised; charts and CSV.'
      : 'Your own figures for this season: your farms’ wood and your requests, with charts and a CSV.',
  });
  if (coordinator) {
    actions.push({
      to: paths.seasonRounds(season.id),
      title: 'Allocation rounds',
      body: season.stage === 'allocating' ? 'Run a round, review and edit it, approve it and send the pickup slips.' : 'Rounds run while the season is allocating; earlier rounds are listed here.',
    });
  }
  for (const farm of me.farms) {
    if (afterApproval) {
      actions.push({
        to: paths.seasonCollections(season.id, farm.farmId),
        title: `Collections at ${farm.farmName}`,
        body: 'Who comes when, which bundles from which plants; mark them collected and print bundle labels.',
      });
    }
    actions.push({
      to: paths.seasonOffers(season.id, farm.farmId),
      title: `Wood offers of ${farm.farmName}`,
      body: season.rules.offers ? 'Shoot counts or direct counts per plant, with the estimate and the cap for each.' : 'The offers as they stand; they cannot change at this stage.',
    });
    if (farm.farmRole === 'lead') {
      actions.push({
        to: paths.seasonOffers(season.id, farm.farmId, 'pickup-windows'),
        title: `Pickup windows at ${farm.farmName}`,
        body: 'When growers can collect, in the farm’s own time.',
      });
    }
  }
  if (coordinator && me.farms.length === 0) {
    actions.push({
      to: paths.seasonOffers(season.id),
      title: 'Farm offers and pickup windows',
      body: 'Any farm’s offers and windows, for a coordinator helping a farm.',
    });
  }
  return (
    <ul className="grid gap-4 sm:grid-cols-2">
      {actions.map((a) => (
        <li key={a.to}>
          <Link
            to={a.to}
            className="flex h-full min-h-touch flex-col gap-1 rounded-card border-2 border-paper-edge bg-white/60 p-4 text-ink no-underline hover:border-leaf"
          >
            <span className="text-lg font-semibold text-currant underline decoration-1 underline-offset-2">{a.title}</span>
            <span className="text-ink-soft">{a.body}</span>
          </Link>
        </li>
      ))}
    </ul>
  );
}
