import { useEffect, useId, useState } from 'react';
import { Button } from '../../../components/ui/button';
import { TextInput } from '../../../components/ui/field';
import { StatusBadge } from '../../../components/ui/status-badge';
import { usePlants } from '../api/get-plants';

const SEARCH_DELAY_MS = 300;

/**
 * Finds the plant the wood came from by its code (or variety, species, farm). The chosen
 * plant's id is what the form sends; its code is what the person sees.
 */
export function ParentPlantPicker({
  value,
  initialCode,
  excludeId,
  onChange,
  error,
  label = 'Parent plant',
}: {
  value: string | null;
  initialCode?: string | null;
  excludeId?: string;
  onChange: (plant: { id: string; code: string } | null) => void;
  error?: string;
  label?: string;
}) {
  const inputId = useId();
  const hintId = useId();
  const errorId = useId();
  const [draft, setDraft] = useState('');
  const [q, setQ] = useState('');
  const [chosenCode, setChosenCode] = useState<string | null>(value ? (initialCode ?? null) : null);

  useEffect(() => {
    const timer = window.setTimeout(() => setQ(draft.trim()), SEARCH_DELAY_MS);
    return () => window.clearTimeout(timer);
  }, [draft]);

  const results = usePlants({ q, sort: 'code', dir: 'asc', page: 1, pageSize: 8 }, { enabled: q.length >= 2 && !value });
  const items = (results.data?.items ?? []).filter((p) => p.id !== excludeId);

  if (value) {
    return (
      <div className="flex flex-col gap-1.5">
        <span className="font-medium">{label}</span>
        <div className="flex flex-wrap items-center gap-3 rounded-lg border-2 border-leaf/60 bg-leaf-light/50 px-3 py-2">
          <span className="font-semibold">{chosenCode ?? 'Chosen plant'}</span>
          <Button
            size="sm"
            variant="secondary"
            onClick={() => {
              onChange(null);
              setChosenCode(null);
            }}
          >
            Choose another plant
          </Button>
        </div>
      </div>
    );
  }

  return (
    <div className="flex flex-col gap-1.5">
      <label htmlFor={inputId} className="font-medium">
        {label}
      </label>
      <p id={hintId} className="text-sm text-ink-soft">
        The plant the wood came from. Type at least two letters of its code, e.g. BRK-0012.
      </p>
      <TextInput
        id={inputId}
        type="search"
        value={draft}
        autoComplete="off"
        aria-invalid={error ? true : undefined}
        aria-describedby={[hintId, error ? errorId : ''].filter(Boolean).join(' ')}
        onChange={(event) => setDraft(event.target.value)}
      />
      {error ? (
        <p id={errorId} className="text-sm font-medium text-rust">
          {error}
        </p>
      ) : null}
      {q.length >= 2 ? (
        <div aria-live="polite" className="flex flex-col gap-1">
          {results.isFetching && items.length === 0 ? <p className="text-sm text-ink-soft">Searching…</p> : null}
          {!results.isFetching && items.length === 0 ? <p className="text-sm text-ink-soft">No plant matches “{q}”.</p> : null}
          {items.length > 0 ? (
            <ul className="flex flex-col gap-1 rounded-lg border border-paper-edge bg-white p-1">
              {items.map((plant) => (
                <li key={plant.id}>
                  <button
                    type="button"
                    className="flex min-h-touch w-full flex-wrap items-center gap-x-3 gap-y-1 rounded px-3 py-1.5 text-left hover:bg-paper-deep"
                    onClick={() => {
                      setChosenCode(plant.code);
                      setDraft('');
                      onChange({ id: plant.id, code: plant.code });
                    }}
                  >
                    <span className="font-semibold">{plant.code}</span>
                    <span className="text-sm text-ink-soft">
                      {plant.varietyName ?? plant.speciesName} · {plant.farmName}
                    </span>
                    <StatusBadge status={plant.healthStatus} className="text-xs" />
                  </button>
                </li>
              ))}
            </ul>
          ) : null}
        </div>
      ) : null}
    </div>
  );
}
