import { Field, Select } from '../../../components/ui/field';

export type FarmOption = { id: string; name: string };

/** Which farm's collections to show, when the person may see more than one. */
export function FarmPicker({ farms, value, onChange }: { farms: FarmOption[]; value: string; onChange: (farmId: string) => void }) {
  return (
    <Field label="Farm" className="max-w-sm">
      <Select value={value} onChange={(e) => onChange(e.target.value)}>
        {value ? null : <option value="">Choose a farm</option>}
        {farms.map((f) => (
          <option key={f.id} value={f.id}>
            {f.name}
          </option>
        ))}
      </Select>
    </Field>
  );
}
