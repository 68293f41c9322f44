import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { varietySchema, type Variety } from '../../../../shared/schemas/register';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Field, TextArea, TextInput } from '../../../components/ui/field';
import { errorMessage } from '../../../lib/api-client';
import { applyServerFieldErrors } from '../../../lib/form-errors';
import { useCreateVariety } from '../api/create-variety';
import { useUpdateVariety } from '../api/update-variety';
import { named } from './words';

const varietyFormSchema = varietySchema.omit({ speciesId: true });

export function VarietyForm({ speciesId, speciesName, variety, onDone }: { speciesId: string; speciesName: string; variety?: Variety; onDone: () => void }) {
  const create = useCreateVariety();
  const update = useUpdateVariety();
  const mutation = variety ? update : create;
  const form = useForm({
    resolver: zodResolver(varietyFormSchema),
    defaultValues: { name: variety?.name ?? '', description: variety?.description ?? '' },
  });
  const { errors } = form.formState;

  const onSubmit = form.handleSubmit(async (values) => {
    const description = values.description?.trim() ? values.description : null;
    try {
      if (variety) await update.mutateAsync({ id: variety.id, patch: { name: values.name, description } });
      else await create.mutateAsync({ speciesId, name: values.name, description });
      onDone();
    } catch (error) {
      applyServerFieldErrors(error, form.setError, ['name', 'description']);
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4 rounded-lg border-2 border-paper-edge bg-white/80 p-4" aria-label={variety ? `Edit ${variety.name}` : `Add a variety of ${speciesName}`}>
      <p className="font-semibold">{variety ? `Edit ${variety.name}` : `New variety of ${speciesName}`}</p>
      {mutation.isError ? <Alert tone="danger">{errorMessage(mutation.error)}</Alert> : null}
      <Field label="Variety name" error={named('Variety name', errors.name?.message)}>
        <TextInput {...form.register('name')} />
      </Field>
      <Field label="Description" optional error={named('Description', errors.description?.message)}>
        <TextArea rows={2} {...form.register('description')} />
      </Field>
      <div className="flex flex-wrap gap-2">
        <Button type="submit" busy={mutation.isPending}>
          {variety ? 'Save the variety' : 'Add the variety'}
        </Button>
        <Button variant="secondary" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
