// Plain words and small figures for the strike-report pages.
import { LABELS, type Treatment } from '../../../../shared/domain';

/** "78.4 %" */
export function pct(x: number, digits = 1): string {
  return `${(x * 100).toLocaleString('en', { minimumFractionDigits: digits, maximumFractionDigits: digits })} %`;
}

export function whole(n: number): string {
  return n.toLocaleString('en');
}

/** "Red currant ‘Bodenham Red’", or the species alone when the plant has no named variety. */
export function woodName(species: string, variety: string | null | undefined): string {
  return variety ? `${species} ‘${variety}’` : species;
}

export function treatmentWords(t: Treatment): string {
  return LABELS.treatment[t];
}

/** "7 of 9 rooted (77.8 %)" */
export function rootedWords(rooted: number, stuck: number): string {
  return `${whole(rooted)} of ${whole(stuck)} rooted${stuck > 0 ? ` (${pct(rooted / stuck)})` : ''}`;
}

/** Today's calendar date on this device, yyyy-MM-dd. */
export function todayIso(now = new Date()): string {
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${now.getFullYear()}-${pad(now.getMonth() + 1)}-${pad(now.getDate())}`;
}

/** A number typed in a box: empty stays undefined so the schema says what is missing. */
export function numberOrUndefined(value: unknown): number | undefined {
  if (value === '' || value === null || value === undefined) return undefined;
  return Number(String(value).trim().replace(',', '.'));
}
