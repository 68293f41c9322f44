// The planner's rules on the server: where the strike rate comes from, then the shared
// figures. The numbers are the same functions the planner page runs.
import type { Treatment } from '../../../shared/domain.js';
import { planFigures } from '../../../shared/planner.js';
import type { PlannerEstimate, PlannerEstimateInput, PlannerStrikeRate } from '../../../shared/schemas/planner.js';
import { strikeRateFor } from '../../../shared/strike-rate.js';
import type { DbOrTx } from '../../db/client.js';
import { badRequest } from '../../lib/http-error.js';
import { findSpeciesPrior, findVarietySpecies, strikeReportTotals } from './planner.repo.js';

/**
 * The strike rate for a species, variety and treatment: learned from the variety's reports
 * when there are any, else from the whole species' reports with that treatment, else the
 * species' reference rate for the treatment alone.
 */
export async function learnedStrikeRate(
  db: DbOrTx,
  q: { speciesId: string; varietyId: string | null; treatment: Treatment },
): Promise<PlannerStrikeRate> {
  const sp = await findSpeciesPrior(db, q.speciesId);
  if (!sp) throw badRequest('Choose a species from the list.', { speciesId: 'unknown species' });
  if (q.varietyId) {
    const of = await findVarietySpecies(db, q.varietyId);
    if (!of) throw badRequest('Choose a variety from the list.', { varietyId: 'unknown variety' });
    if (of !== q.speciesId) throw badRequest('That variety belongs to another species.', { varietyId: 'not a variety of this species' });
    const totals = await strikeReportTotals(db, q);
    if (totals.reports > 0) return { ...strikeRateFor(sp, q.treatment, totals), scope: 'variety', treatment: q.treatment };
  }
  const totals = await strikeReportTotals(db, { speciesId: q.speciesId, treatment: q.treatment });
  if (totals.reports > 0) return { ...strikeRateFor(sp, q.treatment, totals), scope: 'species', treatment: q.treatment };
  return { ...strikeRateFor(sp, q.treatment), scope: 'prior', treatment: q.treatment };
}

export async function estimatePlanting(db: DbOrTx, input: PlannerEstimateInput): Promise<PlannerEstimate> {
  const strikeRate: PlannerStrikeRate =
    'strikeRate' in input.rate
      ? { rate: input.rate.strikeRate, low: input.rate.strikeRate, high: input.rate.strikeRate, source: 'given', scope: 'given', reports: 0, stuck: 0, rooted: 0 }
      : await learnedStrikeRate(db, input.rate);
  const f = planFigures({
    layout: input.layout,
    cuttingsPerPosition: input.cuttingsPerPosition,
    strikeRate: strikeRate.rate,
    target: input.target,
  });
  return {
    positions: f.positions,
    cuttingsPerPosition: f.cuttingsPerPosition,
    cuttings: f.cuttings,
    fillProbability: f.fillProbability,
    expectedEmptyPositions: f.expectedEmptyPositions,
    strikeRate,
    ...(f.cuttingsForTarget !== undefined ? { cuttingsForTarget: f.cuttingsForTarget, targetChance: f.targetChance } : {}),
  };
}
