// When a strike report on a collected bundle is due. Pure functions: the reminder job, the
// grower's bundle list and the tests use the same rule.
//
// - Late-summer leafy cuttings root in a few weeks (first roots in 2-3 weeks, published:
//   Holloway & Higham, CHECK-VALUES), so the report is due 4 weeks after collection.
// - Dormant hardwood cuttings and scion wood show whether they took once the next growing
//   season is under way (dormant cuttings root by the next summer, published: Holloway &
//   Higham; Gardeners' World). Our date for "the growing season is under way" is a product
//   choice, not a trade figure: 1 June in the northern hemisphere, 1 December in the southern
//   (the same date six months on) — the first such date after the collection day.
// - A reminder goes out from the due date for REMINDER_WINDOW_DAYS; after that the bundle is
//   left alone (nobody wants a reminder about wood collected years ago, e.g. after the job
//   was switched off for a long time).
import type { Hemisphere, SeasonKind } from '../../../shared/domain.js';

export const LEAFY_REPORT_AFTER_DAYS = 28;
export const GROWING_SEASON_START: Record<Hemisphere, string> = { north: '06-01', south: '12-01' };
export const REMINDER_WINDOW_DAYS = 182;

const DAY = 86_400_000;

/** Calendar date (yyyy-MM-dd) of an instant in a time zone. */
export function localDate(at: Date, timeZone: string): string {
  try {
    return new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' }).format(at);
  } catch {
    // An unknown zone name in old data: fall back to UTC rather than fail a whole run.
    return at.toISOString().slice(0, 10);
  }
}

export function addDays(isoDate: string, days: number): string {
  return new Date(Date.parse(`${isoDate}T00:00:00Z`) + days * DAY).toISOString().slice(0, 10);
}

export function daysBetween(fromIso: string, toIso: string): number {
  return Math.round((Date.parse(`${toIso}T00:00:00Z`) - Date.parse(`${fromIso}T00:00:00Z`)) / DAY);
}

/** The day a strike report on wood collected on `collectedOn` is due. */
export function reportDueOn(kind: SeasonKind, hemisphere: Hemisphere, collectedOn: string): string {
  if (kind === 'leafy_summer') return addDays(collectedOn, LEAFY_REPORT_AFTER_DAYS);
  const year = Number(collectedOn.slice(0, 4));
  const sameYear = `${year}-${GROWING_SEASON_START[hemisphere]}`;
  return sameYear > collectedOn ? sameYear : `${year + 1}-${GROWING_SEASON_START[hemisphere]}`;
}

/** Is a reminder to be sent on `today` for a report due on `dueOn`? */
export function reminderDue(dueOn: string, today: string): boolean {
  const late = daysBetween(dueOn, today);
  return late >= 0 && late <= REMINDER_WINDOW_DAYS;
}
