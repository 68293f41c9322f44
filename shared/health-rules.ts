// How an inspection changes a plant's health status. One table, read top to bottom; the
// first row that matches decides. Only a coordinator lifts a hold (not an inspection), and
// a retired plant stays retired.
import { format, subMonths } from 'date-fns';
import type { HealthStatus, Severity } from './domain.js';

export type FindingFacts = { travelsInWood: boolean; severity: Severity };

export type HealthRule = {
  when: string;
  matches: (current: HealthStatus, findings: FindingFacts[]) => boolean;
  next: (current: HealthStatus) => HealthStatus;
};

export const HEALTH_RULES: HealthRule[] = [
  {
    when: 'The plant is retired',
    matches: (c) => c === 'retired',
    next: () => 'retired',
  },
  {
    when: 'A finding travels in cutting wood (any severity)',
    matches: (_c, f) => f.some((x) => x.travelsInWood),
    next: () => 'hold',
  },
  {
    when: 'The plant is on hold (only a coordinator lifts a hold)',
    matches: (c) => c === 'hold',
    next: () => 'hold',
  },
  {
    when: 'A finding that does not travel in wood',
    matches: (_c, f) => f.length > 0,
    next: () => 'watch',
  },
  {
    when: 'A clean inspection (no findings)',
    matches: (_c, f) => f.length === 0,
    next: () => 'clean',
  },
];

export function statusAfterInspection(current: HealthStatus, findings: FindingFacts[]): { status: HealthStatus; rule: string } {
  for (const rule of HEALTH_RULES) {
    if (rule.matches(current, findings)) return { status: rule.next(current), rule: rule.when };
  }
  return { status: current, rule: 'no rule matched' };
}

/** May wood be taken from this plant this season? Clean and inspected within the look-back. */
export function mayGiveWood(status: HealthStatus, lastInspectedOn: string | null, lookbackMonths: number, today: Date): boolean {
  if (status !== 'clean' || !lastInspectedOn) return false;
  return lastInspectedOn >= lookbackStart(lookbackMonths, today);
}

/** The first day that still counts as inspected within the look-back, as yyyy-MM-dd. */
export function lookbackStart(lookbackMonths: number, today: Date): string {
  return format(subMonths(today, lookbackMonths), 'yyyy-MM-dd');
}
