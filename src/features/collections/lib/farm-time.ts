// The same few lines as in features/pickups: features do not import each other.
import { tz } from '@date-fns/tz';
import { format, isValid } from 'date-fns';

/**
 * A pickup window in the farm's own time zone, whatever the reader's device says:
 * "Sat 12 Dec 2026, 09:00–12:00" (or both ends in full when it runs past midnight).
 */
export function formatWindow(startsAt: string, endsAt: string, timezone: string): string {
  const start = new Date(startsAt);
  const end = new Date(endsAt);
  if (!isValid(start) || !isValid(end)) return '—';
  const zone = { in: tz(timezone) };
  const sameDay = format(start, 'yyyy-MM-dd', zone) === format(end, 'yyyy-MM-dd', zone);
  return sameDay
    ? `${format(start, 'EEE d MMM yyyy, HH:mm', zone)}–${format(end, 'HH:mm', zone)}`
    : `${format(start, 'EEE d MMM yyyy, HH:mm', zone)} to ${format(end, 'EEE d MMM yyyy, HH:mm', zone)}`;
}

/** "Europe/London" → "Europe/London time"; kept plain so it reads the same on paper. */
export function zoneWords(timezone: string): string {
  return `${timezone.replace(/_/g, ' ')} time`;
}
