import { HEALTH_STATUSES, LABELS, type HealthStatus } from '../../../../shared/domain';
import { Field, Select } from '../../../components/ui/field';
import type { MapFarm, MapFilters } from '../api/types';

export type SpeciesOption = { id: string; commonName: string; varieties: { id: string; name: string }[] };

type Props = {
  filters: MapFilters;
  species: SpeciesOption[];
  farms: MapFarm[];
  onChange: (next: MapFilters) => void;
};

/** Which plants the map shows: by species, variety, health status and farm. */
export function MapFiltersBar({ filters, species, farms, onChange }: Props) {
  const chosen = species.find((s) => s.id === filters.speciesId);
  return (
    <form role="search" aria-label="Filter the map" className="grid grid-cols-2 gap-3 lg:grid-cols-4" onSubmit={(e) => e.preventDefault()}>
      <Field label="Species">
        <Select value={filters.speciesId ?? ''} onChange={(e) => onChange({ ...filters, speciesId: e.target.value || undefined, varietyId: undefined })}>
          <option value="">All species</option>
          {species.map((s) => (
            <option key={s.id} value={s.id}>
              {s.commonName}
            </option>
          ))}
        </Select>
      </Field>
      <Field label="Variety">
        <Select
          value={filters.varietyId ?? ''}
          disabled={!chosen}
          onChange={(e) => onChange({ ...filters, varietyId: e.target.value || undefined })}
        >
          <option value="">{chosen ? 'All varieties' : 'Choose a species first'}</option>
          {chosen?.varieties.map((v) => (
            <option key={v.id} value={v.id}>
              {v.name}
            </option>
          ))}
        </Select>
      </Field>
      <Field label="Health">
        <Select value={filters.status ?? ''} onChange={(e) => onChange({ ...filters, status: (e.target.value || undefined) as HealthStatus | undefined })}>
          <option value="">Every status</option>
          {HEALTH_STATUSES.map((s) => (
            <option key={s} value={s}>
              {LABELS.health[s]}
            </option>
          ))}
        </Select>
      </Field>
      <Field label="Farm">
        <Select value={filters.farmId ?? ''} onChange={(e) => onChange({ ...filters, farmId: e.target.value || undefined })}>
          <option value="">All farms</option>
          {farms.map((f) => (
            <option key={f.id} value={f.id}>
              {f.name}
            </option>
          ))}
        </Select>
      </Field>
    </form>
  );
}
