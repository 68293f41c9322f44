import { useEffect, useId, useState } from 'react';
import { HEALTH_STATUSES, LABELS, PLANT_ROLES, type HealthStatus, type PlantRole } from '../../../../shared/domain';
import type { Species } from '../../../../shared/schemas/register';
import { Button } from '../../../components/ui/button';
import { Select, TextInput } from '../../../components/ui/field';
import { STATUS_LOOKS, StatusShapeIcon } from '../../../components/ui/status-badge';
import { cn } from '../../../lib/cn';
import type { PlantListParams } from '../api/keys';
import { activeFilterCount } from '../api/plant-params';
import { INSPECTED_LABELS } from './words';

export type FarmOption = { id: string; name: string; code: string };

const SEARCH_DELAY_MS = 350;

function YearInput({ label, value, onCommit }: { label: string; value: number | undefined; onCommit: (year: number | undefined) => void }) {
  const id = useId();
  const [draft, setDraft] = useState(value ? String(value) : '');
  useEffect(() => setDraft(value ? String(value) : ''), [value]);
  return (
    <div className="flex min-w-0 flex-1 flex-col gap-1.5">
      <label htmlFor={id} className="text-sm font-medium">
        {label}
      </label>
      <TextInput
        id={id}
        inputMode="numeric"
        placeholder="yyyy"
        maxLength={4}
        value={draft}
        onChange={(event) => {
          const next = event.target.value.replace(/\D/g, '');
          setDraft(next);
          // Only a whole year, or nothing, narrows the list; "20" is still being typed.
          if (next === '') onCommit(undefined);
          else if (next.length === 4) onCommit(Number(next));
        }}
      />
    </div>
  );
}

export function PlantFilters({
  params,
  onChange,
  farms,
  species,
  showMine,
}: {
  params: PlantListParams;
  onChange: (next: Partial<PlantListParams>) => void;
  farms: FarmOption[];
  species: Species[];
  /** Only people who work on a farm get "my farms only". */
  showMine: boolean;
}) {
  const ids = { search: useId(), farm: useId(), species: useId(), variety: useId(), role: useId(), inspected: useId(), panel: useId() };
  const [draft, setDraft] = useState(params.q ?? '');
  const count = activeFilterCount(params);
  const [open, setOpen] = useState(count - (params.q ? 1 : 0) > 0);

  // Going back in history changes the URL's q: show it in the box.
  useEffect(() => {
    setDraft((current) => (current.trim() === (params.q ?? '') ? current : (params.q ?? '')));
  }, [params.q]);

  // Search as the person types, but ask the server only once they pause.
  useEffect(() => {
    const q = draft.trim();
    if (q === (params.q ?? '')) return;
    const timer = window.setTimeout(() => onChange({ q: q || undefined, page: 1 }), SEARCH_DELAY_MS);
    return () => window.clearTimeout(timer);
  }, [draft, params.q, onChange]);

  const chosenSpecies = species.find((s) => s.id === params.speciesId);
  const toggleStatus = (status: HealthStatus) => {
    const current = new Set(params.status ?? []);
    if (current.has(status)) current.delete(status);
    else current.add(status);
    onChange({ status: current.size ? HEALTH_STATUSES.filter((s) => current.has(s)) : undefined, page: 1 });
  };

  return (
    <section aria-label="Filters" className="mb-5 rounded-card border border-paper-edge bg-white/60 p-4">
      <form role="search" onSubmit={(event) => event.preventDefault()} className="flex flex-col gap-3 sm:flex-row sm:items-end">
        <div className="flex flex-1 flex-col gap-1.5">
          <label htmlFor={ids.search} className="font-medium">
            Search by code, variety, species or farm
          </label>
          <TextInput id={ids.search} type="search" value={draft} maxLength={100} placeholder="e.g. WTH-0012, or a variety" onChange={(event) => setDraft(event.target.value)} />
        </div>
        <Button
          variant="secondary"
          className="lg:hidden"
          aria-expanded={open}
          aria-controls={ids.panel}
          onClick={() => setOpen((value) => !value)}
        >
          {open ? 'Hide filters' : count > 0 ? `Filters (${count} on)` : 'More filters'}
        </Button>
      </form>

      <div id={ids.panel} className={cn('mt-4 flex-col gap-4 lg:flex', open ? 'flex' : 'hidden')}>
        <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
          <div className="flex flex-col gap-1.5">
            <label htmlFor={ids.farm} className="text-sm font-medium">
              Farm
            </label>
            <Select id={ids.farm} value={params.farmId ?? ''} onChange={(event) => onChange({ farmId: event.target.value || undefined, page: 1 })}>
              <option value="">All farms</option>
              {farms.map((farm) => (
                <option key={farm.id} value={farm.id}>
                  {farm.name} ({farm.code})
                </option>
              ))}
            </Select>
          </div>
          <div className="flex flex-col gap-1.5">
            <label htmlFor={ids.species} className="text-sm font-medium">
              Species
            </label>
            <Select
              id={ids.species}
              value={params.speciesId ?? ''}
              // A variety belongs to one species: changing the species clears it.
              onChange={(event) => onChange({ speciesId: event.target.value || undefined, varietyId: undefined, page: 1 })}
            >
              <option value="">All species</option>
              {species.map((s) => (
                <option key={s.id} value={s.id}>
                  {s.commonName}
                </option>
              ))}
            </Select>
          </div>
          <div className="flex flex-col gap-1.5">
            <label htmlFor={ids.variety} className="text-sm font-medium">
              Variety
            </label>
            <Select
              id={ids.variety}
              value={params.varietyId ?? ''}
              disabled={!chosenSpecies}
              aria-describedby={!chosenSpecies ? `${ids.variety}-hint` : undefined}
              onChange={(event) => onChange({ varietyId: event.target.value || undefined, page: 1 })}
            >
              <option value="">{chosenSpecies ? 'All varieties' : 'Choose a species first'}</option>
              {chosenSpecies?.varieties.map((v) => (
                <option key={v.id} value={v.id}>
                  {v.name}
                </option>
              ))}
            </Select>
            {!chosenSpecies ? (
              <span id={`${ids.variety}-hint`} className="sr-only">
                Choose a species first to pick one of its varieties.
              </span>
            ) : null}
          </div>
          <div className="flex flex-col gap-1.5">
            <label htmlFor={ids.role} className="text-sm font-medium">
              Role
            </label>
            <Select id={ids.role} value={params.role ?? ''} onChange={(event) => onChange({ role: (event.target.value || undefined) as PlantRole | undefined, page: 1 })}>
              <option value="">Any role</option>
              {PLANT_ROLES.map((role) => (
                <option key={role} value={role}>
                  {LABELS.plantRole[role]}
                </option>
              ))}
            </Select>
          </div>
          <div className="flex flex-col gap-1.5">
            <label htmlFor={ids.inspected} className="text-sm font-medium">
              Last inspection
            </label>
            <Select
              id={ids.inspected}
              value={params.inspected ?? ''}
              onChange={(event) => onChange({ inspected: (event.target.value || undefined) as PlantListParams['inspected'], page: 1 })}
            >
              <option value="">Any time</option>
              {(Object.keys(INSPECTED_LABELS) as Array<keyof typeof INSPECTED_LABELS>).map((key) => (
                <option key={key} value={key}>
                  {INSPECTED_LABELS[key]}
                </option>
              ))}
            </Select>
          </div>
          <fieldset className="flex gap-3 sm:col-span-1">
            <legend className="sr-only">Planting year</legend>
            <YearInput label="Planted from" value={params.yearFrom} onCommit={(yearFrom) => onChange({ yearFrom, page: 1 })} />
            <YearInput label="Planted to" value={params.yearTo} onCommit={(yearTo) => onChange({ yearTo, page: 1 })} />
          </fieldset>
          {showMine ? (
            <label className="flex min-h-touch items-center gap-3 self-end rounded-lg border-2 border-paper-edge bg-white px-3 font-medium">
              <input
                type="checkbox"
                className="h-5 w-5 accent-leaf"
                checked={params.mine ?? false}
                onChange={(event) => onChange({ mine: event.target.checked || undefined, page: 1 })}
              />
              Only my farms
            </label>
          ) : null}
        </div>
        <div className="flex flex-col gap-3 sm:flex-row sm:items-end sm:justify-between">
          <div role="group" aria-label="Health status" className="flex flex-col gap-1.5">
            <span aria-hidden="true" className="text-sm font-medium">
              Health status
            </span>
            <div className="flex flex-wrap gap-2">
              {HEALTH_STATUSES.map((status) => {
                const selected = params.status?.includes(status) ?? false;
                const look = STATUS_LOOKS[status];
                return (
                  <button
                    key={status}
                    type="button"
                    aria-pressed={selected}
                    onClick={() => toggleStatus(status)}
                    className={cn(
                      'inline-flex min-h-touch items-center gap-2 rounded-full border-2 px-4 font-medium',
                      selected ? 'border-currant bg-currant text-white' : 'border-paper-edge bg-white text-ink hover:border-bark-light',
                    )}
                  >
                    <StatusShapeIcon shape={look.shape} />
                    {look.label}
                  </button>
                );
              })}
            </div>
          </div>
          {count > 0 ? (
            <Button
              variant="quiet"
              onClick={() => {
                setDraft('');
                onChange({
                  q: undefined,
                  farmId: undefined,
                  speciesId: undefined,
                  varietyId: undefined,
                  status: undefined,
                  role: undefined,
                  yearFrom: undefined,
                  yearTo: undefined,
                  inspected: undefined,
                  mine: undefined,
                  page: 1,
                });
              }}
            >
              Clear all filters
            </Button>
          ) : null}
        </div>
      </div>
    </section>
  );
}
