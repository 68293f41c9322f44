// Where a collected bundle stands with its strike report. The due date comes from the server
// (server/modules/reminders/report-due.ts, the same rule the reminder e-mail uses); this only
// compares it with today.
import type { MyBundle } from '../../../../shared/schemas/strike-reports';
import type { StatusKind } from '../../../components/ui/status-badge';
import { formatDay } from '../../../lib/format';

export type ReportStatus = { kind: Extract<StatusKind, 'report_waiting' | 'report_due' | 'reported'>; text: string };

function daysBetween(fromIso: string, toIso: string): number {
  return Math.round((Date.parse(`${toIso}T00:00:00Z`) - Date.parse(`${fromIso}T00:00:00Z`)) / 86_400_000);
}

export function reportStatus(bundle: Pick<MyBundle, 'reports' | 'reportDueOn' | 'unreported'>, today: string): ReportStatus {
  if (bundle.reports.length > 0) {
    return {
      kind: 'reported',
      text:
        bundle.unreported > 0
          ? `${bundle.unreported === 1 ? '1 cutting is' : `${bundle.unreported} cuttings are`} not in a report; add a report for them if you stuck them.`
          : 'Every cutting of the bundle is in a report.',
    };
  }
  const days = daysBetween(today, bundle.reportDueOn);
  if (days > 0) {
    return { kind: 'report_waiting', text: `A strike report is due on ${formatDay(bundle.reportDueOn)} (in ${days === 1 ? '1 day' : `${days} days`}), when you can see which cuttings rooted.` };
  }
  return { kind: 'report_due', text: `A strike report is due${days === 0 ? ' today' : ` since ${formatDay(bundle.reportDueOn)}`}: count the cuttings that rooted and report them below.` };
}
