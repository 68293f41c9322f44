import { Spinner } from './button';

export function Loading({ label = 'Loading…' }: { label?: string }) {
  return (
    <div role="status" className="flex items-center gap-3 py-10 text-ink-soft">
      <Spinner className="h-5 w-5" />
      <span>{label}</span>
    </div>
  );
}
