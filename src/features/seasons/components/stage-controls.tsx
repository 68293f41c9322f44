import { useState } from 'react';
import { LABELS } from '../../../../shared/domain';
import type { Season } from '../../../../shared/schemas/seasons';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { StatusBadge } from '../../../components/ui/status-badge';
import { errorMessage } from '../../../lib/api-client';
import { useMoveSeasonStage } from '../api/move-season-stage';
import { nextMoves, type StageMove } from '../lib/season-facts';

/** The coordinator's stage buttons: only the moves the rules allow, each confirmed first. */
export function StageControls({ season, onMoved }: { season: Season; onMoved?: () => void }) {
  const move = useMoveSeasonStage();
  const [pending, setPending] = useState<StageMove | null>(null);
  const moves = nextMoves(season.stage);

  const confirm = async () => {
    if (!pending) return;
    try {
      await move.mutateAsync({ seasonId: season.id, stage: pending.to });
      setPending(null);
      onMoved?.();
    } catch {
      // Shown in the dialog from the mutation's error.
    }
  };

  if (moves.length === 0) {
    return <p className="text-ink-soft">The season is closed. It cannot move to another stage.</p>;
  }

  return (
    <div className="flex flex-col gap-3">
      <p>
        Now: <StatusBadge status={season.stage} />
      </p>
      <div className="flex flex-wrap gap-3">
        {moves.map((m) => (
          <Button
            key={m.to}
            variant={m.backwards ? 'secondary' : 'primary'}
            onClick={() => {
              move.reset();
              setPending(m);
            }}
          >
            {m.label}
          </Button>
        ))}
      </div>
      <Dialog open={pending !== null} onClose={() => setPending(null)} title={pending ? `${pending.label}?` : ''}>
        {pending ? (
          <div className="flex flex-col gap-4">
            <p>
              {season.name} moves from <strong>{LABELS.seasonStage[season.stage]}</strong> to <strong>{LABELS.seasonStage[pending.to]}</strong>.
            </p>
            <p className="rounded-lg bg-paper-deep px-4 py-3">{pending.allows}</p>
            {move.isError ? <Alert tone="danger">{errorMessage(move.error)}</Alert> : null}
            <div className="flex flex-wrap gap-3">
              <Button onClick={confirm} busy={move.isPending}>
                Yes, {pending.label.charAt(0).toLowerCase() + pending.label.slice(1)}
              </Button>
              <Button variant="secondary" onClick={() => setPending(null)}>
                Cancel
              </Button>
            </div>
          </div>
        ) : null}
      </Dialog>
    </div>
  );
}
