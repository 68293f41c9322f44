import binomialCdf from '@stdlib/stats-base-dists-binomial-cdf';
import binomialPmf from '@stdlib/stats-base-dists-binomial-pmf';
import { describe, expect, it } from 'vitest';
import {
  chanceOfAtLeast,
  cuttingsForTarget,
  DEFAULT_CUTTINGS_PER_POSITION,
  expectedEmptyPositions,
  fillProbability,
  planFigures,
  plantingPositions,
  positionsErrors,
  rowLayoutErrors,
  rowPositions,
  safetyCautions,
  seasonGuidance,
  shadeSideGuidance,
  strikeRateErrors,
  targetErrors,
} from '../planner.js';
import { plannerEstimateSchema } from '../schemas/planner.js';

describe('the binomial functions the planner uses (@stdlib binomial CDF and PMF)', () => {
  it('match the published BINOM.DIST examples', () => {
    // published: spreadsheet BINOM.DIST documentation — P(X >= 1; n 2, p 0.8) = 0.96.
    expect(1 - binomialCdf(0, 2, 0.8)).toBeCloseTo(0.96, 14);
    // published: spreadsheet BINOM.DIST documentation — P(X = 6; n 10, p 0.5) = 0.205078125.
    expect(binomialPmf(6, 10, 0.5)).toBeCloseTo(0.205078125, 14);
    // published: spreadsheet BINOM.DIST documentation — CDF(3; n 98, p 0.04) = 0.445507210083272.
    expect(binomialCdf(3, 98, 0.04)).toBeCloseTo(0.445507210083272, 13);
  });

  it('give the same values through the planner functions', () => {
    // published: spreadsheet BINOM.DIST documentation — P(X >= 1; n 2, p 0.8) = 0.96.
    expect(chanceOfAtLeast(2, 0.8, 1)).toBeCloseTo(0.96, 14);
    // published: spreadsheet BINOM.DIST documentation — CDF(3; n 98, p 0.04) = 0.445507210083272,
    // so P(X >= 4) is its complement.
    expect(chanceOfAtLeast(98, 0.04, 4)).toBeCloseTo(1 - 0.445507210083272, 13);
  });
});

describe('positions', () => {
  it('is floor(length / spacing) + 1 per row, exact for typed decimals', () => {
    // By hand: 12.3 / 0.3 = 41 intervals, 42 plants. Doubles give 41.00000000000001 here,
    // but 0.3 / 0.1 = 2.9999999999999996 and 0.7 / 0.1 = 6.999999999999999 below.
    expect(rowPositions(12.3, 0.3)).toBe(42);
    expect(rowPositions(10, 0.1)).toBe(101);
    expect(rowPositions(0.9, 0.3)).toBe(4);
    expect(0.3 / 0.1).toBeLessThan(3);
    expect(rowPositions(0.3, 0.1)).toBe(4);
    expect(rowPositions(0.7, 0.1)).toBe(8);
    expect(rowPositions(1.2, 0.4)).toBe(4);
    // Not a whole number of spacings: the last gap is shorter than the spacing, no plant in it.
    expect(rowPositions(10, 3)).toBe(4);
  });

  it('multiplies by the rows, or takes the positions given', () => {
    expect(plantingPositions({ lengthM: 12.3, spacingM: 0.3, rows: 2 })).toBe(84);
    // A 30 m hedgerow at 1.2 m, inside the currant in-row spacing of 0.9-1.2 m (published:
    // Penn State Extension; ATTRA/NCAT; OMAFRA 98-095): 25 gaps, 26 plants.
    expect(plantingPositions({ lengthM: 30, spacingM: 1.2, rows: 1 })).toBe(26);
    expect(plantingPositions({ positions: 40 })).toBe(40);
  });

  it('refuses layouts the checks refuse', () => {
    expect(() => plantingPositions({ lengthM: -5, spacingM: 0.3, rows: 1 })).toThrow(/lengthM/);
    expect(() => plantingPositions({ lengthM: 5, spacingM: 6, rows: 1 })).toThrow(/spacingM/);
    expect(() => plantingPositions({ positions: 0 })).toThrow(/positions/);
  });
});

describe('fill probability and empty positions', () => {
  it('uses two cuttings per position by default', () => {
    // common practice: CHECK-VALUES.md, "Cuttings per planting position: 2".
    expect(DEFAULT_CUTTINGS_PER_POSITION).toBe(2);
  });

  it('is 1 - (1 - p)^k', () => {
    // published: spreadsheet BINOM.DIST documentation — P(X >= 1; n 2, p 0.8) = 0.96: two
    // cuttings at a strike rate of 0.8 fill a position 96 times in 100.
    expect(fillProbability(0.8, 2)).toBeCloseTo(0.96, 14);
    // The closed form (textbook) for other cases.
    for (const [p, k] of [[0.7, 1], [0.5, 3], [0.875, 2], [0.3, 10]] as const) {
      expect(fillProbability(p, k)).toBeCloseTo(1 - (1 - p) ** k, 14);
    }
  });

  it('leaves positions x (1 - p)^k empty on average', () => {
    // 100 positions, p 0.8, two cuttings each: 100 x 0.04 = 4 (from the published 0.96 above).
    expect(expectedEmptyPositions(100, 0.8, 2)).toBeCloseTo(4, 12);
    expect(expectedEmptyPositions(42, 0.5, 1)).toBeCloseTo(21, 12);
  });

  it('refuses a strike rate of 0 or 1 and cuttings per position outside 1..10', () => {
    expect(() => fillProbability(0, 2)).toThrow(RangeError);
    expect(() => fillProbability(1, 2)).toThrow(RangeError);
    expect(() => fillProbability(0.8, 0)).toThrow(RangeError);
    expect(() => fillProbability(0.8, 11)).toThrow(RangeError);
  });
});

// Independent check: P(Binomial(n, p) >= N) as an exact fraction, summing the pmf terms
// C(n, k) p^k (1 - p)^(n - k) with p = pNum / pDen in BigInt arithmetic.
function exactAtLeast(n: number, pNum: number, pDen: number, atLeast: number): { num: bigint; den: bigint } {
  const a = BigInt(pNum);
  const b = BigInt(pDen - pNum);
  let choose = 1n; // C(n, 0)
  let num = 0n;
  for (let k = 0; k <= n; k++) {
    if (k > 0) choose = (choose * BigInt(n - k + 1)) / BigInt(k);
    if (k >= atLeast) num += choose * a ** BigInt(k) * b ** BigInt(n - k);
  }
  return { num, den: BigInt(pDen) ** BigInt(n) };
}
/** exact P(X >= N) >= cNum / cDen */
function reaches(n: number, p: [number, number], atLeast: number, c: [number, number]): boolean {
  const { num, den } = exactAtLeast(n, p[0], p[1], atLeast);
  return num * BigInt(c[1]) >= BigInt(c[0]) * den;
}

describe('cuttingsForTarget', () => {
  // [N rooted, p as a fraction, confidence as a fraction]
  const cases: [number, [number, number], [number, number]][] = [
    [1, [8, 10], [96, 100]], // exactly on the published 0.96: 2 cuttings reach it
    [1, [8, 10], [97, 100]],
    [10, [7, 10], [9, 10]],
    [24, [1, 2], [1, 2]],
    [50, [3, 4], [95, 100]],
    [100, [7, 8], [99, 100]],
    [5, [3, 10], [8, 10]],
    [40, [6, 10], [999, 1000]],
  ];

  it.each(cases)('N %i, p %j, confidence %j: smallest n by an exact sum of binomial pmf terms', (N, p, c) => {
    const n = cuttingsForTarget(N, p[0] / p[1], c[0] / c[1]);
    expect(reaches(n, p, N, c)).toBe(true);
    // Minimal: one cutting fewer falls short.
    expect(reaches(n - 1, p, N, c)).toBe(false);
  });

  it('gives 2 cuttings for 1 rooted plant at 0.96 with p 0.8', () => {
    // published: spreadsheet BINOM.DIST documentation — P(X >= 1; n 2, p 0.8) = 0.96.
    expect(cuttingsForTarget(1, 0.8, 0.96)).toBe(2);
  });

  it('asks for more with more confidence, more plants or a lower strike rate', () => {
    expect(cuttingsForTarget(100, 0.7, 0.99)).toBeGreaterThan(cuttingsForTarget(100, 0.7, 0.9));
    expect(cuttingsForTarget(200, 0.7, 0.9)).toBeGreaterThan(cuttingsForTarget(100, 0.7, 0.9));
    expect(cuttingsForTarget(100, 0.5, 0.9)).toBeGreaterThan(cuttingsForTarget(100, 0.7, 0.9));
    // Never fewer than the plants wanted, even at a low confidence.
    expect(cuttingsForTarget(100, 0.99, 0.01)).toBeGreaterThanOrEqual(100);
  });

  it('stays fast and minimal for the largest target', () => {
    const n = cuttingsForTarget(100_000, 0.75, 0.95);
    expect(chanceOfAtLeast(n, 0.75, 100_000)).toBeGreaterThanOrEqual(0.95);
    expect(chanceOfAtLeast(n - 1, 0.75, 100_000)).toBeLessThan(0.95);
  });

  it('refuses a confidence of 0 or 1 and impossible targets', () => {
    expect(() => cuttingsForTarget(10, 0.7, 1)).toThrow(/confidence/);
    expect(() => cuttingsForTarget(10, 0.7, 0)).toThrow(/confidence/);
    expect(() => cuttingsForTarget(0, 0.7, 0.9)).toThrow(/rooted/);
    expect(() => cuttingsForTarget(100_001, 0.7, 0.9)).toThrow(/rooted/);
    expect(() => cuttingsForTarget(10, 1, 0.9)).toThrow(/strikeRate/);
  });
});

describe('planFigures', () => {
  it('puts the pieces together', () => {
    const f = planFigures({ layout: { lengthM: 12.3, spacingM: 0.3, rows: 1 }, strikeRate: 0.8, target: { rooted: 30, confidence: 0.9 } });
    expect(f.positions).toBe(42);
    expect(f.cuttingsPerPosition).toBe(2);
    expect(f.cuttings).toBe(84);
    expect(f.fillProbability).toBeCloseTo(0.96, 14);
    expect(f.expectedEmptyPositions).toBeCloseTo(42 * 0.04, 12);
    expect(f.cuttingsForTarget).toBe(cuttingsForTarget(30, 0.8, 0.9));
    expect(f.targetChance).toBeGreaterThanOrEqual(0.9);
  });
});

describe('field checks', () => {
  it('names the field that is wrong', () => {
    expect(rowLayoutErrors({ lengthM: -1, spacingM: 0.3, rows: 1 })).toHaveProperty('lengthM');
    expect(rowLayoutErrors({ lengthM: 10_001, spacingM: 0.3, rows: 1 })).toHaveProperty('lengthM');
    expect(rowLayoutErrors({ lengthM: 10, spacingM: 0, rows: 1 })).toHaveProperty('spacingM');
    expect(rowLayoutErrors({ lengthM: 10, spacingM: -0.5, rows: 1 })).toHaveProperty('spacingM');
    expect(rowLayoutErrors({ lengthM: 10, spacingM: 10.5, rows: 1 })).toEqual({ spacingM: 'Spacing is longer than the row' });
    expect(rowLayoutErrors({ lengthM: 10, spacingM: 0.5, rows: 0 })).toHaveProperty('rows');
    expect(rowLayoutErrors({ lengthM: 10, spacingM: 0.5, rows: 21 })).toHaveProperty('rows');
    expect(rowLayoutErrors({ lengthM: 10, spacingM: 0.5, rows: 1.5 })).toHaveProperty('rows');
    // 10 km at 1 mm is ten million positions: a slip, not a plan.
    expect(rowLayoutErrors({ lengthM: 10_000, spacingM: 0.001, rows: 1 })).toHaveProperty('spacingM');
    expect(rowLayoutErrors({ lengthM: 10_000, spacingM: 10, rows: 20 })).toEqual({});
    expect(positionsErrors(0)).toHaveProperty('positions');
    expect(positionsErrors(100_001)).toHaveProperty('positions');
    expect(strikeRateErrors(0)).toHaveProperty('strikeRate');
    expect(strikeRateErrors(1)).toHaveProperty('strikeRate');
    expect(strikeRateErrors(0.75)).toEqual({});
    expect(targetErrors({ rooted: 10, confidence: 1.2 })).toEqual({ confidence: expect.any(String) });
    expect(targetErrors({ rooted: 10, confidence: 1 })).toHaveProperty('confidence');
    expect(targetErrors({ rooted: 10, confidence: 0 })).toHaveProperty('confidence');
    expect(targetErrors({ rooted: 0, confidence: 0.9 })).toHaveProperty('rooted');
    expect(targetErrors({ rooted: 100_001, confidence: 0.9 })).toHaveProperty('rooted');
    expect(targetErrors({ rooted: 100_000, confidence: 0.9 })).toEqual({});
  });

  it('the shared schema reports them at the field paths', () => {
    const paths = (body: unknown) => {
      const r = plannerEstimateSchema.safeParse(body);
      return r.success ? [] : r.error.issues.map((i) => i.path.join('.'));
    };
    expect(paths({ lengthM: -3, spacingM: 0.3, rows: 1, strikeRate: 0.7 })).toEqual(['lengthM']);
    expect(paths({ lengthM: 3, spacingM: 4, strikeRate: 0.7 })).toEqual(['spacingM']);
    expect(paths({ positions: 10, strikeRate: 0.7, target: { rooted: 5, confidence: 1.2 } })).toEqual(['target.confidence']);
    expect(paths({ positions: 10, lengthM: 3, spacingM: 0.3, strikeRate: 0.7 })).toEqual(['positions']);
    expect(paths({ positions: 10, strikeRate: 0.7, speciesId: '00000000-0000-4000-8000-000000000000' })).toEqual(['strikeRate']);
    expect(paths({ positions: 10 })).toEqual(['speciesId']);
    expect(paths({ strikeRate: 0.7 })).toEqual(['lengthM']);
    const ok = plannerEstimateSchema.parse({ lengthM: 12.3, spacingM: 0.3, strikeRate: 0.7 });
    expect(ok).toEqual({ layout: { lengthM: 12.3, spacingM: 0.3, rows: 1 }, cuttingsPerPosition: 2, rate: { strikeRate: 0.7 } });
  });
});

describe('guidance', () => {
  it('puts shade-tolerant shrubs on the shaded side for the hemisphere', () => {
    // common practice: CHECK-VALUES.md, "gooseberries tolerate more shade than blackcurrants:
    // put them on the shaded side of trees (north in the northern hemisphere, south in the southern)".
    const north = shadeSideGuidance('north');
    expect(north.side).toBe('north');
    expect(north.text).toMatch(/gooseberries on the north side/);
    const south = shadeSideGuidance('south');
    expect(south.side).toBe('south');
    expect(south.text).toMatch(/gooseberries on the south side/);
  });

  it('gives leafy-cutting advice for a late-summer season', () => {
    const text = seasonGuidance('leafy_summer').join(' ');
    expect(text).toMatch(/cloudy, wet weather/);
    expect(text).toMatch(/wet/);
    expect(text).toMatch(/same day/);
    expect(text).toMatch(/Firm/);
    // published: Gardeners' World; OMAFRA Factsheet 98-095 — hardwood cuttings after leaf fall.
    expect(seasonGuidance('dormant_hardwood').join(' ')).toMatch(/after leaf fall/);
    expect(seasonGuidance('scion').join(' ')).toMatch(/never frozen/);
  });

  it('lists the safety cautions', () => {
    const text = safetyCautions({ hormone: true, restrictionNote: 'Blackcurrants need a permit in some states.' }).join(' ');
    for (const words of [/sharp/i, /gloves/, /label/, /Kneeling/, /plant-health authority/, /restricted/, /need a permit in some states/]) {
      expect(text).toMatch(words);
    }
    expect(safetyCautions({ hormone: false }).join(' ')).not.toMatch(/gloves/);
  });
});
