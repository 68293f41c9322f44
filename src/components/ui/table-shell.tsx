import type { ReactNode } from 'react';
import { cn } from '../../lib/cn';

/**
 * The frame every data table sits in: a caption for screen readers and horizontal
 * scrolling on a phone instead of squeezed columns.
 */
export function TableShell({
  caption,
  children,
  className,
  tableClassName = 'min-w-[56rem]',
}: {
  caption: string;
  children: ReactNode;
  className?: string;
  /** Below this width the table scrolls sideways rather than squeezing its columns. */
  tableClassName?: string;
}) {
  return (
    <div className={cn('overflow-x-auto rounded-card border border-paper-edge bg-white/70', className)} tabIndex={0} role="region" aria-label={caption}>
      <table className={cn('w-full border-collapse text-left text-sm sm:text-base', tableClassName)}>
        <caption className="sr-only">{caption}</caption>
        {children}
      </table>
    </div>
  );
}

export const th = 'border-b-2 border-paper-edge bg-paper-deep px-3 py-3 align-bottom text-sm font-semibold text-ink-soft';
export const td = 'border-b border-paper-edge px-3 py-3 align-top';

export function Pager({
  page,
  pageCount,
  total,
  noun,
  onPrevious,
  onNext,
  canPrevious,
  canNext,
}: {
  page: number;
  pageCount: number;
  total: number;
  noun: [string, string];
  onPrevious: () => void;
  onNext: () => void;
  canPrevious: boolean;
  canNext: boolean;
}) {
  return (
    <nav aria-label="Pages" className="mt-4 flex flex-wrap items-center justify-between gap-3">
      <p className="text-ink-soft">
        Page {page} of {Math.max(pageCount, 1)} · {total} {total === 1 ? noun[0] : noun[1]}
      </p>
      <div className="flex gap-2">
        <button
          type="button"
          onClick={onPrevious}
          disabled={!canPrevious}
          className="inline-flex min-h-touch items-center rounded-lg border-2 border-bark-light px-4 font-semibold hover:bg-paper-deep disabled:opacity-50"
        >
          Previous
        </button>
        <button
          type="button"
          onClick={onNext}
          disabled={!canNext}
          className="inline-flex min-h-touch items-center rounded-lg border-2 border-bark-light px-4 font-semibold hover:bg-paper-deep disabled:opacity-50"
        >
          Next
        </button>
      </div>
    </nav>
  );
}
