import { cn } from '../../../lib/cn';

/**
 * Marks a finding (or a catalogue entry) that travels in cutting wood: a diamond with a bar
 * and the words, never colour alone. Such a finding puts the plant on hold.
 */
export function TravelsInWoodMark({ className }: { className?: string }) {
  return (
    <span className={cn('inline-flex items-center gap-1.5 whitespace-nowrap rounded-full border border-rust/50 bg-rust-light px-2.5 py-0.5 text-sm font-medium', className)}>
      <svg width="14" height="14" viewBox="0 0 14 14" aria-hidden="true" focusable="false" className="shrink-0 text-rust" data-shape="diamond">
        <polygon points="7,0.5 13.5,7 7,13.5 0.5,7" fill="currentColor" />
        <rect x="3.5" y="6" width="7" height="2" fill="white" />
      </svg>
      <span className="text-ink">Travels in cutting wood</span>
    </span>
  );
}

export function StaysOutOfWoodNote() {
  return <span className="text-sm text-ink-soft">Does not travel in wood</span>;
}
