// The strike rate the planner uses: a reference rate for the species and treatment, learned
// from growers' strike reports.
//
// Treatment model (documented choice). A species stores its untreated reference rate
// (species.strikeRatePrior). Treatments multiply the odds of rooting, p / (1 - p), by a fixed
// factor each, and the factors of willow soak and hormone multiply when both are used. The
// odds scale keeps every rate inside (0, 1) without an arbitrary ceiling, moves a middling
// rate by about as many points as the trade quotes and an already high one by fewer.
// Calibration, CHECK-VALUES.md (common practice, no published percentage): a Ribes hardwood
// reference of 0.70 becomes 0.78 with a willow soak (trade: about 70-80 %) and 0.875 with
// hormone on top (trade: about +10 points, to about 90 %). Willow water's effect is real but
// modest (published: Kawase), so its factor is the smaller one.
//
// Estimate. Beta prior with mean = the treated reference rate and weight = the species'
// prior strength in cuttings (a = rate x strength, b = (1 - rate) x strength), updated by
// the reports' rooted and failed cuttings. Rate = posterior mean; interval = 5 % and 95 %
// quantiles of the posterior Beta (90 % equal-tailed), from @stdlib's beta quantile.
import betaQuantile from '@stdlib/stats-base-dists-beta-quantile';
import type { Treatment } from './domain.js';

/** Odds multipliers per treatment, calibrated as described above. */
export const TREATMENT_ODDS_RATIO: Readonly<Record<Treatment, number>> = Object.freeze({
  none: 1,
  willow: 1.5,
  hormone: 2,
  both: 1.5 * 2,
});

/** Share of the posterior in the interval. */
export const INTERVAL_MASS = 0.9;

function checkRate(name: string, rate: number): void {
  if (!Number.isFinite(rate) || rate <= 0 || rate >= 1) throw new RangeError(`${name} must be strictly between 0 and 1 (got ${rate})`);
}

/** The reference rate for a treatment, from the species' untreated reference. */
export function priorRate(speciesPrior: number, treatment: Treatment): number {
  checkRate('speciesPrior', speciesPrior);
  const odds = (speciesPrior / (1 - speciesPrior)) * TREATMENT_ODDS_RATIO[treatment];
  return odds / (1 + odds);
}

export type StrikeReportCounts = { stuck: number; rooted: number };
export type ReportTotals = { reports: number; stuck: number; rooted: number };

/** Adds up strike reports, checking each one: rooted is a whole number from 0 to stuck. */
export function sumReports(list: readonly StrikeReportCounts[]): ReportTotals {
  const totals: ReportTotals = { reports: 0, stuck: 0, rooted: 0 };
  for (const r of list) {
    if (!Number.isSafeInteger(r.stuck) || !Number.isSafeInteger(r.rooted) || r.stuck <= 0 || r.rooted < 0 || r.rooted > r.stuck) {
      throw new RangeError(`a report needs 0 <= rooted <= stuck and stuck > 0 (got rooted ${r.rooted} of ${r.stuck})`);
    }
    totals.reports += 1;
    totals.stuck += r.stuck;
    totals.rooted += r.rooted;
  }
  return totals;
}

export type StrikeRateEstimate = {
  /** Posterior mean, 0..1. */
  rate: number;
  /** Lower and upper ends of the 90 % equal-tailed interval. */
  low: number;
  high: number;
  source: 'prior' | 'reports';
  /** Number of reports, and the cuttings they cover. */
  reports: number;
  stuck: number;
  rooted: number;
};

/**
 * Beta-binomial estimate of a strike rate.
 * @param prior reference rate (already adjusted for treatment) and its weight in cuttings
 * @param totals summed reports (see sumReports); none means the prior alone
 */
export function estimateStrikeRate(
  prior: { rate: number; strength: number },
  totals: ReportTotals = { reports: 0, stuck: 0, rooted: 0 },
): StrikeRateEstimate {
  checkRate('prior rate', prior.rate);
  if (!Number.isFinite(prior.strength) || prior.strength <= 0) throw new RangeError(`prior strength must be more than 0 (got ${prior.strength})`);
  const { reports, stuck, rooted } = totals;
  if (![reports, stuck, rooted].every((x) => Number.isSafeInteger(x) && x >= 0) || rooted > stuck || (reports === 0) !== (stuck === 0)) {
    throw new RangeError(`report totals must be whole numbers with rooted <= stuck (got ${JSON.stringify(totals)})`);
  }
  const a = prior.rate * prior.strength + rooted;
  const b = (1 - prior.rate) * prior.strength + (stuck - rooted);
  const tail = (1 - INTERVAL_MASS) / 2;
  return {
    rate: a / (a + b),
    low: betaQuantile(tail, a, b),
    high: betaQuantile(1 - tail, a, b),
    source: reports > 0 ? 'reports' : 'prior',
    reports,
    stuck,
    rooted,
  };
}

/** The estimate for a species and treatment, from its untreated reference, strength and reports. */
export function strikeRateFor(
  species: { strikeRatePrior: number; priorStrength: number },
  treatment: Treatment,
  totals?: ReportTotals,
): StrikeRateEstimate {
  return estimateStrikeRate({ rate: priorRate(species.strikeRatePrior, treatment), strength: species.priorStrength }, totals);
}
