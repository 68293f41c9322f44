import { useMemo, useState } from 'react';
import { REASON_TEXT, type RoundLine } from '../../../../shared/schemas/allocation';
import { Button } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { count, km, liveBundles, woodName } from '../lib/round-facts';
import { FillBar } from './fill-bar';
import { LockMark } from './lock-mark';
import { useRoundContext } from './round-context';

function ReasonNote({ line }: { line: RoundLine }) {
  if (line.reason === 'filled') return null;
  const none = line.allocated === 0;
  return (
    <p className="mt-3 flex items-start gap-2 rounded-lg bg-amber-light/70 px-3 py-2">
      <svg width="14" height="14" viewBox="0 0 14 14" aria-hidden="true" focusable="false" className="mt-1 shrink-0 text-amber">
        <polygon points="7,0.8 13.4,12.6 0.6,12.6" fill="currentColor" />
      </svg>
      <span>
        {none ? <span className="font-semibold">Gets nothing: </span> : null}
        {REASON_TEXT[line.reason]}
      </span>
    </p>
  );
}

function LineItem({ line }: { line: RoundLine }) {
  const { round, editable, askAdd } = useRoundContext();
  const bundles = liveBundles(round).filter((b) => b.lineId === line.lineId);
  return (
    <li className="rounded-card border border-paper-edge bg-white/70 p-4" data-testid="request-line">
      <div className="flex flex-wrap items-start justify-between gap-x-4 gap-y-1">
        <div className="min-w-0">
          <p className="font-semibold">{line.growerName}</p>
          <p>
            {woodName(line.speciesName, line.varietyName)}
            {line.varietyName && line.substitutesAllowed ? <span className="text-ink-soft"> · other varieties welcome</span> : null}
          </p>
          <p className="text-sm text-ink-soft">Travels up to {km(line.maxDistanceKm)}</p>
        </div>
        <p className="tabular-nums">
          <span className="font-semibold">{count(line.allocated)}</span> of {count(line.asked)} cuttings
        </p>
      </div>
      <FillBar share={line.fill} className="mt-3" />
      {bundles.length > 0 ? (
        <ul className="mt-3 flex flex-col gap-1.5" aria-label={`Where ${line.growerName}'s ${line.speciesName} comes from`}>
          {bundles.map((b) => (
            <li key={b.id} className="flex flex-wrap items-center gap-x-2 gap-y-1 text-sm">
              <span className="font-semibold tabular-nums">{count(b.cuttings)}</span>
              <span>
                from <span className="font-mono font-semibold">{b.plantCode}</span>
                {b.varietyName !== line.varietyName && b.varietyName ? ` (‘${b.varietyName}’)` : ''} at {b.farmName}, {km(b.distanceKm)}
              </span>
              {b.locked ? <LockMark /> : null}
            </li>
          ))}
        </ul>
      ) : null}
      <ReasonNote line={line} />
      {editable && line.allocated < line.asked ? (
        <Button variant="secondary" size="sm" className="mt-3" onClick={() => askAdd(line)}>
          Add a bundle for this line
        </Button>
      ) : null}
    </li>
  );
}

/** Every filed request line: what it gets, from where, how far, and why it gets less. */
export function RequestLines() {
  const { round } = useRoundContext();
  const [onlyShort, setOnlyShort] = useState(false);
  const lines = useMemo(
    () =>
      [...round.lines].sort(
        (a, b) => a.growerName.localeCompare(b.growerName) || a.speciesName.localeCompare(b.speciesName) || (a.varietyName ?? '').localeCompare(b.varietyName ?? ''),
      ),
    [round.lines],
  );
  const full = lines.filter((l) => l.allocated >= l.asked).length;
  const shown = onlyShort ? lines.filter((l) => l.allocated < l.asked) : lines;

  if (lines.length === 0) {
    return <EmptyState title="No request lines">No grower has filed a request in this season, so there is nothing to share out.</EmptyState>;
  }
  return (
    <div>
      <div className="mb-4 flex flex-wrap items-center justify-between gap-3">
        <p>
          <span className="font-semibold">{count(full)}</span> of {count(lines.length)} lines filled in full.
        </p>
        <label className="inline-flex min-h-touch cursor-pointer items-center gap-2">
          <input type="checkbox" className="h-5 w-5 accent-leaf" checked={onlyShort} onChange={(e) => setOnlyShort(e.target.checked)} />
          Only lines that get less than asked
        </label>
      </div>
      {shown.length === 0 ? (
        <p className="rounded-lg bg-leaf-light px-4 py-3">Every line gets all it asked for.</p>
      ) : (
        <ul className="grid gap-3 xl:grid-cols-2" aria-label="Request lines">
          {shown.map((line) => (
            <LineItem key={line.lineId} line={line} />
          ))}
        </ul>
      )}
    </div>
  );
}
