import type { ReactNode } from 'react';
import { cn } from '../../lib/cn';

export type AlertTone = 'info' | 'success' | 'warning' | 'danger';

const tones: Record<AlertTone, { box: string; label: string }> = {
  info: { box: 'border-bark-light bg-paper-deep text-ink', label: 'Note' },
  success: { box: 'border-leaf bg-leaf-light text-ink', label: 'Done' },
  warning: { box: 'border-amber bg-amber-light text-ink', label: 'Caution' },
  danger: { box: 'border-rust bg-rust-light text-ink', label: 'Problem' },
};

function AlertIcon({ tone }: { tone: AlertTone }) {
  const common = { width: 20, height: 20, viewBox: '0 0 20 20', 'aria-hidden': true, focusable: false } as const;
  if (tone === 'danger') {
    return (
      <svg {...common} className="shrink-0 text-rust">
        <polygon points="6,1 14,1 19,6 19,14 14,19 6,19 1,14 1,6" fill="currentColor" />
        <rect x="9" y="5" width="2" height="7" fill="white" />
        <rect x="9" y="13.5" width="2" height="2" fill="white" />
      </svg>
    );
  }
  if (tone === 'warning') {
    return (
      <svg {...common} className="shrink-0 text-amber">
        <polygon points="10,1.5 19,18 1,18" fill="currentColor" />
        <rect x="9" y="7" width="2" height="6" fill="white" />
        <rect x="9" y="14.5" width="2" height="2" fill="white" />
      </svg>
    );
  }
  if (tone === 'success') {
    return (
      <svg {...common} className="shrink-0 text-leaf">
        <circle cx="10" cy="10" r="9" fill="currentColor" />
        <path d="M5.5 10.5l3 3 6-6.5" fill="none" stroke="white" strokeWidth="2.2" strokeLinecap="round" strokeLinejoin="round" />
      </svg>
    );
  }
  return (
    <svg {...common} className="shrink-0 text-bark">
      <circle cx="10" cy="10" r="9" fill="currentColor" />
      <rect x="9" y="8.5" width="2" height="6.5" fill="white" />
      <rect x="9" y="5" width="2" height="2" fill="white" />
    </svg>
  );
}

/**
 * A message box. Tone is carried by an icon shape and a spoken label, not colour alone.
 * Problems are announced straight away (role="alert"); other tones politely.
 */
export function Alert({ tone = 'info', title, children, className }: { tone?: AlertTone; title?: string; children?: ReactNode; className?: string }) {
  return (
    <div
      role={tone === 'danger' ? 'alert' : 'status'}
      className={cn('flex gap-3 rounded-lg border-l-4 px-4 py-3', tones[tone].box, className)}
    >
      <AlertIcon tone={tone} />
      <div className="min-w-0">
        <span className="sr-only">{tones[tone].label}: </span>
        {title ? <p className="font-semibold">{title}</p> : null}
        {children ? <div className={title ? 'mt-1' : undefined}>{children}</div> : null}
      </div>
    </div>
  );
}
