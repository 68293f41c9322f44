import type { ReactNode } from 'react';

/** An empty page always says what to do next. */
export function EmptyState({ title, children, action }: { title: string; children: ReactNode; action?: ReactNode }) {
  return (
    <div className="rounded-card border-2 border-dashed border-paper-edge px-6 py-10 text-center">
      <p className="text-lg font-semibold text-ink">{title}</p>
      <div className="mx-auto mt-2 max-w-prose text-ink-soft">{children}</div>
      {action ? <div className="mt-5 flex justify-center">{action}</div> : null}
    </div>
  );
}
