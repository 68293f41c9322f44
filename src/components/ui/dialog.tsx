import { useEffect, useId, useRef, type ReactNode } from 'react';

/**
 * A modal built on <dialog>: the browser gives focus trapping, Escape to close and a
 * backdrop, so nothing here reimplements them.
 */
export function Dialog({
  open,
  onClose,
  title,
  children,
}: {
  open: boolean;
  onClose: () => void;
  title: string;
  children: ReactNode;
}) {
  const ref = useRef<HTMLDialogElement>(null);
  const titleId = useId();

  useEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    if (open && !dialog.open) {
      if (typeof dialog.showModal === 'function') dialog.showModal();
      else dialog.setAttribute('open', '');
    } else if (!open && dialog.open) {
      // Older engines (and jsdom) have no close(): drop the attribute instead.
      if (typeof dialog.close === 'function') dialog.close();
      else dialog.removeAttribute('open');
    }
  }, [open]);

  return (
    <dialog
      ref={ref}
      aria-labelledby={titleId}
      onClose={onClose}
      className="m-auto w-[min(32rem,calc(100vw-2rem))] rounded-card border border-paper-edge bg-paper p-0 text-ink shadow-xl backdrop:bg-ink/40"
    >
      {open ? (
        <div className="p-6">
          <h2 id={titleId} className="mb-4 text-xl font-semibold">
            {title}
          </h2>
          {children}
        </div>
      ) : null}
    </dialog>
  );
}
