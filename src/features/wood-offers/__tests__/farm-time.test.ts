import { describe, expect, it } from 'vitest';
import { windowText, zoneName } from '../lib/farm-time';

// Whatever zone the test machine is in, a window reads in the farm's own time.
describe('pickup windows in farm time', () => {
  it('shows a winter window in London as GMT wall-clock time', () => {
    const w = { startsAt: '2027-01-09T09:30:00.000Z', endsAt: '2027-01-09T12:30:00.000Z', timezone: 'Europe/London' };
    expect(windowText(w)).toBe('Sat 9 Jan 2027, 09:30–12:30');
    expect(zoneName(w)).toBe('GMT+0');
  });

  it('shows a summer window an hour on (British Summer Time)', () => {
    expect(windowText({ startsAt: '2027-07-03T08:00:00.000Z', endsAt: '2027-07-03T11:00:00.000Z', timezone: 'Europe/London' })).toBe('Sat 3 Jul 2027, 09:00–12:00');
  });

  it('shows a southern farm in its own zone, across midnight UTC', () => {
    expect(windowText({ startsAt: '2027-07-02T22:00:00.000Z', endsAt: '2027-07-03T01:00:00.000Z', timezone: 'Pacific/Auckland' })).toBe('Sat 3 Jul 2027, 10:00–13:00');
  });
});
