// Every route path in one place. Route definitions use the patterns; links use the
// helpers, so a renamed path changes here only.
import type { UserStatus } from '../../shared/domain';

function withQuery(path: string, query: Record<string, string | number | undefined>): string {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query)) {
    if (value === undefined || value === '') continue;
    params.set(key, String(value));
  }
  const qs = params.toString();
  return qs ? `${path}?${qs}` : path;
}

/** Only same-site paths may be a destination after sign-in (never another host). */
export function safeNext(next: string | null | undefined): string {
  if (!next || !next.startsWith('/') || next.startsWith('//') || next.startsWith('/\\')) return '/';
  return next;
}

export const patterns = {
  home: '/',
  signIn: '/sign-in',
  signUp: '/sign-up',
  applicationReceived: '/sign-up/received',
  forgotPassword: '/forgot-password',
  resetPassword: '/reset-password',
  members: '/members',
  mailbox: '/mailbox',
  plants: '/plants',
  plantNew: '/plants/new',
  plantImport: '/plants/import',
  plantLabels: '/plants/labels',
  plant: '/plants/:id',
  plantEdit: '/plants/:id/edit',
  plantTrace: '/plants/:id/trace',
  plantExposure: '/plants/:id/exposure',
  species: '/species',
  health: '/health',
  seasons: '/seasons',
  season: '/seasons/:seasonId',
  figures: '/figures',
  seasonFigures: '/figures/:seasonId',
  seasonOffers: '/seasons/:seasonId/offers',
  seasonRequest: '/seasons/:seasonId/request',
  seasonBoard: '/seasons/:seasonId/board',
  planner: '/planner',
  map: '/map',
  seasonRounds: '/seasons/:seasonId/rounds',
  round: '/rounds/:roundId',
  seasonPickups: '/seasons/:seasonId/pickups',
  seasonCollections: '/seasons/:seasonId/collections',
  bundleLabels: '/seasons/:seasonId/collections/labels',
  myBundles: '/my-bundles',
  strikeRates: '/strike-rates',
} as const;

/** A request line handed to the request page (from the planner), read back by that page. */
export type RequestLineSearch = {
  speciesId: string;
  varietyId?: string | null;
  treatment?: string;
  cuttings?: number;
  /** The plan as JSON, kept on the line. */
  plan?: string;
};

/** What the planner may start from: a hedgerow length (from the map) or a species. */
export type PlannerSearch = { lengthM?: number; speciesId?: string; varietyId?: string | null; treatment?: string };

/** The map's filters, kept in its address so a filtered map can be shared or bookmarked. */
export type MapSearch = { speciesId?: string; varietyId?: string; status?: string; farmId?: string };

/** The strike-rate table's filters, kept in its address. */
export type StrikeRatesSearch = { speciesId?: string; varietyId?: string | null; treatment?: string };

export type MembersSearch = { status?: UserStatus; q?: string; page?: number };

export const paths = {
  home: () => patterns.home,
  signIn: (next?: string) => withQuery(patterns.signIn, { next: next && next !== '/' ? next : undefined }),
  signUp: () => patterns.signUp,
  applicationReceived: () => patterns.applicationReceived,
  forgotPassword: () => patterns.forgotPassword,
  resetPassword: () => patterns.resetPassword,
  members: (search: MembersSearch = {}) =>
    withQuery(patterns.members, { status: search.status, q: search.q, page: search.page && search.page > 1 ? search.page : undefined }),
  mailbox: (page?: number) => withQuery(patterns.mailbox, { page: page && page > 1 ? page : undefined }),
  /** The plant list; `search` is the list's own query string (filters, sort, page). */
  plants: (search?: URLSearchParams | string) => withSearch(patterns.plants, search),
  plantNew: (farmId?: string) => withQuery(patterns.plantNew, { farmId }),
  plantImport: () => patterns.plantImport,
  /** Labels for the plants of a list query, or for chosen plants (`ids=a,b,c`). */
  plantLabels: (search?: URLSearchParams | string) => withSearch(patterns.plantLabels, search),
  plant: (id: string) => `/plants/${encodeURIComponent(id)}`,
  plantEdit: (id: string) => `/plants/${encodeURIComponent(id)}/edit`,
  /** A plant's ancestors and descendants, and the bundles between them. */
  plantTrace: (id: string) => `/plants/${encodeURIComponent(id)}/trace`,
  /** Coordinator: what may carry a finding that travels in wood, and the notice to its growers. */
  plantExposure: (id: string, findingId?: string) => withQuery(`/plants/${encodeURIComponent(id)}/exposure`, { findingId }),
  species: () => patterns.species,
  health: () => patterns.health,
  seasons: () => patterns.seasons,
  season: (seasonId: string) => `/seasons/${encodeURIComponent(seasonId)}`,
  /** A season's figures (the coordinator's: the cooperative's; a member's: their own). */
  seasonFigures: (seasonId: string) => `/figures/${encodeURIComponent(seasonId)}`,
  /** Opens the figures of the latest season that has any. */
  figures: () => patterns.figures,
  /** A farm's wood offers and pickup windows; `hash` 'pickup-windows' jumps to the windows. */
  seasonOffers: (seasonId: string, farmId?: string, hash?: 'pickup-windows') =>
    `${withQuery(`/seasons/${encodeURIComponent(seasonId)}/offers`, { farmId })}${hash ? `#${hash}` : ''}`,
  seasonRequest: (seasonId: string, line?: RequestLineSearch) =>
    withQuery(`/seasons/${encodeURIComponent(seasonId)}/request`, {
      speciesId: line?.speciesId,
      varietyId: line?.varietyId ?? undefined,
      treatment: line?.treatment,
      cuttings: line?.cuttings,
      plan: line?.plan,
    }),
  seasonBoard: (seasonId: string, from?: { lat: number; lon: number }) =>
    withQuery(`/seasons/${encodeURIComponent(seasonId)}/board`, { lat: from?.lat, lon: from?.lon }),
  planner: (search: PlannerSearch = {}) =>
    withQuery(patterns.planner, { lengthM: search.lengthM, speciesId: search.speciesId, varietyId: search.varietyId ?? undefined, treatment: search.treatment }),
  map: (search: MapSearch = {}) =>
    withQuery(patterns.map, { speciesId: search.speciesId, varietyId: search.varietyId, status: search.status, farmId: search.farmId }),
  /** A season's allocation rounds (coordinator): the list and "Run an allocation round". */
  seasonRounds: (seasonId: string) => `/seasons/${encodeURIComponent(seasonId)}/rounds`,
  /** One round's review page (progress while solving, then the proposal, then the e-mail log). */
  round: (roundId: string) => `/rounds/${encodeURIComponent(roundId)}`,
  /** The signed-in grower's pickup slip for a season (printable). */
  seasonPickups: (seasonId: string) => `/seasons/${encodeURIComponent(seasonId)}/pickups`,
  /** Who collects what at a farm; without farmId the page picks the person's farm. */
  seasonCollections: (seasonId: string, farmId?: string) => withQuery(`/seasons/${encodeURIComponent(seasonId)}/collections`, { farmId }),
  /** Printable bundle labels for one farm's approved bundles. */
  bundleLabels: (seasonId: string, farmId: string) => withQuery(`/seasons/${encodeURIComponent(seasonId)}/collections/labels`, { farmId }),
  /** The signed-in grower's collected bundles: strike reports and plants raised from them. */
  myBundles: () => patterns.myBundles,
  /** Strike-rate estimates by species, variety and treatment. */
  strikeRates: (search: StrikeRatesSearch = {}) =>
    withQuery(patterns.strikeRates, { speciesId: search.speciesId, varietyId: search.varietyId ?? undefined, treatment: search.treatment }),
};

function withSearch(path: string, search?: URLSearchParams | string): string {
  const qs = typeof search === 'string' ? search.replace(/^\?/, '') : (search?.toString() ?? '');
  return qs ? `${path}?${qs}` : path;
}
