import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { PROPAGATION_METHODS } from '../../../../shared/domain';
import { speciesSchema, type Species, type SpeciesInput } from '../../../../shared/schemas/register';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Field, TextArea, TextInput } from '../../../components/ui/field';
import { ApiError, errorMessage } from '../../../lib/api-client';
import { useCreateSpecies } from '../api/create-species';
import { useUpdateSpecies } from '../api/update-species';
import { METHOD_LABELS, named } from './words';

// The form shows the reference strike rate as a percentage; the API keeps a fraction.
export const speciesFormSchema = speciesSchema.omit({ strikeRatePrior: true }).extend({
  strikeRatePercent: z
    .number({ error: 'Strike rate must be a number' })
    .gt(0, 'Strike rate is between 0 and 100 %')
    .lt(100, 'Strike rate is between 0 and 100 %'),
});
type FormInput = z.input<typeof speciesFormSchema>;

const toNumber = (value: unknown) => (value === '' || value == null ? undefined : Number(String(value).replace(',', '.')));

function defaults(species?: Species): Partial<FormInput> {
  if (!species) {
    return {
      scientificName: '',
      commonName: '',
      genus: '',
      propagationMethods: ['hardwood'],
      defaultCuttingLengthCm: 20,
      defaultCuttingDiameterMm: 6,
      softTipCm: 10,
      strikeRatePercent: 70,
      priorStrength: 20,
      shadeTolerant: false,
      firstCropYears: 3,
      restrictionNote: '',
      notes: '',
    };
  }
  const { strikeRatePrior, varieties: _v, id: _id, ...rest } = species;
  return { ...rest, restrictionNote: rest.restrictionNote ?? '', notes: rest.notes ?? '', strikeRatePercent: Math.round(strikeRatePrior * 1000) / 10 };
}

const SERVER_FIELD: Record<string, keyof FormInput> = { strikeRatePrior: 'strikeRatePercent' };

export function SpeciesForm({ species, onDone }: { species?: Species; onDone: () => void }) {
  const create = useCreateSpecies();
  const update = useUpdateSpecies();
  const mutation = species ? update : create;
  const form = useForm<FormInput, unknown, z.output<typeof speciesFormSchema>>({ resolver: zodResolver(speciesFormSchema), defaultValues: defaults(species) });
  const { errors } = form.formState;

  const onSubmit = form.handleSubmit(async ({ strikeRatePercent, ...values }) => {
    const input: SpeciesInput = {
      ...values,
      strikeRatePrior: Math.round(strikeRatePercent * 10) / 1000,
      restrictionNote: values.restrictionNote?.trim() ? values.restrictionNote : null,
      notes: values.notes?.trim() ? values.notes : null,
    };
    try {
      if (species) await update.mutateAsync({ id: species.id, patch: input });
      else await create.mutateAsync(input);
      onDone();
    } catch (error) {
      if (error instanceof ApiError) {
        for (const [name, message] of Object.entries(error.fields)) {
          const field = SERVER_FIELD[name] ?? name;
          if (field in (defaults() as object)) form.setError(field as keyof FormInput, { type: 'server', message });
        }
      }
    }
  });

  const num = { setValueAs: toNumber };

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5">
      {mutation.isError ? <Alert tone="danger">{errorMessage(mutation.error)}</Alert> : null}
      <div className="grid gap-4 md:grid-cols-3">
        <Field label="Common name" error={named('Common name', errors.commonName?.message)}>
          <TextInput {...form.register('commonName')} />
        </Field>
        <Field label="Scientific name" error={named('Scientific name', errors.scientificName?.message)}>
          <TextInput className="italic" {...form.register('scientificName')} />
        </Field>
        <Field label="Genus" hint="Decides which pests and diseases are offered in inspections." error={named('Genus', errors.genus?.message)}>
          <TextInput {...form.register('genus')} />
        </Field>
      </div>
      <fieldset className="flex flex-col gap-2">
        <legend className="mb-1 font-medium">Propagation methods</legend>
        <div className="flex flex-wrap gap-2">
          {PROPAGATION_METHODS.map((method) => (
            <label key={method} className="flex min-h-touch items-center gap-3 rounded-lg border-2 border-paper-edge bg-white px-3">
              <input type="checkbox" value={method} className="h-5 w-5 accent-leaf" {...form.register('propagationMethods')} />
              {METHOD_LABELS[method]}
            </label>
          ))}
        </div>
        {errors.propagationMethods?.message ? (
          <p className="text-sm font-medium text-rust">{named('Propagation methods', errors.propagationMethods.message)}</p>
        ) : null}
      </fieldset>
      <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
        <Field label="Cutting length (cm)" error={named('Cutting length', errors.defaultCuttingLengthCm?.message)}>
          <TextInput inputMode="decimal" {...form.register('defaultCuttingLengthCm', num)} />
        </Field>
        <Field label="Cutting diameter (mm)" error={named('Cutting diameter', errors.defaultCuttingDiameterMm?.message)}>
          <TextInput inputMode="decimal" {...form.register('defaultCuttingDiameterMm', num)} />
        </Field>
        <Field label="Soft tip discarded (cm)" error={named('Soft tip', errors.softTipCm?.message)}>
          <TextInput inputMode="decimal" {...form.register('softTipCm', num)} />
        </Field>
        <Field label="Years to first crop" error={named('Years to first crop', errors.firstCropYears?.message)}>
          <TextInput inputMode="numeric" {...form.register('firstCropYears', num)} />
        </Field>
        <Field label="Reference strike rate (%)" hint="Share of cuttings that root, before any strike reports." error={named('Strike rate', errors.strikeRatePercent?.message)}>
          <TextInput inputMode="decimal" {...form.register('strikeRatePercent', num)} />
        </Field>
        <Field label="Weight of that rate" hint="In cuttings' worth of evidence; 20 is usual." error={named('Weight of that rate', errors.priorStrength?.message)}>
          <TextInput inputMode="numeric" {...form.register('priorStrength', num)} />
        </Field>
        <label className="flex min-h-touch items-center gap-3 self-end rounded-lg border-2 border-paper-edge bg-white px-3 font-medium sm:col-span-2">
          <input type="checkbox" className="h-5 w-5 accent-leaf" {...form.register('shadeTolerant')} />
          Grows in part shade (beside orchard trees)
        </label>
      </div>
      <Field
        label="Plant-health caution"
        optional
        hint="Restrictions on growing or moving this genus, shown wherever its wood is offered."
        error={named('Plant-health caution', errors.restrictionNote?.message)}
      >
        <TextArea rows={3} {...form.register('restrictionNote')} />
      </Field>
      <Field label="Notes" optional error={named('Notes', errors.notes?.message)}>
        <TextArea rows={3} {...form.register('notes')} />
      </Field>
      <div className="flex flex-wrap gap-2">
        <Button type="submit" busy={mutation.isPending}>
          {species ? 'Save the species' : 'Add the species'}
        </Button>
        <Button variant="secondary" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
