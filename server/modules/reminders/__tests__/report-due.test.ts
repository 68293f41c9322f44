// When a strike report is due: the rule in report-due.ts, date by date.
import { describe, expect, it } from 'vitest';
import { addDays, localDate, reminderDue, reportDueOn, REMINDER_WINDOW_DAYS } from '../report-due.js';

describe('reportDueOn', () => {
  it('leafy cuttings: four weeks after collection', () => {
    expect(reportDueOn('leafy_summer', 'north', '2026-08-10')).toBe('2026-09-07');
    expect(reportDueOn('leafy_summer', 'south', '2026-12-20')).toBe('2027-01-17');
  });

  it('dormant wood in the north: the first 1 June after collection', () => {
    expect(reportDueOn('dormant_hardwood', 'north', '2025-12-13')).toBe('2026-06-01');
    expect(reportDueOn('dormant_hardwood', 'north', '2026-02-28')).toBe('2026-06-01');
    expect(reportDueOn('scion', 'north', '2026-01-05')).toBe('2026-06-01');
    // Collected on the day itself or later in the year: the next year's growing season.
    expect(reportDueOn('dormant_hardwood', 'north', '2026-06-01')).toBe('2027-06-01');
    expect(reportDueOn('scion', 'north', '2026-11-30')).toBe('2027-06-01');
  });

  it('dormant wood in the south: the first 1 December after collection', () => {
    expect(reportDueOn('dormant_hardwood', 'south', '2026-06-20')).toBe('2026-12-01');
    expect(reportDueOn('scion', 'south', '2026-12-01')).toBe('2027-12-01');
  });
});

describe('reminderDue', () => {
  it('from the due day, for the reminder window', () => {
    expect(reminderDue('2026-06-01', '2026-05-31')).toBe(false);
    expect(reminderDue('2026-06-01', '2026-06-01')).toBe(true);
    expect(reminderDue('2026-06-01', addDays('2026-06-01', REMINDER_WINDOW_DAYS))).toBe(true);
    expect(reminderDue('2026-06-01', addDays('2026-06-01', REMINDER_WINDOW_DAYS + 1))).toBe(false);
  });
});

describe('localDate', () => {
  it('is the calendar day where the wood was collected', () => {
    // 23:30 UTC on 14 June is already 15 June in London (summer time) and Auckland.
    expect(localDate(new Date('2026-06-14T23:30:00Z'), 'Europe/London')).toBe('2026-06-15');
    expect(localDate(new Date('2026-06-14T23:30:00Z'), 'UTC')).toBe('2026-06-14');
    expect(localDate(new Date('2026-06-14T23:30:00Z'), 'Not/AZone')).toBe('2026-06-14');
  });
});
