import { describe, expect, it } from 'vitest';
import { cuttingsPerShoot, DEFAULT_ROLE_CAPS, offerCap, offerForPlant, plantYield, roleCap } from '../yield.js';

describe('cuttingsPerShoot', () => {
  it('is floor((shoot length - soft tip) / cutting length)', () => {
    // Worked by hand: (65 - 10) / 20 = 2.75 -> 2.
    expect(cuttingsPerShoot(65, 10, 20)).toBe(2);
    // (90 - 10) / 20 = 4 exactly.
    expect(cuttingsPerShoot(90, 10, 20)).toBe(4);
    // (47 - 15) / 30 = 1.07 -> 1.
    expect(cuttingsPerShoot(47, 15, 30)).toBe(1);
  });

  it('is exact for lengths typed as decimals, where doubles fall short of the whole number', () => {
    // By hand: 70.1 - 10.1 = 60; 60 / 20 = 3. In doubles it is 2.9999999999999996.
    expect((70.1 - 10.1) / 20).toBeLessThan(3);
    expect(cuttingsPerShoot(70.1, 10.1, 20)).toBe(3);
    // 60.3 / 20.1 = 3 exactly; doubles give 2.9999999999999996.
    expect(cuttingsPerShoot(60.3, 0, 20.1)).toBe(3);
    // 32.3 - 10 = 22.3, one cutting of 22.3 cm; doubles give 0.9999999999999999.
    expect(cuttingsPerShoot(32.3, 10, 22.3)).toBe(1);
  });

  it('gives 0, not a negative count, when the shoot is shorter than the soft tip or one cutting', () => {
    expect(cuttingsPerShoot(8, 10, 20)).toBe(0);
    expect(cuttingsPerShoot(25, 10, 20)).toBe(0);
    expect(cuttingsPerShoot(0, 0, 20)).toBe(0);
  });

  it('refuses a cutting length of 0 or less and negative lengths', () => {
    expect(() => cuttingsPerShoot(65, 10, 0)).toThrow(RangeError);
    expect(() => cuttingsPerShoot(65, 10, -20)).toThrow(RangeError);
    expect(() => cuttingsPerShoot(-1, 10, 20)).toThrow(RangeError);
    expect(() => cuttingsPerShoot(65, -1, 20)).toThrow(RangeError);
    expect(() => cuttingsPerShoot(Number.NaN, 10, 20)).toThrow(RangeError);
  });
});

describe('plantYield', () => {
  it('is shoots x cuttings per shoot', () => {
    // Worked by hand: 12 shoots of mean 65 cm, soft tip 10 cm, cuttings of 20 cm: 2 a shoot, 24 in all.
    expect(plantYield({ shootCount: 12, meanShootLengthCm: 65, softTipCm: 10, cuttingLengthCm: 20 })).toBe(24);
    // 0 shoots, 0 cuttings.
    expect(plantYield({ shootCount: 0, meanShootLengthCm: 65, softTipCm: 10, cuttingLengthCm: 20 })).toBe(0);
  });

  it('takes a direct count as it is', () => {
    expect(plantYield({ directCount: 37 })).toBe(37);
    expect(plantYield({ directCount: 0 })).toBe(0);
  });

  it('refuses counts that are not whole numbers of 0 or more', () => {
    expect(() => plantYield({ directCount: -1 })).toThrow(RangeError);
    expect(() => plantYield({ directCount: 2.5 })).toThrow(RangeError);
    expect(() => plantYield({ shootCount: 1.5, meanShootLengthCm: 65, softTipCm: 10, cuttingLengthCm: 20 })).toThrow(RangeError);
  });
});

describe('offerCap', () => {
  it('is floor(yield x cap)', () => {
    // Worked by hand: a fruiting bush yielding 24 with cap 0.33: 24 x 0.33 = 7.92 -> 7.
    expect(offerCap(24, 0.33)).toBe(7);
    // A stock bed yielding 24 with cap 0.9: 21.6 -> 21.
    expect(offerCap(24, 0.9)).toBe(21);
    expect(offerCap(24, 1)).toBe(24);
    expect(offerCap(0, 0.9)).toBe(0);
  });

  it('is exact for caps typed as decimals', () => {
    // By hand: 100 x 0.29 = 29 and 100 x 0.57 = 57; doubles give 28.999999999999996 and 56.99999999999999.
    expect(100 * 0.29).toBeLessThan(29);
    expect(offerCap(100, 0.29)).toBe(29);
    expect(offerCap(100, 0.57)).toBe(57);
  });

  it('refuses a cap outside (0, 1]', () => {
    expect(() => offerCap(24, 0)).toThrow(RangeError);
    expect(() => offerCap(24, 1.1)).toThrow(RangeError);
    expect(() => offerCap(-3, 0.5)).toThrow(RangeError);
  });
});

describe('role caps', () => {
  it('lets a fruiting bush give no more than about a third of its wood a year', () => {
    // published (pruning rule): garden columns; from memory: common extension advice —
    // "take no more than about one third of the bush a year" (CHECK-VALUES.md).
    expect(DEFAULT_ROLE_CAPS.fruiting_bush).toBeGreaterThan(0.25);
    expect(DEFAULT_ROLE_CAPS.fruiting_bush).toBeLessThanOrEqual(1 / 3);
  });

  it('lets a stock bed give nearly all its current-year growth', () => {
    // from memory: stool-bed practice in Hartmann & Kester — "nearly all current-year growth
    // may be cut each year" (CHECK-VALUES.md). "Nearly all": at least 80 %, at most all.
    expect(DEFAULT_ROLE_CAPS.stock_bed).toBeGreaterThanOrEqual(0.8);
    expect(DEFAULT_ROLE_CAPS.stock_bed).toBeLessThanOrEqual(1);
  });

  it('takes the cap from the role, and from the cooperative settings when given', () => {
    expect(roleCap('fruiting_bush')).toBe(0.33);
    expect(roleCap('stock_bed', { stock_bed: 0.75, fruiting_bush: 0.2 })).toBe(0.75);
    // The worked example in one step: 24 cuttings, fruiting bush -> 7 offered.
    expect(offerForPlant({ shootCount: 12, meanShootLengthCm: 65, softTipCm: 10, cuttingLengthCm: 20 }, 'fruiting_bush')).toEqual({
      estimatedYield: 24,
      capFraction: 0.33,
      offered: 7,
    });
  });
});
