import { describe, expect, it } from 'vitest';
import type { SeasonStage } from '../../../../shared/domain';
import type { Season } from '../../../../shared/schemas/seasons';
import { STAGE_MOVES, STAGE_RULES } from '../../../../shared/seasons';
import { currentSeason, nextMoves, seasonsTakingRequests, takesRequests } from '../lib/season-facts';

function season(id: string, stage: SeasonStage, requestDeadline: string): Season {
  return {
    id,
    name: id,
    kind: 'dormant_hardwood',
    hemisphere: 'north',
    stage,
    requestDeadline,
    collectionStart: '2027-01-05',
    collectionEnd: '2027-02-23',
    lookbackMonths: 12,
    notes: '',
    offerCount: 0,
    cuttingsOffered: 0,
    requestCount: 0,
    cuttingsAsked: 0,
    rules: STAGE_RULES[stage],
  };
}

const now = new Date('2026-12-01T12:00:00Z');

describe('season facts', () => {
  it('offers exactly the stage moves of shared/seasons.ts, each with what the new stage allows', () => {
    for (const stage of Object.keys(STAGE_MOVES) as SeasonStage[]) {
      const moves = nextMoves(stage);
      expect(moves.map((m) => m.to)).toEqual(STAGE_MOVES[stage]);
      for (const m of moves) expect(m.allows).toBe(STAGE_RULES[m.to].text);
    }
    expect(nextMoves('requests_open').find((m) => m.to === 'planning')?.backwards).toBe(true);
  });

  it('takes requests only while the stage allows and the deadline is ahead', () => {
    expect(takesRequests(season('a', 'requests_open', '2026-12-22T18:00:00Z'), now)).toBe(true);
    expect(takesRequests(season('b', 'requests_open', '2026-11-22T18:00:00Z'), now)).toBe(false);
    expect(takesRequests(season('c', 'planning', '2026-12-22T18:00:00Z'), now)).toBe(false);
  });

  it('picks the season to act on: taking requests first, never a closed one', () => {
    const list = [season('closed', 'closed', '2025-10-31T18:00:00Z'), season('plan', 'planning', '2027-06-01T00:00:00Z'), season('open', 'requests_open', '2026-12-22T18:00:00Z')];
    expect(currentSeason(list, now)?.id).toBe('open');
    expect(currentSeason([list[0], list[1]], now)?.id).toBe('plan');
    expect(currentSeason([list[0]], now)).toBeNull();
    expect(seasonsTakingRequests(list, now).map((s) => s.id)).toEqual(['open']);
  });
});
