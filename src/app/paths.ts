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
  species: '/species',
  health: '/health',
} as const;

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
  species: () => patterns.species,
  health: () => patterns.health,
};

function withSearch(path: string, search?: URLSearchParams | string): string {
  const qs = typeof search === 'string' ? search.replace(/^\?/, '') : (search?.toString() ?? '');
  return qs ? `${path}?${qs}` : path;
}
