import { cn } from '../../../lib/cn';
import { percent } from '../lib/round-facts';

/**
 * How much of what was asked a line (or a variety) gets: a bar for the eye, and the same
 * figure as words beside it, so nothing rests on the bar's length or colour alone.
 */
export function FillBar({ share, label, className }: { share: number; label?: string; className?: string }) {
  const width = Math.min(1, Math.max(0, share)) * 100;
  return (
    <div className={cn('flex items-center gap-3', className)}>
      <div aria-hidden="true" className="h-3 min-w-24 flex-1 overflow-hidden rounded-full border border-paper-edge bg-paper-deep">
        <div className={cn('h-full rounded-full', share >= 0.999 ? 'bg-leaf' : share > 0 ? 'bg-bark' : '')} style={{ width: `${width}%` }} />
      </div>
      <span className="w-28 shrink-0 text-sm font-semibold tabular-nums">{label ?? `${percent(share)} filled`}</span>
    </div>
  );
}
