import { zodResolver } from '@hookform/resolvers/zod';
import { useEffect } from 'react';
import { useForm, useWatch, type FieldError, type Resolver } from 'react-hook-form';
import { LABELS, PLANT_ROLES, PROVENANCES, type PlantRole, type Provenance } from '../../../../shared/domain';
import { plantCreateSchema, plantUpdateSchema, type PlantDetail, type PlantUpdate, type Species } from '../../../../shared/schemas/register';
import { Alert } from '../../../components/ui/alert';
import { Button, ButtonLink } from '../../../components/ui/button';
import { Card, CardTitle } from '../../../components/ui/card';
import { Field, Select, TextArea, TextInput } from '../../../components/ui/field';
import { errorMessage } from '../../../lib/api-client';
import { applyServerFieldErrors } from '../../../lib/form-errors';
import { useCreatePlant } from '../api/create-plant';
import { useUpdatePlant } from '../api/update-plant';
import { ParentPlantPicker } from './parent-plant-picker';
import type { FarmOption } from './plant-filters';
import { PositionHelpers } from './position-fields';
import { named, PROVENANCE_LABELS } from './words';

export type PlantFormValues = {
  farmId: string;
  speciesId: string;
  varietyId: string | null;
  code?: string;
  plantingYear: number;
  role: PlantRole;
  provenance: Provenance;
  parentPlantId: string | null;
  supplier: string | null;
  lat: number | null;
  lon: number | null;
  bedRow: string;
  notes: string;
  reason?: string;
};

const FIELDS = [
  'farmId',
  'speciesId',
  'varietyId',
  'code',
  'plantingYear',
  'role',
  'provenance',
  'parentPlantId',
  'supplier',
  'lat',
  'lon',
  'bedRow',
  'notes',
  'reason',
] as const;

const blankToNull = (value: unknown) => (typeof value === 'string' && value.trim() === '' ? null : value);
const toNumberOrNull = (value: unknown) => {
  if (value === '' || value == null) return null;
  return typeof value === 'number' ? value : Number(String(value).trim().replace(',', '.'));
};

/** A choice left empty fails the id check; say so in words that name the field. */
function choiceError(error: FieldError | undefined, label: string, empty: string): string | undefined {
  if (!error?.message) return undefined;
  if (error.type !== 'server' && /valid id/i.test(error.message)) return `${label}: ${empty}`;
  return named(label, error.message);
}

type Props =
  | { mode: 'create'; farms: FarmOption[]; species: Species[]; defaultFarmId?: string; onSaved: (plant: PlantDetail) => void; cancelHref: string }
  | { mode: 'edit'; plant: PlantDetail; species: Species[]; onSaved: (plant: PlantDetail) => void; cancelHref: string };

function initialValues(props: Props): Partial<PlantFormValues> {
  if (props.mode === 'edit') {
    const p = props.plant;
    return {
      speciesId: p.speciesId,
      varietyId: p.varietyId,
      plantingYear: p.plantingYear,
      role: p.role,
      provenance: p.provenance,
      parentPlantId: p.parent?.id ?? null,
      supplier: p.supplier ?? '',
      lat: p.lat,
      lon: p.lon,
      bedRow: p.bedRow ?? '',
      notes: p.notes ?? '',
      reason: '',
    };
  }
  const only = props.farms.length === 1 ? props.farms[0].id : undefined;
  const farmId = props.farms.some((f) => f.id === props.defaultFarmId) ? props.defaultFarmId : only;
  return {
    farmId: farmId ?? '',
    speciesId: '',
    varietyId: null,
    code: undefined,
    plantingYear: undefined,
    role: 'stock_bed',
    provenance: 'bought',
    parentPlantId: null,
    supplier: '',
    lat: null,
    lon: null,
    bedRow: '',
    notes: '',
  };
}

export function PlantForm(props: Props) {
  const { mode, species } = props;
  const create = useCreatePlant();
  const update = useUpdatePlant();
  const mutation = mode === 'create' ? create : update;
  const resolver = (mode === 'create' ? zodResolver(plantCreateSchema) : zodResolver(plantUpdateSchema)) as unknown as Resolver<PlantFormValues>;
  const form = useForm<PlantFormValues>({ resolver, defaultValues: initialValues(props) });
  const { errors, dirtyFields } = form.formState;

  const [farmId, speciesId, varietyId, provenance, parentPlantId, role] = useWatch({
    control: form.control,
    name: ['farmId', 'speciesId', 'varietyId', 'provenance', 'parentPlantId', 'role'],
  });
  const chosenSpecies = species.find((s) => s.id === speciesId);
  const farm = mode === 'create' ? props.farms.find((f) => f.id === farmId) : undefined;
  const roleChanged = mode === 'edit' && role !== props.plant.role;

  // A variety belongs to one species: a new species clears a variety that is not its own.
  useEffect(() => {
    if (varietyId && !chosenSpecies?.varieties.some((v) => v.id === varietyId)) {
      form.setValue('varietyId', null, { shouldDirty: true });
    }
  }, [chosenSpecies, varietyId, form]);

  const setPosition = (lat: number, lon: number) => {
    form.setValue('lat', lat, { shouldDirty: true, shouldValidate: true });
    form.setValue('lon', lon, { shouldDirty: true, shouldValidate: true });
  };

  const onSubmit = form.handleSubmit(async (values) => {
    try {
      if (props.mode === 'create') {
        const { reason: _reason, ...input } = values;
        const plant = await create.mutateAsync({
          ...input,
          code: input.code?.trim() ? input.code.trim() : undefined,
          supplier: input.provenance === 'bought' ? input.supplier || null : null,
          parentPlantId: input.provenance === 'exchange' ? input.parentPlantId : null,
        });
        props.onSaved(plant);
        return;
      }
      if (roleChanged && !values.reason?.trim()) {
        form.setError('reason', { type: 'manual', message: 'Reason: say why the role changes (it goes in the audit log)' });
        return;
      }
      // Send only what changed, so the audit log names the fields that really moved.
      const patch: PlantUpdate = {};
      const dirty = dirtyFields as Partial<Record<keyof PlantFormValues, unknown>>;
      const put = <K extends keyof PlantUpdate>(key: K, value: PlantUpdate[K]) => {
        patch[key] = value;
      };
      if (dirty.speciesId) put('speciesId', values.speciesId);
      if (dirty.varietyId || dirty.speciesId) put('varietyId', values.varietyId);
      if (dirty.plantingYear) put('plantingYear', values.plantingYear);
      if (dirty.role) put('role', values.role);
      if (dirty.provenance || dirty.parentPlantId) {
        put('provenance', values.provenance);
        put('parentPlantId', values.provenance === 'exchange' ? values.parentPlantId : null);
      }
      if (dirty.supplier || dirty.provenance) put('supplier', values.provenance === 'bought' ? values.supplier || null : null);
      if (dirty.lat || dirty.lon) {
        put('lat', values.lat);
        put('lon', values.lon);
      }
      if (dirty.bedRow) put('bedRow', values.bedRow);
      if (dirty.notes) put('notes', values.notes);
      if (values.reason?.trim()) put('reason', values.reason.trim());
      if (Object.keys(patch).filter((k) => k !== 'reason').length === 0) {
        props.onSaved(props.plant);
        return;
      }
      const plant = await update.mutateAsync({ id: props.plant.id, patch });
      props.onSaved(plant);
    } catch (error) {
      applyServerFieldErrors(error, form.setError, FIELDS);
    }
  });

  const numberField = { setValueAs: toNumberOrNull };

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5">
      {mutation.isError ? (
        <Alert tone="danger" title={mode === 'create' ? 'The plant was not added' : 'The changes were not saved'}>
          {errorMessage(mutation.error)}
        </Alert>
      ) : null}
      {Object.keys(errors).length > 0 && !mutation.isError ? (
        <Alert tone="danger">Some fields need attention; each one says what is wrong.</Alert>
      ) : null}

      <Card>
        <CardTitle>The plant</CardTitle>
        <div className="grid gap-5 md:grid-cols-2">
          {props.mode === 'create' ? (
            <Field label="Farm" error={choiceError(errors.farmId, 'Farm', 'choose the farm the plant stands on')}>
              <Select {...form.register('farmId')}>
                <option value="">Choose a farm…</option>
                {props.farms.map((f) => (
                  <option key={f.id} value={f.id}>
                    {f.name} ({f.code})
                  </option>
                ))}
              </Select>
            </Field>
          ) : null}
          {props.mode === 'create' ? (
            <Field
              label="Code"
              optional
              hint={`Leave empty to get the farm's next free number${farm ? ` (${farm.code}-…)` : ''}. Fill it in only to keep a code already on a label.`}
              error={named('Code', errors.code?.message)}
            >
              <TextInput autoComplete="off" autoCapitalize="characters" placeholder={farm ? `${farm.code}-…` : undefined} {...form.register('code', { setValueAs: (v) => (typeof v === 'string' && v.trim() ? v.trim() : undefined) })} />
            </Field>
          ) : null}
          <Field label="Species" error={choiceError(errors.speciesId, 'Species', 'choose a species')}>
            <Select {...form.register('speciesId')}>
              <option value="">Choose a species…</option>
              {species.map((s) => (
                <option key={s.id} value={s.id}>
                  {s.commonName} ({s.scientificName})
                </option>
              ))}
            </Select>
          </Field>
          <Field
            label="Variety"
            optional
            hint={!chosenSpecies ? 'Choose a species first.' : chosenSpecies.varieties.length === 0 ? 'This species has no varieties listed yet.' : undefined}
            error={choiceError(errors.varietyId, 'Variety', 'choose a variety from the list')}
          >
            <Select disabled={!chosenSpecies} {...form.register('varietyId', { setValueAs: blankToNull })}>
              <option value="">{chosenSpecies ? 'Not named' : 'Choose a species first'}</option>
              {chosenSpecies?.varieties.map((v) => (
                <option key={v.id} value={v.id}>
                  {v.name}
                </option>
              ))}
            </Select>
          </Field>
          <Field label="Planting year" error={named('Planting year', errors.plantingYear?.message)}>
            <TextInput inputMode="numeric" autoComplete="off" maxLength={4} placeholder="e.g. 2019" {...form.register('plantingYear', { setValueAs: (v) => (v === '' || v == null ? undefined : Number(v)) })} />
          </Field>
          <Field
            label="Role"
            hint="A stock bed can give nearly all its new growth each year; a fruiting bush only a part."
            error={named('Role', errors.role?.message)}
          >
            <Select {...form.register('role')}>
              {PLANT_ROLES.map((r) => (
                <option key={r} value={r}>
                  {LABELS.plantRole[r]}
                </option>
              ))}
            </Select>
          </Field>
          {roleChanged ? (
            <Field label="Why the role changes" hint="Kept in the plant's audit log." error={named('Reason', errors.reason?.message)} className="md:col-span-2">
              <TextArea rows={2} {...form.register('reason')} />
            </Field>
          ) : null}
        </div>
        {chosenSpecies?.restrictionNote ? (
          <Alert tone="warning" title={`Plant-health caution: ${chosenSpecies.commonName}`} className="mt-5">
            {chosenSpecies.restrictionNote}
          </Alert>
        ) : null}
      </Card>

      <Card>
        <CardTitle>Where it came from</CardTitle>
        <div className="grid gap-5 md:grid-cols-2">
          <Field label="Provenance" error={named('Provenance', errors.provenance?.message)}>
            <Select {...form.register('provenance')}>
              {PROVENANCES.map((p) => (
                <option key={p} value={p}>
                  {PROVENANCE_LABELS[p]}
                </option>
              ))}
            </Select>
          </Field>
          {provenance === 'bought' ? (
            <Field label="Supplier" optional error={named('Supplier', errors.supplier?.message)}>
              <TextInput autoComplete="off" {...form.register('supplier')} />
            </Field>
          ) : null}
          {provenance === 'exchange' ? (
            <div className="md:col-span-2">
              <ParentPlantPicker
                value={parentPlantId}
                initialCode={mode === 'edit' ? props.plant.parent?.code : undefined}
                excludeId={mode === 'edit' ? props.plant.id : undefined}
                error={choiceError(errors.parentPlantId, 'Parent plant', 'choose the plant the wood came from')}
                onChange={(picked) => form.setValue('parentPlantId', picked?.id ?? null, { shouldDirty: true, shouldValidate: form.formState.isSubmitted })}
              />
            </div>
          ) : null}
        </div>
      </Card>

      <Card>
        <CardTitle>Where it stands</CardTitle>
        <p className="mb-4 text-ink-soft">Optional now: you can place the plant later. Stand beside it to use your phone's position.</p>
        <div className="flex flex-col gap-5">
          <PositionHelpers onPosition={setPosition} />
          <div className="grid gap-5 sm:grid-cols-2">
            <Field label="Latitude" optional hint="Decimal degrees, e.g. 52.0712" error={named('Latitude', errors.lat?.message)}>
              <TextInput autoComplete="off" {...form.register('lat', numberField)} />
            </Field>
            <Field label="Longitude" optional hint="Decimal degrees, e.g. -2.5487 (west is negative)" error={named('Longitude', errors.lon?.message)}>
              <TextInput autoComplete="off" {...form.register('lon', numberField)} />
            </Field>
          </div>
          <Field label="Bed / row" optional hint="As the farm names it, e.g. “Bed 2, row 3, no. 7”." error={named('Bed/row', errors.bedRow?.message)}>
            <TextInput autoComplete="off" {...form.register('bedRow')} />
          </Field>
        </div>
      </Card>

      <Card>
        <Field label="Notes" optional error={named('Notes', errors.notes?.message)}>
          <TextArea rows={4} {...form.register('notes')} />
        </Field>
      </Card>

      <div className="flex flex-wrap gap-3">
        <Button type="submit" busy={mutation.isPending}>
          {mode === 'create' ? 'Add the plant' : 'Save changes'}
        </Button>
        <ButtonLink variant="secondary" to={props.cancelHref}>
          Cancel
        </ButtonLink>
      </div>
    </form>
  );
}
