import { cloneElement, useId, type ComponentProps, type ReactElement, type ReactNode } from 'react';
import { cn } from '../../lib/cn';

const control =
  'block w-full min-h-touch rounded-lg border-2 border-paper-edge bg-white px-3 py-2 text-base text-ink ' +
  'placeholder:text-ink-faint focus:border-leaf aria-[invalid=true]:border-rust';

type ControlA11y = { id?: string; 'aria-invalid'?: boolean; 'aria-describedby'?: string };

/**
 * Label, control and messages, tied together by ids so a screen reader reads the label,
 * the hint and the error with the control. The error text comes from the schema and names
 * the field ("E-mail is required").
 */
export function Field({
  label,
  hint,
  error,
  optional,
  children,
  className,
}: {
  label: string;
  hint?: ReactNode;
  error?: string;
  optional?: boolean;
  children: ReactElement<ControlA11y>;
  className?: string;
}) {
  const id = useId();
  const hintId = hint ? `${id}-hint` : undefined;
  const errorId = error ? `${id}-error` : undefined;
  const describedBy = [hintId, errorId].filter(Boolean).join(' ') || undefined;

  return (
    <div className={cn('flex flex-col gap-1.5', className)}>
      <label htmlFor={id} className="font-medium text-ink">
        {label}
        {optional ? <span className="ml-1 font-normal text-ink-faint">(optional)</span> : null}
      </label>
      {hint ? (
        <p id={hintId} className="text-sm text-ink-soft">
          {hint}
        </p>
      ) : null}
      {cloneElement(children, { id, 'aria-invalid': error ? true : undefined, 'aria-describedby': describedBy })}
      {error ? (
        <p id={errorId} className="flex items-start gap-1.5 text-sm font-medium text-rust">
          <svg width="14" height="14" viewBox="0 0 14 14" aria-hidden="true" focusable="false" className="mt-0.5 shrink-0">
            <polygon points="4,0.5 10,0.5 13.5,4 13.5,10 10,13.5 4,13.5 0.5,10 0.5,4" fill="currentColor" />
          </svg>
          {error}
        </p>
      ) : null}
    </div>
  );
}

export function TextInput({ className, ...rest }: ComponentProps<'input'>) {
  return <input className={cn(control, className)} {...rest} />;
}

export function TextArea({ className, rows = 4, ...rest }: ComponentProps<'textarea'>) {
  return <textarea rows={rows} className={cn(control, 'min-h-24', className)} {...rest} />;
}

export function Select({ className, ...rest }: ComponentProps<'select'>) {
  return <select className={cn(control, 'pr-8', className)} {...rest} />;
}

export { control as controlClasses };

/**
 * An error message that names its field. Schema messages usually do ("Latitude must be a
 * number"); a terse server message ("at most 59") gets the label in front.
 */
export function namedError(label: string, message: string | undefined): string | undefined {
  if (!message) return undefined;
  const words = label.toLowerCase().split(/[^a-z]+/).filter((word) => word.length > 3);
  const lower = message.toLowerCase();
  return words.some((word) => lower.includes(word.slice(0, Math.max(4, word.length - 1)))) ? message : `${label}: ${message}`;
}
