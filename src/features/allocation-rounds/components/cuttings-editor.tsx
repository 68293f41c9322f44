import { useEffect, useId, useState } from 'react';
import type { RoundBundle } from '../../../../shared/schemas/allocation';
import { Button } from '../../../components/ui/button';
import { errorMessage, isApiError } from '../../../lib/api-client';
import { useEditBundle } from '../api/edit-bundle';
import { count } from '../lib/round-facts';
import { useRoundContext } from './round-context';

/**
 * A bundle's cuttings, changed in place. The server checks the plant's free wood, its health,
 * the distance and the line's size; what it refuses is shown under the box in its own words.
 */
export function CuttingsEditor({ bundle }: { bundle: RoundBundle }) {
  const { round, editable } = useRoundContext();
  const edit = useEditBundle();
  const [value, setValue] = useState(String(bundle.cuttings));
  const errorId = useId();
  useEffect(() => setValue(String(bundle.cuttings)), [bundle.cuttings]);

  if (!editable) return <span className="font-semibold tabular-nums">{count(bundle.cuttings)}</span>;

  const n = Number(value);
  const valid = value.trim() !== '' && Number.isInteger(n) && n >= 1;
  const changed = valid && n !== bundle.cuttings;
  const problem = edit.isError
    ? isApiError(edit.error) && edit.error.fields.cuttings
      ? `${edit.error.message}`
      : errorMessage(edit.error)
    : value.trim() !== '' && !valid
      ? 'A whole number, at least 1 (remove the bundle instead of 0).'
      : null;

  const save = () => {
    if (!changed) return;
    edit.mutate({ roundId: round.id, bundleId: bundle.id, cuttings: n });
  };

  return (
    <form
      className="flex flex-col gap-1.5"
      onSubmit={(event) => {
        event.preventDefault();
        save();
      }}
    >
      <div className="flex items-center gap-2">
        <input
          type="number"
          inputMode="numeric"
          min={1}
          step={1}
          value={value}
          onChange={(event) => {
            edit.reset();
            setValue(event.target.value);
          }}
          aria-label={`Cuttings from ${bundle.plantCode} for ${bundle.growerName}`}
          aria-invalid={problem ? true : undefined}
          aria-describedby={problem ? errorId : undefined}
          className="block min-h-touch w-24 rounded-lg border-2 border-paper-edge bg-white px-3 py-2 text-base tabular-nums text-ink focus:border-leaf aria-[invalid=true]:border-rust"
        />
        {changed ? (
          <Button type="submit" size="sm" busy={edit.isPending}>
            Save
          </Button>
        ) : null}
      </div>
      {problem ? (
        <p id={errorId} role="alert" className="max-w-64 text-sm font-medium text-rust">
          {problem}
        </p>
      ) : null}
    </form>
  );
}
