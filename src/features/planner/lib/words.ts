import { LABELS } from '../../../../shared/domain';
import type { PlannerStrikeRate } from '../../../../shared/schemas/planner';

/** "78.4 %" */
export function pct(x: number, digits = 1): string {
  return `${(x * 100).toLocaleString('en', { minimumFractionDigits: digits, maximumFractionDigits: digits })} %`;
}

export function whole(n: number): string {
  return n.toLocaleString('en');
}

/** "2.3" (expected counts are averages, not whole plants) */
export function tenths(x: number): string {
  return x.toLocaleString('en', { minimumFractionDigits: 1, maximumFractionDigits: 1 });
}

/** Where the strike rate came from, in a sentence. */
export function strikeRateSource(rate: PlannerStrikeRate, names: { species: string; variety: string | null }): string {
  const treatment = rate.treatment ? LABELS.treatment[rate.treatment].toLowerCase() : 'no treatment';
  const treated = rate.treatment && rate.treatment !== 'none' ? `with ${treatment}` : 'untreated';
  if (rate.source === 'reports') {
    const of = rate.scope === 'variety' && names.variety ? names.variety : `all ${names.species}`;
    return `Learned from ${rate.reports} strike report${rate.reports === 1 ? '' : 's'} on ${of} ${treated}: ${whole(rate.rooted)} of ${whole(rate.stuck)} cuttings rooted, weighed together with the reference rate.`;
  }
  if (rate.source === 'given') return 'The strike rate you gave.';
  const noReports = names.variety ? `No strike reports yet for ${names.variety} or any ${names.species} ${treated}` : `No strike reports yet for ${names.species} ${treated}`;
  return `${noReports}, so this is the reference rate for the species ${treated} (the prior). It is replaced as growers report how their cuttings rooted.`;
}
