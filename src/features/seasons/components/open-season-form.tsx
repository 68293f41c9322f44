import { zodResolver } from '@hookform/resolvers/zod';
import { format, isValid, parseISO } from 'date-fns';
import { useEffect, useState } from 'react';
import { Controller, useForm, useWatch } from 'react-hook-form';
import { HEMISPHERES, LABELS, SEASON_KINDS, type Hemisphere, type SeasonKind } from '../../../../shared/domain';
import { seasonCreateSchema, type Season, type SeasonCreate } from '../../../../shared/schemas/seasons';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Field, namedError, Select, TextArea, TextInput } from '../../../components/ui/field';
import { errorMessage } from '../../../lib/api-client';
import { applyServerFieldErrors } from '../../../lib/form-errors';
import { useCreateSeason } from '../api/create-season';
import { useSeasonSuggestion } from '../api/get-season-suggestion';

const FIELDS = ['name', 'kind', 'hemisphere', 'requestDeadline', 'collectionStart', 'collectionEnd', 'lookbackMonths', 'notes'] as const;

/** ISO instant to the value of a datetime-local input, in this browser's time zone. */
function toLocalInput(iso: string): string {
  const date = parseISO(iso);
  return iso && isValid(date) ? format(date, "yyyy-MM-dd'T'HH:mm") : '';
}

function fromLocalInput(value: string): string {
  const date = new Date(value);
  return value && isValid(date) ? date.toISOString() : '';
}

const numberOrNull = (value: unknown) => (value === '' || value === null || value === undefined ? null : Number(value));

/**
 * The coordinator's "Open a season" form. Choosing a kind asks the server for the next
 * season of that kind in the cooperative's hemisphere and fills in its name and dates.
 */
export function OpenSeasonForm({
  hemisphere,
  onCreated,
  onCancel,
}: {
  hemisphere: Hemisphere;
  onCreated: (season: Season) => void;
  onCancel: () => void;
}) {
  const create = useCreateSeason();
  const form = useForm<SeasonCreate>({
    resolver: zodResolver(seasonCreateSchema),
    defaultValues: {
      name: '',
      kind: 'dormant_hardwood',
      hemisphere,
      requestDeadline: '',
      collectionStart: '',
      collectionEnd: '',
      lookbackMonths: 12,
      notes: '',
    },
  });
  const { errors } = form.formState;
  const kind = useWatch({ control: form.control, name: 'kind' }) as SeasonKind;
  const chosenHemisphere = useWatch({ control: form.control, name: 'hemisphere' }) as Hemisphere;
  const suggestion = useSeasonSuggestion(kind, chosenHemisphere);
  const [filledFrom, setFilledFrom] = useState<string | null>(null);

  // A new kind or hemisphere brings new suggested dates; the coordinator can still change them.
  useEffect(() => {
    const s = suggestion.data;
    if (!s) return;
    const key = `${kind}:${s.hemisphere}`;
    if (filledFrom === key) return;
    form.setValue('name', s.name, { shouldValidate: form.formState.isSubmitted });
    form.setValue('requestDeadline', s.requestDeadline, { shouldValidate: form.formState.isSubmitted });
    form.setValue('collectionStart', s.collectionStart, { shouldValidate: form.formState.isSubmitted });
    form.setValue('collectionEnd', s.collectionEnd, { shouldValidate: form.formState.isSubmitted });
    setFilledFrom(key);
  }, [suggestion.data, kind, filledFrom, form]);

  const onSubmit = form.handleSubmit(async (values) => {
    try {
      onCreated(await create.mutateAsync(values));
    } catch (error) {
      applyServerFieldErrors(error, form.setError, FIELDS);
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5">
      {create.isError ? <Alert tone="danger">{errorMessage(create.error)}</Alert> : null}
      <div className="grid gap-5 sm:grid-cols-2">
        <Field label="Kind of season" error={namedError('Kind', errors.kind?.message)}>
          <Select {...form.register('kind')}>
            {SEASON_KINDS.map((k) => (
              <option key={k} value={k}>
                {LABELS.seasonKind[k]}
              </option>
            ))}
          </Select>
        </Field>
        <Field label="Hemisphere" hint="From the cooperative's settings; dates shift six months in the south." error={namedError('Hemisphere', errors.hemisphere?.message)}>
          <Select {...form.register('hemisphere')}>
            {HEMISPHERES.map((h) => (
              <option key={h} value={h}>
                {h === 'north' ? 'Northern' : 'Southern'}
              </option>
            ))}
          </Select>
        </Field>
      </div>
      {suggestion.isError ? (
        <Alert tone="warning">Suggested dates did not load ({errorMessage(suggestion.error)}). Enter the dates yourself.</Alert>
      ) : suggestion.isFetching ? (
        <p className="text-ink-soft">Finding the next dates for this kind…</p>
      ) : suggestion.data ? (
        <p className="text-ink-soft">
          Dates suggested for {LABELS.seasonKind[kind].toLowerCase()} in the {suggestion.data.hemisphere}ern hemisphere. Change them to suit
          your district.
        </p>
      ) : null}
      <Field label="Name" error={namedError('Name', errors.name?.message)}>
        <TextInput autoComplete="off" {...form.register('name')} />
      </Field>
      <Field label="Request deadline" hint="Growers file and change requests until then (your local time)." error={namedError('Request deadline', errors.requestDeadline?.message)}>
        <Controller
          control={form.control}
          name="requestDeadline"
          render={({ field }) => (
            <TextInput
              type="datetime-local"
              name={field.name}
              ref={field.ref}
              onBlur={field.onBlur}
              value={toLocalInput(field.value)}
              onChange={(event) => field.onChange(fromLocalInput(event.target.value))}
            />
          )}
        />
      </Field>
      <fieldset className="grid gap-5 sm:grid-cols-2">
        <legend className="mb-2 font-semibold">Collection window</legend>
        <Field label="Collections start" error={namedError('Collections start', errors.collectionStart?.message)}>
          <TextInput type="date" {...form.register('collectionStart')} />
        </Field>
        <Field label="Collections end" error={namedError('Collections end', errors.collectionEnd?.message)}>
          <TextInput type="date" {...form.register('collectionEnd')} />
        </Field>
      </fieldset>
      <Field
        label="Health look-back (months)"
        hint="Wood comes only from plants inspected clean within this many months."
        error={namedError('Look-back', errors.lookbackMonths?.message)}
      >
        <TextInput type="number" inputMode="numeric" min={1} max={60} step={1} className="sm:w-40" {...form.register('lookbackMonths', { setValueAs: numberOrNull })} />
      </Field>
      <Field label="Notes for members" optional error={namedError('Notes', errors.notes?.message)}>
        <TextArea rows={3} {...form.register('notes')} />
      </Field>
      <div className="flex flex-wrap gap-3">
        <Button type="submit" busy={create.isPending}>
          Open the season
        </Button>
        <Button variant="secondary" onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
