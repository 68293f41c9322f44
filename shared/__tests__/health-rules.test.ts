import { describe, expect, it } from 'vitest';
import type { HealthStatus } from '../domain.js';
import { type FindingFacts, mayGiveWood, statusAfterInspection } from '../health-rules.js';

const travels: FindingFacts = { travelsInWood: true, severity: 'minor' };
const minor: FindingFacts = { travelsInWood: false, severity: 'minor' };
const severeLocal: FindingFacts = { travelsInWood: false, severity: 'severe' };

// Table-driven: [current, findings, expected]
const cases: [HealthStatus, FindingFacts[], HealthStatus][] = [
  ['clean', [], 'clean'],
  ['clean', [minor], 'watch'],
  ['clean', [severeLocal], 'watch'],
  ['clean', [travels], 'hold'],
  ['clean', [minor, travels], 'hold'],
  ['watch', [], 'clean'],
  ['watch', [minor], 'watch'],
  ['watch', [travels], 'hold'],
  ['hold', [], 'hold'],
  ['hold', [minor], 'hold'],
  ['hold', [travels], 'hold'],
  ['retired', [], 'retired'],
  ['retired', [travels], 'retired'],
];

describe('statusAfterInspection', () => {
  it.each(cases)('%s with %j becomes %s', (current, findings, expected) => {
    expect(statusAfterInspection(current, findings).status).toBe(expected);
  });
});

describe('mayGiveWood', () => {
  const today = new Date('2026-12-01T12:00:00Z');
  it('needs clean and inspected within the look-back', () => {
    expect(mayGiveWood('clean', '2026-01-15', 12, today)).toBe(true);
    expect(mayGiveWood('clean', '2025-12-01', 12, today)).toBe(true);
    expect(mayGiveWood('clean', '2025-11-30', 12, today)).toBe(false);
    expect(mayGiveWood('clean', null, 12, today)).toBe(false);
    expect(mayGiveWood('watch', '2026-11-01', 12, today)).toBe(false);
    expect(mayGiveWood('hold', '2026-11-01', 12, today)).toBe(false);
    expect(mayGiveWood('clean', '2026-05-01', 6, today)).toBe(false);
  });
});
