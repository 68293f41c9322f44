/** A bundle the coordinator set by hand: a re-run keeps it. Shape plus words. */
export function LockMark({ className }: { className?: string }) {
  return (
    <span className={`inline-flex items-center gap-1 rounded-full border border-bark-light bg-paper-deep px-2 py-0.5 text-sm font-medium ${className ?? ''}`}>
      <svg width="12" height="14" viewBox="0 0 12 14" aria-hidden="true" focusable="false" className="shrink-0 text-bark" data-shape="padlock">
        <path d="M3 6V4a3 3 0 0 1 6 0v2" fill="none" stroke="currentColor" strokeWidth="1.8" />
        <rect x="1" y="6" width="10" height="7.5" rx="1.2" fill="currentColor" />
      </svg>
      Locked
    </span>
  );
}
