import { describe, expect, it } from 'vitest';
import { reportStatus } from '../lib/report-status';

const report = { id: 'r', bundleId: 'b', stuck: 20, rooted: 15, assessedOn: '2026-06-10', treatment: 'none' as const, notes: '', reporterName: null, createdAt: '2026-06-10T00:00:00Z', mine: true, photos: [] };

describe('reportStatus', () => {
  it('waits before the due day, says due from it, and reported once a report is in', () => {
    // Due dates come from the server's rule (server/modules/reminders/report-due.ts); here only the comparison with today.
    expect(reportStatus({ reports: [], reportDueOn: '2026-06-01', unreported: 20 }, '2026-05-30')).toMatchObject({ kind: 'report_waiting', text: expect.stringMatching(/in 2 days/) });
    expect(reportStatus({ reports: [], reportDueOn: '2026-06-01', unreported: 20 }, '2026-06-01')).toMatchObject({ kind: 'report_due', text: expect.stringMatching(/due today/) });
    expect(reportStatus({ reports: [], reportDueOn: '2026-06-01', unreported: 20 }, '2026-12-02')).toMatchObject({ kind: 'report_due', text: expect.stringMatching(/since 1 Jun 2026/) });
    expect(reportStatus({ reports: [report], reportDueOn: '2026-06-01', unreported: 0 }, '2026-12-02')).toMatchObject({ kind: 'reported', text: expect.stringMatching(/Every cutting/) });
    expect(reportStatus({ reports: [report], reportDueOn: '2026-06-01', unreported: 2 }, '2026-12-02').text).toMatch(/2 cuttings are not in a report/);
  });
});
