import betaQuantile from '@stdlib/stats-base-dists-beta-quantile';
import { describe, expect, it } from 'vitest';
import { TREATMENTS } from '../domain.js';
import { estimateStrikeRate, priorRate, strikeRateFor, sumReports, TREATMENT_ODDS_RATIO } from '../strike-rate.js';

describe('the beta quantile the estimate uses (@stdlib/stats-base-dists-beta-quantile)', () => {
  it('matches the published BETAINV example', () => {
    // published: spreadsheet BETAINV / BETA.DIST documentation — inverse CDF 0.75 of
    // Beta(9, 12) on [2, 4] = 3.0011968805340232; on [0, 1] the value is (x - 2) / 2.
    const x01 = betaQuantile(0.75, 9, 12);
    expect(2 + 2 * x01).toBeCloseTo(3.0011968805340232, 13);
    expect(x01).toBeCloseTo((3.0011968805340232 - 2) / 2, 13);
  });

  it('inverts the published BETA.DIST example', () => {
    // published: spreadsheet BETAINV / BETA.DIST documentation — CDF at 2 of Beta(8, 10) on
    // [1, 3] = 0.6854705810546875, i.e. CDF(0.5) on [0, 1]; so its quantile at that
    // probability is 0.5 on [0, 1], 2 on [1, 3].
    const x01 = betaQuantile(0.6854705810546875, 8, 10);
    expect(x01).toBeCloseTo(0.5, 12);
    expect(1 + 2 * x01).toBeCloseTo(2, 12);
  });

  it('gives the closed form p^(1/a) for Beta(a, 1)', () => {
    // published: the closed form is textbook (CHECK-VALUES.md): CDF of Beta(a, 1) is x^a.
    for (const a of [1, 2, 3.5, 9, 40]) {
      for (const p of [0.05, 0.5, 0.95]) expect(betaQuantile(p, a, 1)).toBeCloseTo(p ** (1 / a), 12);
    }
  });
});

describe('priorRate: treatments on the untreated reference', () => {
  const ribes = 0.7; // Ribes hardwood untreated reference, as the species list holds it.

  it('leaves the untreated reference as it is', () => {
    expect(priorRate(ribes, 'none')).toBeCloseTo(ribes, 15);
  });

  it('puts Ribes hardwood with a willow soak at about 70-80 %', () => {
    // common practice: CHECK-VALUES.md, "Strike rate, Ribes hardwood, soaked in willow water: about 70-80 %".
    const willow = priorRate(ribes, 'willow');
    expect(willow).toBeGreaterThanOrEqual(0.7);
    expect(willow).toBeLessThanOrEqual(0.8);
  });

  it('adds about 10 points with rooting hormone, to about 90 %', () => {
    // common practice: CHECK-VALUES.md, "Rooting hormone on top of that: about +10 points, to about 90 %".
    const willow = priorRate(ribes, 'willow');
    const both = priorRate(ribes, 'both');
    expect(both - willow).toBeGreaterThanOrEqual(0.05);
    expect(both - willow).toBeLessThanOrEqual(0.15);
    expect(both).toBeGreaterThanOrEqual(0.85);
    expect(both).toBeLessThanOrEqual(0.95);
    // Hormone alone on the untreated reference: also about +10 points.
    const hormone = priorRate(ribes, 'hormone');
    expect(hormone - ribes).toBeGreaterThanOrEqual(0.05);
    expect(hormone - ribes).toBeLessThanOrEqual(0.15);
  });

  it('orders the treatments and keeps every rate inside (0, 1)', () => {
    for (const ref of [0.05, 0.4, 0.7, 0.85, 0.99]) {
      const rates = TREATMENTS.map((t) => priorRate(ref, t));
      expect(rates[0]).toBeLessThan(rates[1]);
      expect(rates[1]).toBeLessThan(rates[2]);
      expect(rates[2]).toBeLessThan(rates[3]);
      for (const r of rates) {
        expect(r).toBeGreaterThan(0);
        expect(r).toBeLessThan(1);
      }
    }
    // The model multiplies odds: odds(both) = odds(none) x willow factor x hormone factor.
    const odds = (p: number) => p / (1 - p);
    expect(odds(priorRate(0.7, 'both'))).toBeCloseTo(odds(0.7) * TREATMENT_ODDS_RATIO.willow * TREATMENT_ODDS_RATIO.hormone, 12);
  });

  it('refuses a reference of 0 or 1', () => {
    expect(() => priorRate(0, 'none')).toThrow(RangeError);
    expect(() => priorRate(1, 'willow')).toThrow(RangeError);
  });
});

describe('estimateStrikeRate', () => {
  it('with no reports is the prior: mean = reference, source prior', () => {
    const e = estimateStrikeRate({ rate: 0.7, strength: 20 });
    expect(e).toMatchObject({ source: 'prior', reports: 0, stuck: 0, rooted: 0 });
    expect(e.rate).toBeCloseTo(0.7, 15);
    // Beta(14, 6): the 90 % interval is its 5 % and 95 % quantiles.
    expect(e.low).toBeCloseTo(betaQuantile(0.05, 14, 6), 15);
    expect(e.high).toBeCloseTo(betaQuantile(0.95, 14, 6), 15);
    expect(e.low).toBeLessThan(e.rate);
    expect(e.high).toBeGreaterThan(e.rate);
  });

  it('updates by reports: posterior mean worked by hand', () => {
    // Prior 0.7 with strength 20: a = 14, b = 6. Reports: 60 stuck, 50 rooted.
    // Posterior Beta(64, 16): mean 64 / 80 = 0.8.
    const totals = sumReports([
      { stuck: 20, rooted: 15 },
      { stuck: 40, rooted: 35 },
    ]);
    expect(totals).toEqual({ reports: 2, stuck: 60, rooted: 50 });
    const e = estimateStrikeRate({ rate: 0.7, strength: 20 }, totals);
    expect(e).toMatchObject({ source: 'reports', reports: 2, stuck: 60, rooted: 50 });
    expect(e.rate).toBeCloseTo(0.8, 14);
    expect(e.low).toBeCloseTo(betaQuantile(0.05, 64, 16), 12);
    expect(e.high).toBeCloseTo(betaQuantile(0.95, 64, 16), 12);
  });

  it('gives the closed-form interval when the posterior is Beta(a, 1)', () => {
    // Prior 0.5 with strength 2 is Beta(1, 1); 5 stuck and 5 rooted make Beta(6, 1), whose
    // quantile is p^(1/6) (textbook closed form, CHECK-VALUES.md).
    const e = estimateStrikeRate({ rate: 0.5, strength: 2 }, { reports: 1, stuck: 5, rooted: 5 });
    expect(e.rate).toBeCloseTo(6 / 7, 14);
    expect(e.low).toBeCloseTo(0.05 ** (1 / 6), 12);
    expect(e.high).toBeCloseTo(0.95 ** (1 / 6), 12);
  });

  it('narrows as reports come in', () => {
    const few = estimateStrikeRate({ rate: 0.7, strength: 20 }, { reports: 1, stuck: 20, rooted: 16 });
    const many = estimateStrikeRate({ rate: 0.7, strength: 20 }, { reports: 10, stuck: 200, rooted: 160 });
    expect(many.high - many.low).toBeLessThan(few.high - few.low);
    // Many reports pull the estimate towards their own rate, 0.8.
    expect(Math.abs(many.rate - 0.8)).toBeLessThan(Math.abs(few.rate - 0.8));
  });

  it('starts a species from its treated reference', () => {
    const e = strikeRateFor({ strikeRatePrior: 0.7, priorStrength: 20 }, 'willow');
    expect(e.rate).toBeCloseTo(priorRate(0.7, 'willow'), 15);
    expect(e.source).toBe('prior');
  });

  it('refuses impossible reports and priors', () => {
    expect(() => sumReports([{ stuck: 10, rooted: 11 }])).toThrow(RangeError);
    expect(() => sumReports([{ stuck: 0, rooted: 0 }])).toThrow(RangeError);
    expect(() => sumReports([{ stuck: 10, rooted: -1 }])).toThrow(RangeError);
    expect(() => estimateStrikeRate({ rate: 0.7, strength: 0 })).toThrow(RangeError);
    expect(() => estimateStrikeRate({ rate: 1, strength: 20 })).toThrow(RangeError);
    expect(() => estimateStrikeRate({ rate: 0.7, strength: 20 }, { reports: 1, stuck: 5, rooted: 6 })).toThrow(RangeError);
  });
});
