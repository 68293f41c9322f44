// How many cuttings a mother plant gives in a season, and how many of them a farm may offer.
//
// Lengths and cap fractions are typed by people as short decimals (65.5 cm, 0.33). Binary
// floating point gets some of them wrong at a floor(): 100 x 0.29 is 28.999999999999996 in
// doubles, so the cap would give 28, not 29. The arithmetic here is done in decimal.js on the
// numbers' shortest decimal spelling (what JSON and forms carry), and the whole-number parts
// are taken with an exact integer division, so typed decimals give exact answers.
import Decimal from 'decimal.js';
import type { PlantRole } from './domain.js';

/** Own configuration, so nobody else's Decimal settings change these results. */
const D = Decimal.clone({ precision: 40, rounding: Decimal.ROUND_DOWN });

function checkNonNegative(name: string, value: number): void {
  if (!Number.isFinite(value) || value < 0) throw new RangeError(`${name} must be a finite number of 0 or more (got ${value})`);
}

function checkCount(name: string, value: number): void {
  if (!Number.isSafeInteger(value) || value < 0) throw new RangeError(`${name} must be a whole number of 0 or more (got ${value})`);
}

/**
 * Cuttings cut from one shoot: floor((mean shoot length - soft tip) / cutting length), never
 * below 0. The soft tip is thrown away because unripe wood roots poorly.
 */
export function cuttingsPerShoot(meanShootLengthCm: number, softTipCm: number, cuttingLengthCm: number): number {
  checkNonNegative('meanShootLengthCm', meanShootLengthCm);
  checkNonNegative('softTipCm', softTipCm);
  if (!Number.isFinite(cuttingLengthCm) || cuttingLengthCm <= 0) {
    throw new RangeError(`cuttingLengthCm must be more than 0 (got ${cuttingLengthCm})`);
  }
  const usable = new D(meanShootLengthCm).minus(softTipCm);
  if (usable.isNegative()) return 0;
  return usable.divToInt(cuttingLengthCm).toNumber();
}

export type ShootCountBasis = {
  shootCount: number;
  meanShootLengthCm: number;
  softTipCm: number;
  cuttingLengthCm: number;
};
/** A farm that counted its cuttings another way states the number directly. */
export type DirectCountBasis = { directCount: number };
export type YieldBasis = ShootCountBasis | DirectCountBasis;

/** Cuttings a plant yields this season: shoots x cuttings per shoot, or the direct count. */
export function plantYield(basis: YieldBasis): number {
  if ('directCount' in basis) {
    checkCount('directCount', basis.directCount);
    return basis.directCount;
  }
  checkCount('shootCount', basis.shootCount);
  return basis.shootCount * cuttingsPerShoot(basis.meanShootLengthCm, basis.softTipCm, basis.cuttingLengthCm);
}

/** What may be offered: floor(yield x cap), the cap a fraction in (0, 1]. Exact for typed decimals. */
export function offerCap(yieldCount: number, capFraction: number): number {
  checkCount('yield', yieldCount);
  if (!Number.isFinite(capFraction) || capFraction <= 0 || capFraction > 1) {
    throw new RangeError(`capFraction must be more than 0 and at most 1 (got ${capFraction})`);
  }
  return new D(yieldCount).times(capFraction).floor().toNumber();
}

/**
 * Share of a season's yield each plant role may give, until the cooperative sets its own
 * (CHECK-VALUES.md, "How much wood a plant can give"; no published figure for a number of
 * cuttings, so these are settings, not facts).
 */
export const DEFAULT_ROLE_CAPS: Readonly<Record<PlantRole, number>> = Object.freeze({
  // A dedicated stock bed is stooled: nearly all current-year growth may be cut each year.
  // Source: memory: stool-bed practice in Hartmann & Kester. 0.9 leaves a few shoots for
  // the cuts that are spoiled or too thin.
  stock_bed: 0.9,
  // A fruiting bush must keep cropping: take no more than about one third of it a year.
  // Source: published (pruning rule): garden columns; memory: common extension advice.
  fruiting_bush: 0.33,
});

/** The cap for a role, from the cooperative's settings or the defaults above. */
export function roleCap(role: PlantRole, caps: Readonly<Record<PlantRole, number>> = DEFAULT_ROLE_CAPS): number {
  return caps[role];
}

/** Yield and offer for one plant in one step, as the wood-offer form shows them. */
export function offerForPlant(
  basis: YieldBasis,
  role: PlantRole,
  caps: Readonly<Record<PlantRole, number>> = DEFAULT_ROLE_CAPS,
): { estimatedYield: number; capFraction: number; offered: number } {
  const estimatedYield = plantYield(basis);
  const capFraction = roleCap(role, caps);
  return { estimatedYield, capFraction, offered: offerCap(estimatedYield, capFraction) };
}
