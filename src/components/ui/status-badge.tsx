// Every status in Heelwood is shown as a shape plus words, never colour alone. This file
// is the one place that maps a status to its label, shape and colour; add new statuses here.
import { LABELS } from '../../../shared/domain';
import { cn } from '../../lib/cn';

export type StatusShape = 'hollow-circle' | 'filled-circle' | 'square-bar' | 'triangle' | 'octagon' | 'cross' | 'diamond' | 'filled-square' | 'half-circle';

export type StatusKind =
  | 'pending'
  | 'active'
  | 'suspended'
  | 'clean'
  | 'watch'
  | 'hold'
  | 'retired'
  // Season stages
  | 'planning'
  | 'requests_open'
  | 'allocating'
  | 'collections'
  | 'closed'
  // Wood requests
  | 'draft'
  | 'filed'
  | 'withdrawn'
  // Wood on the board: asked against offered
  | 'scarce'
  | 'enough'
  | 'unoffered'
  // Allocation rounds ('round_draft': a request already uses 'draft'; see roundStatusKind)
  | 'round_draft'
  | 'proposed'
  | 'approved'
  | 'notified'
  // Bundles
  | 'reserved'
  | 'ready'
  | 'collected'
  | 'cancelled'
  // Strike report on a collected bundle
  | 'report_waiting'
  | 'report_due'
  | 'reported'
  // E-mails sent for a round
  | 'mail_queued'
  | 'mail_sent'
  | 'mail_failed'
  // Plant-health notices, per grower and finding
  | 'notice_sent'
  | 'notice_due';

type StatusLook = { label: string; shape: StatusShape; tone: string };

export const STATUS_LOOKS: Record<StatusKind, StatusLook> = {
  // Membership
  pending: { label: LABELS.status.pending, shape: 'hollow-circle', tone: 'border-amber/60 bg-amber-light text-amber' },
  active: { label: LABELS.status.active, shape: 'filled-circle', tone: 'border-leaf/50 bg-leaf-light text-leaf-dark' },
  suspended: { label: LABELS.status.suspended, shape: 'square-bar', tone: 'border-rust/50 bg-rust-light text-rust' },
  // Plant health
  clean: { label: LABELS.health.clean, shape: 'filled-circle', tone: 'border-leaf/50 bg-leaf-light text-leaf-dark' },
  watch: { label: LABELS.health.watch, shape: 'triangle', tone: 'border-amber/60 bg-amber-light text-amber' },
  hold: { label: LABELS.health.hold, shape: 'octagon', tone: 'border-rust/50 bg-rust-light text-rust' },
  retired: { label: LABELS.health.retired, shape: 'cross', tone: 'border-ink-faint/50 bg-paper-deep text-ink-soft' },
  // Season stages: the shape fills as the season moves on, and a cross once it is over.
  planning: { label: LABELS.seasonStage.planning, shape: 'hollow-circle', tone: 'border-bark-light bg-paper-deep text-bark' },
  requests_open: { label: LABELS.seasonStage.requests_open, shape: 'filled-circle', tone: 'border-leaf/50 bg-leaf-light text-leaf-dark' },
  allocating: { label: LABELS.seasonStage.allocating, shape: 'diamond', tone: 'border-currant/40 bg-currant-light text-currant' },
  collections: { label: LABELS.seasonStage.collections, shape: 'half-circle', tone: 'border-bark-light bg-paper-deep text-bark' },
  closed: { label: LABELS.seasonStage.closed, shape: 'cross', tone: 'border-ink-faint/50 bg-paper-deep text-ink-soft' },
  // Wood requests
  draft: { label: 'Draft, not filed', shape: 'hollow-circle', tone: 'border-amber/60 bg-amber-light text-amber' },
  filed: { label: 'Filed', shape: 'filled-circle', tone: 'border-leaf/50 bg-leaf-light text-leaf-dark' },
  withdrawn: { label: 'Withdrawn', shape: 'cross', tone: 'border-ink-faint/50 bg-paper-deep text-ink-soft' },
  // Wood board
  scarce: { label: 'Scarce', shape: 'triangle', tone: 'border-amber/60 bg-amber-light text-amber' },
  enough: { label: 'Enough', shape: 'filled-square', tone: 'border-leaf/50 bg-leaf-light text-leaf-dark' },
  unoffered: { label: 'None offered', shape: 'octagon', tone: 'border-rust/50 bg-rust-light text-rust' },
  // Allocation rounds: the shape fills as the round moves from working out to sent.
  round_draft: { label: 'Draft', shape: 'hollow-circle', tone: 'border-bark-light bg-paper-deep text-bark' },
  proposed: { label: 'Proposed, for review', shape: 'half-circle', tone: 'border-currant/40 bg-currant-light text-currant' },
  approved: { label: 'Approved', shape: 'filled-circle', tone: 'border-leaf/50 bg-leaf-light text-leaf-dark' },
  notified: { label: 'Notified', shape: 'filled-square', tone: 'border-leaf/50 bg-leaf-light text-leaf-dark' },
  // Bundles
  reserved: { label: 'Reserved', shape: 'diamond', tone: 'border-currant/40 bg-currant-light text-currant' },
  ready: { label: 'Ready', shape: 'half-circle', tone: 'border-amber/60 bg-amber-light text-amber' },
  collected: { label: 'Collected', shape: 'filled-circle', tone: 'border-leaf/50 bg-leaf-light text-leaf-dark' },
  cancelled: { label: 'Cancelled', shape: 'cross', tone: 'border-ink-faint/50 bg-paper-deep text-ink-soft' },
  // Strike reports: hollow while the cuttings are still rooting, a triangle once a report is due, filled when filed.
  report_waiting: { label: 'Report not due yet', shape: 'hollow-circle', tone: 'border-bark-light bg-paper-deep text-bark' },
  report_due: { label: 'Report due', shape: 'triangle', tone: 'border-amber/60 bg-amber-light text-amber' },
  reported: { label: 'Reported', shape: 'filled-circle', tone: 'border-leaf/50 bg-leaf-light text-leaf-dark' },
  // E-mails
  mail_queued: { label: 'Queued', shape: 'hollow-circle', tone: 'border-bark-light bg-paper-deep text-bark' },
  mail_sent: { label: 'Sent', shape: 'filled-circle', tone: 'border-leaf/50 bg-leaf-light text-leaf-dark' },
  mail_failed: { label: 'Failed', shape: 'octagon', tone: 'border-rust/50 bg-rust-light text-rust' },
  // Plant-health notices
  notice_sent: { label: 'Notice sent', shape: 'filled-square', tone: 'border-leaf/50 bg-leaf-light text-leaf-dark' },
  notice_due: { label: 'Not notified yet', shape: 'hollow-circle', tone: 'border-amber/60 bg-amber-light text-amber' },
};

/** A round's status as a badge kind (a wood request already uses 'draft'). */
export function roundStatusKind(status: 'draft' | 'proposed' | 'approved' | 'notified'): StatusKind {
  return status === 'draft' ? 'round_draft' : status;
}

/** An e-mail log status as a badge kind. */
export function mailStatusKind(status: string): StatusKind {
  return status === 'sent' ? 'mail_sent' : status === 'failed' ? 'mail_failed' : 'mail_queued';
}

export function StatusShapeIcon({ shape, className }: { shape: StatusShape; className?: string }) {
  const props = {
    width: 14,
    height: 14,
    viewBox: '0 0 14 14',
    'aria-hidden': true,
    focusable: false,
    className: cn('shrink-0', className),
    'data-shape': shape,
  } as const;
  switch (shape) {
    case 'hollow-circle':
      return (
        <svg {...props}>
          <circle cx="7" cy="7" r="5.25" fill="none" stroke="currentColor" strokeWidth="2" />
        </svg>
      );
    case 'filled-circle':
      return (
        <svg {...props}>
          <circle cx="7" cy="7" r="6" fill="currentColor" />
        </svg>
      );
    case 'square-bar':
      return (
        <svg {...props}>
          <rect x="1" y="1" width="12" height="12" rx="1" fill="currentColor" />
          <rect x="3" y="6" width="8" height="2" fill="white" />
        </svg>
      );
    case 'triangle':
      return (
        <svg {...props}>
          <polygon points="7,0.8 13.4,12.6 0.6,12.6" fill="currentColor" />
        </svg>
      );
    case 'octagon':
      return (
        <svg {...props}>
          <polygon points="4.2,0.5 9.8,0.5 13.5,4.2 13.5,9.8 9.8,13.5 4.2,13.5 0.5,9.8 0.5,4.2" fill="currentColor" />
        </svg>
      );
    case 'cross':
      return (
        <svg {...props}>
          <path d="M2 2l10 10M12 2L2 12" stroke="currentColor" strokeWidth="2.4" strokeLinecap="round" />
        </svg>
      );
    case 'diamond':
      return (
        <svg {...props}>
          <polygon points="7,0.6 13.4,7 7,13.4 0.6,7" fill="currentColor" />
        </svg>
      );
    case 'filled-square':
      return (
        <svg {...props}>
          <rect x="1.5" y="1.5" width="11" height="11" rx="1.5" fill="currentColor" />
        </svg>
      );
    case 'half-circle':
      return (
        <svg {...props}>
          <circle cx="7" cy="7" r="5.25" fill="none" stroke="currentColor" strokeWidth="2" />
          <path d="M7 1.75a5.25 5.25 0 0 1 0 10.5z" fill="currentColor" />
        </svg>
      );
  }
}

export function StatusBadge({ status, className }: { status: StatusKind; className?: string }) {
  const look = STATUS_LOOKS[status];
  return (
    <span
      className={cn(
        'inline-flex items-center gap-1.5 whitespace-nowrap rounded-full border px-2.5 py-0.5 text-sm font-medium',
        look.tone,
        className,
      )}
    >
      <StatusShapeIcon shape={look.shape} />
      <span className="text-ink">{look.label}</span>
    </span>
  );
}
