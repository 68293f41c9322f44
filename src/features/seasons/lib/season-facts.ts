// Plain facts about a season for the pages: is it taking requests now, which season is the
// one to act on, what the next stages are. The rules themselves come from shared/seasons.ts.
// No date formatting here: the home page imports this file, and the date library stays out
// of its first load (see season-dates.ts).
import { LABELS, type SeasonStage } from '../../../../shared/domain';
import type { Season } from '../../../../shared/schemas/seasons';
import { requestsOpen, STAGE_MOVES, STAGE_RULES } from '../../../../shared/seasons';

export function takesRequests(season: Season, now = new Date()): boolean {
  return requestsOpen(season.stage, new Date(season.requestDeadline), now);
}

/**
 * The season members act on now: one taking requests first, else one in planning (farms
 * offering), else one in allocation or collections. Closed seasons never.
 */
export function currentSeason(seasons: Season[], now = new Date()): Season | null {
  const order: SeasonStage[] = ['requests_open', 'planning', 'allocating', 'collections'];
  const live = seasons.filter((s) => s.stage !== 'closed');
  live.sort((a, b) => {
    const rank = (s: Season) => (s.stage === 'requests_open' && !takesRequests(s, now) ? 0.5 : order.indexOf(s.stage));
    return rank(a) - rank(b) || a.requestDeadline.localeCompare(b.requestDeadline);
  });
  return live[0] ?? null;
}

/** Seasons a grower can file a request in now, soonest deadline first. */
export function seasonsTakingRequests(seasons: Season[], now = new Date()): Season[] {
  return seasons.filter((s) => takesRequests(s, now)).sort((a, b) => a.requestDeadline.localeCompare(b.requestDeadline));
}

/** The words on a stage button, and what the new stage lets people do. */
const MOVE_WORDS: Partial<Record<`${SeasonStage}>${SeasonStage}`, string>> = {
  'planning>requests_open': 'Open requests',
  'requests_open>planning': 'Back to planning',
  'requests_open>allocating': 'Close requests and start allocating',
  'allocating>requests_open': 'Reopen requests',
  'allocating>collections': 'Start collections',
  'collections>closed': 'Close the season',
};

export type StageMove = { to: SeasonStage; label: string; allows: string; backwards: boolean };

export function nextMoves(stage: SeasonStage): StageMove[] {
  const order = ['planning', 'requests_open', 'allocating', 'collections', 'closed'];
  return STAGE_MOVES[stage].map((to) => ({
    to,
    label: MOVE_WORDS[`${stage}>${to}`] ?? `Move to ${LABELS.seasonStage[to]}`,
    allows: STAGE_RULES[to].text,
    backwards: order.indexOf(to) < order.indexOf(stage),
  }));
}
