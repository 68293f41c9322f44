// A sortable column's header button: the label, a mark for the direction, and the direction
// in words for screen readers. Tables put `ariaSort(dir)` on the header cell.
import type { ReactNode } from 'react';
import { cn } from '../../lib/cn';

export type SortDirection = false | 'asc' | 'desc';

export function ariaSort(dir: SortDirection, unsorted: 'none' | undefined = undefined): 'ascending' | 'descending' | 'none' | undefined {
  return dir === 'asc' ? 'ascending' : dir === 'desc' ? 'descending' : unsorted;
}

export function SortMark({ dir }: { dir: SortDirection }) {
  return (
    <svg width="12" height="12" viewBox="0 0 12 12" aria-hidden="true" focusable="false" className={cn('shrink-0', dir ? 'text-currant' : 'text-ink-faint')}>
      {dir === 'asc' ? <path d="M6 2l4 6H2z" fill="currentColor" /> : dir === 'desc' ? <path d="M6 10l4-6H2z" fill="currentColor" /> : <path d="M6 1.5l3 3.5H3zM6 10.5l3-3.5H3z" fill="currentColor" />}
    </svg>
  );
}

export function SortButton({ dir, onClick, className, children }: { dir: SortDirection; onClick?: (event: unknown) => void; className?: string; children: ReactNode }) {
  return (
    <button type="button" onClick={onClick} className={cn('inline-flex min-h-touch items-center gap-1.5 rounded font-semibold hover:text-ink', className)}>
      {children}
      <SortMark dir={dir} />
      <span className="sr-only">{dir ? `, sorted ${dir === 'asc' ? 'ascending' : 'descending'}` : ', sort by this column'}</span>
    </button>
  );
}
