// The planting planner: positions in a planting, cuttings to ask for, and the chances that
// they fill it. Pure functions, run by the planner page as the grower types and by the server.
//
// Binomial probabilities come from @stdlib (binomial CDF and PMF), not from formulas
// written here. Row lengths and spacings are divided in decimal.js (exact integer
// division on the numbers' decimal spelling): in doubles 0.3 / 0.1 is 2.9999999999999996,
// which would lose a plant from the row.
import binomialCdf from '@stdlib/stats-base-dists-binomial-cdf';
import binomialPmf from '@stdlib/stats-base-dists-binomial-pmf';
import Decimal from 'decimal.js';
import type { Hemisphere, SeasonKind } from './domain.js';

const D = Decimal.clone({ precision: 40 });

/** Bounds on what the planner accepts; past these a number is a typing slip, not a plan. */
export const PLANNER_LIMITS = Object.freeze({
  /** 10 km of hedgerow. */
  maxLengthM: 10_000,
  maxRows: 20,
  maxPositions: 100_000,
  maxCuttingsPerPosition: 10,
  maxTarget: 100_000,
});

/** Two cuttings per planting position. Source: CHECK-VALUES.md, common practice. */
export const DEFAULT_CUTTINGS_PER_POSITION = 2;

// ---------------------------------------------------------------------------------------
// Field checks. Each returns { field: message } for what is wrong, {} when all is well; the
// shared zod schema and the planner form both use them, so the messages are the same.
// ---------------------------------------------------------------------------------------

export type FieldErrors = Record<string, string>;

const isNumber = (x: unknown): x is number => typeof x === 'number' && Number.isFinite(x);

/** A row (or several parallel rows) with plants every spacing along it, both ends planted. */
export function rowLayoutErrors(v: { lengthM: number; spacingM: number; rows: number }): FieldErrors {
  const e: FieldErrors = {};
  const { maxLengthM, maxRows, maxPositions } = PLANNER_LIMITS;
  if (!isNumber(v.lengthM)) e.lengthM = 'Enter the row length in metres';
  else if (v.lengthM < 0) e.lengthM = 'Row length cannot be negative';
  else if (v.lengthM === 0) e.lengthM = 'Row length must be more than 0 m';
  else if (v.lengthM > maxLengthM) e.lengthM = `Row length is at most ${maxLengthM / 1000} km; split a longer planting`;

  if (!isNumber(v.spacingM)) e.spacingM = 'Enter the spacing in metres';
  else if (v.spacingM <= 0) e.spacingM = 'Spacing must be more than 0 m';
  else if (!e.lengthM && v.spacingM > v.lengthM) e.spacingM = 'Spacing is longer than the row';

  if (!isNumber(v.rows) || !Number.isInteger(v.rows)) e.rows = 'Rows must be a whole number';
  else if (v.rows < 1 || v.rows > maxRows) e.rows = `Rows must be from 1 to ${maxRows}`;

  if (!e.lengthM && !e.spacingM && !e.rows && rowPositions(v.lengthM, v.spacingM) * v.rows > maxPositions) {
    e.spacingM = `That makes more than ${maxPositions.toLocaleString('en')} positions; check the spacing`;
  }
  return e;
}

export function positionsErrors(positions: number): FieldErrors {
  const max = PLANNER_LIMITS.maxPositions;
  if (!isNumber(positions) || !Number.isInteger(positions)) return { positions: 'Positions must be a whole number' };
  if (positions < 1 || positions > max) return { positions: `Positions must be from 1 to ${max.toLocaleString('en')}` };
  return {};
}

export function cuttingsPerPositionErrors(k: number): FieldErrors {
  const max = PLANNER_LIMITS.maxCuttingsPerPosition;
  if (!isNumber(k) || !Number.isInteger(k)) return { cuttingsPerPosition: 'Cuttings per position must be a whole number' };
  if (k < 1 || k > max) return { cuttingsPerPosition: `Cuttings per position must be from 1 to ${max}` };
  return {};
}

/** A strike rate typed by the grower: a share strictly between 0 and 1. */
export function strikeRateErrors(p: number): FieldErrors {
  if (!isNumber(p) || p <= 0 || p >= 1) return { strikeRate: 'Strike rate must be between 0 and 1 (for example 0.75), not 0 or 1' };
  return {};
}

/** N rooted plants wanted with confidence c. */
export function targetErrors(t: { rooted: number; confidence: number }): FieldErrors {
  const e: FieldErrors = {};
  const max = PLANNER_LIMITS.maxTarget;
  if (!isNumber(t.rooted) || !Number.isInteger(t.rooted)) e.rooted = 'Rooted plants wanted must be a whole number';
  else if (t.rooted < 1 || t.rooted > max) e.rooted = `Rooted plants wanted must be from 1 to ${max.toLocaleString('en')}`;
  if (!isNumber(t.confidence) || t.confidence <= 0 || t.confidence >= 1) {
    e.confidence = 'Confidence must be between 0 and 1 (for example 0.9), not 0 or 1';
  }
  return e;
}

function assertNoErrors(errors: FieldErrors): void {
  const list = Object.entries(errors);
  if (list.length) throw new RangeError(list.map(([k, m]) => `${k}: ${m}`).join('; '));
}

// ---------------------------------------------------------------------------------------
// Positions and cuttings
// ---------------------------------------------------------------------------------------

/** Plants in one row: floor(length / spacing) + 1, exact for typed decimals. */
export function rowPositions(lengthM: number, spacingM: number): number {
  return new D(lengthM).divToInt(spacingM).toNumber() + 1;
}

export type RowLayout = { lengthM: number; spacingM: number; rows: number };
export type Layout = RowLayout | { positions: number };

/** Positions in a planting: rows x (floor(length / spacing) + 1), or the number given. */
export function plantingPositions(layout: Layout): number {
  if ('positions' in layout) {
    assertNoErrors(positionsErrors(layout.positions));
    return layout.positions;
  }
  assertNoErrors(rowLayoutErrors(layout));
  return layout.rows * rowPositions(layout.lengthM, layout.spacingM);
}

function checkP(p: number): void {
  assertNoErrors(strikeRateErrors(p));
}

/** Chance that a position with k cuttings ends with at least one rooted: P(Binomial(k, p) >= 1) = 1 - (1 - p)^k. */
export function fillProbability(p: number, k: number): number {
  return 1 - emptyProbability(p, k);
}

/** Chance that none of a position's k cuttings roots: P(Binomial(k, p) = 0) = (1 - p)^k. */
export function emptyProbability(p: number, k: number): number {
  checkP(p);
  assertNoErrors(cuttingsPerPositionErrors(k));
  return binomialPmf(0, k, p);
}

/** Expected number of positions left empty: positions x (1 - p)^k. */
export function expectedEmptyPositions(positions: number, p: number, k: number): number {
  assertNoErrors(positionsErrors(positions));
  return positions * emptyProbability(p, k);
}

/** P(Binomial(n, p) >= N): the chance that n cuttings give at least N rooted plants. */
export function chanceOfAtLeast(n: number, p: number, rooted: number): number {
  if (rooted <= 0) return 1;
  if (n < rooted) return 0;
  return 1 - binomialCdf(rooted - 1, n, p);
}

/**
 * Doubles near a boundary: P(X >= N) computed as 0.9599999999999999 when it is 0.96 exactly.
 * A chance within this of the confidence counts as reaching it.
 */
const TIE = 1e-12;

/**
 * Cuttings needed for N rooted plants with confidence c: the smallest n with
 * P(Binomial(n, p) >= N) >= c. The chance grows with n, so: start at the expected-value
 * guess ceil(N / p), double until the chance is reached, then bisect.
 */
export function cuttingsForTarget(rooted: number, p: number, confidence: number): number {
  assertNoErrors(targetErrors({ rooted, confidence }));
  checkP(p);
  const enough = (n: number) => chanceOfAtLeast(n, p, rooted) >= confidence - TIE;
  let lo = rooted - 1; // fails: fewer cuttings than plants wanted
  let hi = Math.max(rooted, Math.ceil(rooted / p));
  while (!enough(hi)) {
    lo = hi;
    hi *= 2;
    if (hi > Number.MAX_SAFE_INTEGER / 2) throw new RangeError('the strike rate is too low to plan for that many plants');
  }
  // Invariant: lo fails (or is below N), hi succeeds.
  while (hi - lo > 1) {
    const mid = lo + Math.floor((hi - lo) / 2);
    if (enough(mid)) hi = mid;
    else lo = mid;
  }
  return hi;
}

export type PlanInput = {
  layout: Layout;
  cuttingsPerPosition?: number;
  /** Strike rate per cutting, 0..1 exclusive. */
  strikeRate: number;
  target?: { rooted: number; confidence: number };
};

export type PlanFigures = {
  positions: number;
  cuttingsPerPosition: number;
  cuttings: number;
  fillProbability: number;
  expectedEmptyPositions: number;
  cuttingsForTarget?: number;
  /** P(at least N rooted) with cuttingsForTarget cuttings. */
  targetChance?: number;
};

/** Everything the planner shows for one plan. */
export function planFigures(input: PlanInput): PlanFigures {
  const k = input.cuttingsPerPosition ?? DEFAULT_CUTTINGS_PER_POSITION;
  const positions = plantingPositions(input.layout);
  const p = input.strikeRate;
  const figures: PlanFigures = {
    positions,
    cuttingsPerPosition: k,
    cuttings: positions * k,
    fillProbability: fillProbability(p, k),
    expectedEmptyPositions: expectedEmptyPositions(positions, p, k),
  };
  if (input.target) {
    const n = cuttingsForTarget(input.target.rooted, p, input.target.confidence);
    figures.cuttingsForTarget = n;
    figures.targetChance = chanceOfAtLeast(n, p, input.target.rooted);
  }
  return figures;
}

// ---------------------------------------------------------------------------------------
// Guidance shown beside the plan
// ---------------------------------------------------------------------------------------

/**
 * Where shade-tolerant shrubs go when planted beside trees: the side away from the sun.
 * CHECK-VALUES.md, common practice: gooseberries tolerate more shade than blackcurrants.
 */
export function shadeSideGuidance(hemisphere: Hemisphere): { side: 'north' | 'south'; text: string } {
  const side = hemisphere === 'north' ? 'north' : 'south';
  return {
    side,
    text:
      `Beside trees, plant shade-tolerant species such as gooseberries on the ${side} side of the trees, ` +
      `which is the shaded side in the ${hemisphere}ern hemisphere; keep blackcurrants and other sun-lovers on the sunny side.`,
  };
}

/** Handling advice for the kind of cuttings a season is for. */
export function seasonGuidance(kind: SeasonKind): string[] {
  const common = [
    'Keep cuttings wet from the moment they are cut: wrapped in damp cloth or in a bucket of water, out of sun and wind.',
    'Stick them the same day you collect them.',
    'Firm the soil in well around each cutting so no air pocket is left at its base.',
  ];
  switch (kind) {
    case 'dormant_hardwood':
      return [
        'Take dormant hardwood cuttings after leaf fall, from the summer\u2019s growth (current-year wood), about pencil thick.',
        'Bury most of the cutting; with red currants and gooseberries leave only the top bud above ground.',
        ...common,
        'Expect them rooted by the next summer and ready to lift after about a year.',
      ];
    case 'leafy_summer':
      return [
        'Take leafy cuttings only ahead of cloudy, wet weather: in sun and wind they wilt before they root.',
        'Keep only the top two to four leaves (commonly two on currants).',
        ...common,
        'Shade and water them until they root, usually two to three weeks in warmth.',
      ];
    case 'scion':
      return [
        'Scion wood is one-year wood cut while dormant; discard the soft tip.',
        'Keep it cold (0-2 \u00b0C), never frozen, in a sealed bag, away from ripening fruit, until grafting.',
        'Keep it moist but not wet, and label every bundle by variety.',
      ];
  }
}

/**
 * Cautions for the work; the plant-health lines defer to the local authority. The hormone
 * line is left out only when the plan says no hormone is used.
 */
export function safetyCautions(opts: { hormone?: boolean; restrictionNote?: string | null } = {}): string[] {
  const list = [
    'Pruning tools are sharp: cut away from your body and hands, carry secateurs closed, and keep a first-aid kit near.',
    'Kneeling work: use a kneeling pad or stool, change position often, and lift with your legs.',
  ];
  if (opts.hormone !== false) {
    list.push('Rooting hormone: wear gloves, follow the directions on the label, keep it away from food and children, and wash your hands afterwards.');
  }
  list.push(
    'Moving plant material: check with your local plant-health authority before moving cuttings between places; material crossing a border needs phytosanitary papers. Heelwood advises and records; it does not certify.',
    'Some genera are restricted in some areas (currants and gooseberries, Ribes, near white pines, for example): do not take them where they are banned or need a permit.',
  );
  if (opts.restrictionNote) list.push(opts.restrictionNote);
  return list;
}
