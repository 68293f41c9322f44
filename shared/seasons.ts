// Season calendar and stage rules. Dates follow the hemisphere: a dormant-wood season in
// the north runs over midwinter, in the south over June and July.
import { addMonths, format } from 'date-fns';
import type { Hemisphere, SeasonKind, SeasonStage } from './domain.js';

/**
 * Typical windows, as month/day in the northern hemisphere (the south adds six months):
 * - dormant hardwood: after leaf fall, while dormant (published: Gardeners' World; OMAFRA
 *   Factsheet 98-095) — collect December to February, requests in by mid-November;
 * - late-summer leafy cuttings: mid-July to mid-September (from memory: RHS propagation
 *   guidance), requests by early July;
 * - scion wood: one-year wood cut while dormant, midwinter (published: K-State Horticulture
 *   Newsletter, "Collect Scion Wood Now") — January and February, requests by mid-December.
 */
const NORTH: Record<SeasonKind, { deadline: [number, number]; start: [number, number]; end: [number, number] }> = {
  dormant_hardwood: { deadline: [11, 15], start: [12, 1], end: [2, 28] },
  leafy_summer: { deadline: [7, 1], start: [7, 15], end: [9, 15] },
  scion: { deadline: [12, 15], start: [1, 5], end: [2, 28] },
};

export type SuggestedDates = { requestDeadline: string; collectionStart: string; collectionEnd: string; name: string };

const KIND_WORDS: Record<SeasonKind, string> = {
  dormant_hardwood: 'dormant hardwood',
  leafy_summer: 'leafy cuttings',
  scion: 'scion wood',
};

/** The next season of this kind whose request deadline is still ahead of `today`. */
export function suggestSeasonDates(kind: SeasonKind, hemisphere: Hemisphere, today: Date): SuggestedDates {
  const shift = hemisphere === 'south' ? 6 : 0;
  const w = NORTH[kind];
  for (let year = today.getUTCFullYear() - 1; year <= today.getUTCFullYear() + 2; year++) {
    const deadline = addMonths(new Date(Date.UTC(year, w.deadline[0] - 1, w.deadline[1], 23, 59)), shift);
    if (deadline <= today) continue;
    let start = addMonths(new Date(Date.UTC(year, w.start[0] - 1, w.start[1])), shift);
    if (start < deadline) start = addMonths(start, 12);
    let end = addMonths(new Date(Date.UTC(start.getUTCFullYear(), w.end[0] - 1, w.end[1])), shift);
    while (end < start) end = addMonths(end, 12);
    const y1 = start.getUTCFullYear();
    const y2 = end.getUTCFullYear();
    return {
      requestDeadline: deadline.toISOString(),
      collectionStart: format(start, 'yyyy-MM-dd'),
      collectionEnd: format(end, 'yyyy-MM-dd'),
      name: `${y1 === y2 ? y1 : `${y1}–${String(y2).slice(2)}`} ${KIND_WORDS[kind]}`,
    };
  }
  throw new Error('no season found');
}

/** Stages move forward one at a time; a coordinator may step back from allocating to reopen requests. */
export const STAGE_MOVES: Record<SeasonStage, SeasonStage[]> = {
  planning: ['requests_open'],
  requests_open: ['allocating', 'planning'],
  allocating: ['collections', 'requests_open'],
  collections: ['closed'],
  closed: [],
};

/** What each stage lets members change; the pages show these sentences. */
export const STAGE_RULES: Record<SeasonStage, { offers: boolean; windows: boolean; requests: boolean; text: string }> = {
  planning: { offers: true, windows: true, requests: false, text: 'Farms enter their wood offers and pickup windows. Requests open later.' },
  requests_open: {
    offers: true,
    windows: true,
    requests: true,
    text: 'Members file and change wood requests until the deadline. Farms can still adjust offers.',
  },
  allocating: { offers: false, windows: true, requests: false, text: 'The coordinator is matching wood to requests. Offers and requests are frozen.' },
  collections: { offers: false, windows: true, requests: false, text: 'Pickups are under way. Farms mark bundles collected.' },
  closed: { offers: false, windows: false, requests: false, text: 'The season is closed; its records stay for the figures and for tracing.' },
};

export function requestsOpen(stage: SeasonStage, requestDeadline: Date, now: Date): boolean {
  return STAGE_RULES[stage].requests && now < requestDeadline;
}
