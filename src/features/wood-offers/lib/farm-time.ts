// Pickup windows are stored as instants and shown in the farm's own time zone, whatever
// zone the phone reading them is in.
import { tz } from '@date-fns/tz';
import { format } from 'date-fns';
import type { PickupWindow } from '../../../../shared/schemas/seasons';

/** "Sat 9 Jan 2027, 09:30–12:30" in the window's farm time. */
export function windowText(w: Pick<PickupWindow, 'startsAt' | 'endsAt' | 'timezone'>): string {
  const zone = tz(w.timezone);
  const start = new Date(w.startsAt);
  const end = new Date(w.endsAt);
  const sameDay = format(start, 'yyyy-MM-dd', { in: zone }) === format(end, 'yyyy-MM-dd', { in: zone });
  return sameDay
    ? `${format(start, 'EEE d MMM yyyy, HH:mm', { in: zone })}–${format(end, 'HH:mm', { in: zone })}`
    : `${format(start, 'EEE d MMM yyyy, HH:mm', { in: zone })} to ${format(end, 'EEE d MMM yyyy, HH:mm', { in: zone })}`;
}

/** The zone's short name at that instant, e.g. "GMT" or "GMT+1", for the reader's benefit. */
export function zoneName(w: Pick<PickupWindow, 'startsAt' | 'timezone'>): string {
  return format(new Date(w.startsAt), 'zzz', { in: tz(w.timezone) });
}
