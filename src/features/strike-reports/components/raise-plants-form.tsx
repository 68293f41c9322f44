import { zodResolver } from '@hookform/resolvers/zod';
import { useMemo } from 'react';
import { useForm } from 'react-hook-form';
import { LABELS, PLANT_ROLES, type PlantRole } from '../../../../shared/domain';
import type { MyBundles, RaisedPlant } from '../../../../shared/schemas/strike-reports';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Field, namedError, Select, TextArea, TextInput } from '../../../components/ui/field';
import { errorMessage } from '../../../lib/api-client';
import { applyServerFieldErrors } from '../../../lib/form-errors';
import { useRaisePlants } from '../api/raise-plants';
import { RAISE_FIELDS, raiseFormSchema, type RaiseBundle } from '../lib/forms';
import { numberOrUndefined } from '../lib/words';

export type RaiseFormBundle = RaiseBundle & { id: string; code: string | null; plant: { code: string }; farm: { name: string } };

const ROLE_HINTS: Record<PlantRole, string> = {
  stock_bed: 'kept for cutting wood',
  fruiting_bush: 'grown for fruit, gives some wood',
};

/**
 * "Raise plants": rooted cuttings of a bundle registered as new mother plants on one of the
 * grower's farms. The server numbers their codes, names the bundle's plant as their parent and
 * the bundle as their source.
 */
export function RaisePlantsForm({
  bundle,
  farms,
  thisYear = new Date().getFullYear(),
  onRaised,
  onChanged,
}: {
  bundle: RaiseFormBundle;
  farms: MyBundles['farms'];
  thisYear?: number;
  onRaised?: (plants: RaisedPlant[]) => void;
  onChanged?: () => void;
}) {
  const raise = useRaisePlants(onChanged);
  const schema = useMemo(() => raiseFormSchema(bundle), [bundle]);
  const form = useForm({
    resolver: zodResolver(schema),
    defaultValues: {
      farmId: farms.length === 1 ? farms[0].id : '',
      count: bundle.mayRaise > 0 ? bundle.mayRaise : undefined,
      role: '' as PlantRole,
      plantingYear: thisYear,
      bedRow: '',
      notes: undefined,
    },
  });
  const { errors } = form.formState;
  // The schema's own words for an empty choice ("not a valid id") are no help here.
  const farmError = errors.farmId ? (errors.farmId.type === 'server' && errors.farmId.message ? `Farm: ${errors.farmId.message}` : 'Farm: choose one from the list') : undefined;

  const onSubmit = form.handleSubmit(async (values) => {
    try {
      const result = await raise.mutateAsync({ bundleId: bundle.id, input: values });
      onRaised?.(result.items);
    } catch (error) {
      applyServerFieldErrors(error, form.setError, RAISE_FIELDS);
    }
  });

  return (
    <form noValidate onSubmit={onSubmit} className="flex flex-col gap-4" aria-label={`Raise plants from bundle ${bundle.code ?? ''}`.trim()}>
      {raise.isError ? <Alert tone="danger">{errorMessage(raise.error)}</Alert> : null}
      <div className="grid gap-4 sm:grid-cols-2">
        <Field label="Farm" hint="Where the new plants stand: a farm you work on." error={farmError}>
          <Select {...form.register('farmId')}>
            {farms.length !== 1 ? <option value="">Choose a farm…</option> : null}
            {farms.map((f) => (
              <option key={f.id} value={f.id}>
                {f.name} ({f.code})
              </option>
            ))}
          </Select>
        </Field>
        <Field label="Number of plants" hint={`Up to ${bundle.mayRaise}: rooted cuttings not yet registered.`} error={namedError('Number of plants', errors.count?.message)}>
          <TextInput type="number" inputMode="numeric" min={1} max={bundle.mayRaise} step={1} {...form.register('count', { setValueAs: numberOrUndefined })} />
        </Field>
        <Field label="Role" error={namedError('Role', errors.role?.message)}>
          <Select {...form.register('role')}>
            <option value="">Choose a role…</option>
            {PLANT_ROLES.map((r) => (
              <option key={r} value={r}>
                {LABELS.plantRole[r]} ({ROLE_HINTS[r]})
              </option>
            ))}
          </Select>
        </Field>
        <Field label="Planting year" error={namedError('Planting year', errors.plantingYear?.message)}>
          <TextInput inputMode="numeric" maxLength={4} autoComplete="off" {...form.register('plantingYear', { setValueAs: numberOrUndefined })} />
        </Field>
        <Field label="Bed / row" optional hint="The same for every plant; give each its own position later on its page or the map." error={namedError('Bed/row', errors.bedRow?.message)}>
          <TextInput autoComplete="off" {...form.register('bedRow')} />
        </Field>
        <Field
          label="Notes"
          optional
          hint={`Left empty: “Raised from bundle ${bundle.code ?? ''} of ${bundle.plant.code} (${bundle.farm.name}).”`}
          error={namedError('Notes', errors.notes?.message)}
        >
          <TextArea rows={2} {...form.register('notes', { setValueAs: (v: unknown) => (typeof v === 'string' && v.trim() ? v : undefined) })} />
        </Field>
      </div>
      <div>
        <Button type="submit" busy={raise.isPending}>
          Register the plants
        </Button>
      </div>
    </form>
  );
}
