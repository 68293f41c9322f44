import { zodResolver } from '@hookform/resolvers/zod';
import { useMemo, useState } from 'react';
import { useFieldArray, useForm, useWatch, type Control, type FieldErrors, type Path, type UseFormRegister, type UseFormSetValue } from 'react-hook-form';
import { LABELS, TREATMENTS } from '../../../../shared/domain';
import type { Species } from '../../../../shared/schemas/register';
import { woodRequestSchema, type WoodRequest } from '../../../../shared/schemas/seasons';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Field, namedError, Select, TextArea, TextInput } from '../../../components/ui/field';
import { errorMessage, isApiError } from '../../../lib/api-client';
import { applyServerFieldErrors } from '../../../lib/form-errors';
import { useSaveMyRequest } from '../api/save-my-request';
import { emptyLine, formDefaults, mergeIncoming, planText, type IncomingLine, type RequestFormValues } from '../lib/request-lines';

const numberOrUndefined = (value: unknown) => (value === '' || value === null || value === undefined ? undefined : Number(String(value).replace(',', '.')));
const LINE_FIELDS = ['speciesId', 'varietyId', 'cuttings', 'substitutesAllowed', 'treatment', 'plan'] as const;

function RestrictionCaution({ note }: { note: string }) {
  return (
    <div className="flex gap-2 rounded-lg border-l-4 border-amber bg-amber-light px-3 py-2 text-sm">
      <svg width="16" height="16" viewBox="0 0 20 20" aria-hidden="true" focusable="false" className="mt-0.5 shrink-0 text-amber">
        <polygon points="10,1.5 19,18 1,18" fill="currentColor" />
        <rect x="9" y="7" width="2" height="6" fill="white" />
        <rect x="9" y="14.5" width="2" height="2" fill="white" />
      </svg>
      <p>
        <span className="font-semibold">Caution: </span>
        {note}
      </p>
    </div>
  );
}

function LineEditor({
  index,
  control,
  register,
  setValue,
  errors,
  species,
  onRemove,
}: {
  index: number;
  control: Control<RequestFormValues>;
  register: UseFormRegister<RequestFormValues>;
  setValue: UseFormSetValue<RequestFormValues>;
  errors: FieldErrors<RequestFormValues>;
  species: Species[];
  onRemove: () => void;
}) {
  const line = useWatch({ control, name: `lines.${index}` });
  const chosen = species.find((s) => s.id === line?.speciesId);
  const lineErrors = errors.lines?.[index];
  const plan = planText(line?.plan as Record<string, unknown> | null | undefined);
  const speciesField = register(`lines.${index}.speciesId`);

  return (
    <fieldset className="flex flex-col gap-4 rounded-card border border-paper-edge bg-white/60 p-4 sm:p-5">
      <legend className="px-1 text-lg font-semibold">Line {index + 1}</legend>
      {plan ? <p className="text-ink-soft">From the planner: {plan}</p> : null}
      <div className="grid gap-4 sm:grid-cols-2">
        <Field label="Species" error={lineErrors?.speciesId && !line?.speciesId ? 'Choose a species for this line' : namedError('Species', lineErrors?.speciesId?.message)}>
          <Select
            {...speciesField}
            onChange={(event) => {
              void speciesField.onChange(event);
              // A variety of another species would be refused: start again from "any variety".
              setValue(`lines.${index}.varietyId`, null);
            }}
          >
            <option value="">Choose a species</option>
            {species.map((s) => (
              <option key={s.id} value={s.id}>
                {s.commonName} ({s.scientificName})
              </option>
            ))}
          </Select>
        </Field>
        <Field label="Variety" error={namedError('Variety', lineErrors?.varietyId?.message)}>
          <Select disabled={!chosen} {...register(`lines.${index}.varietyId`, { setValueAs: (v) => (v ? String(v) : null) })}>
            <option value="">Any variety of this species</option>
            {(chosen?.varieties ?? []).map((v) => (
              <option key={v.id} value={v.id}>
                {v.name}
              </option>
            ))}
          </Select>
        </Field>
        <Field label="Cuttings" error={namedError('Cuttings', lineErrors?.cuttings?.message)}>
          <TextInput type="number" inputMode="numeric" min={1} step={1} {...register(`lines.${index}.cuttings`, { setValueAs: numberOrUndefined })} />
        </Field>
        <Field label="Treatment before sticking" error={namedError('Treatment', lineErrors?.treatment?.message)}>
          <Select {...register(`lines.${index}.treatment`)}>
            {TREATMENTS.map((t) => (
              <option key={t} value={t}>
                {LABELS.treatment[t]}
              </option>
            ))}
          </Select>
        </Field>
      </div>
      <label className="flex min-h-touch cursor-pointer items-start gap-3">
        <input type="checkbox" className="mt-1 h-5 w-5 shrink-0 accent-leaf" {...register(`lines.${index}.substitutesAllowed`)} />
        <span>
          <span className="font-medium">Substitutes allowed</span>
          <span className="block text-sm text-ink-soft">Another variety of the same species may fill this line if this one runs short.</span>
        </span>
      </label>
      {chosen?.restrictionNote ? <RestrictionCaution note={chosen.restrictionNote} /> : null}
      <div>
        <Button variant="quiet" size="sm" onClick={onRemove}>
          Remove line {index + 1}
        </Button>
      </div>
    </fieldset>
  );
}

/**
 * The grower's request for a season: where the wood goes, how far they will travel, and the
 * lines. Saved as a draft or filed; the server checks the same schema.
 */
export function RequestForm({
  seasonId,
  request,
  species,
  incoming,
  onSaved,
}: {
  seasonId: string;
  request: WoodRequest | null;
  species: Species[];
  incoming: IncomingLine | null;
  onSaved?: (request: WoodRequest) => void;
}) {
  const save = useSaveMyRequest();
  const start = useMemo(() => {
    const defaults = formDefaults(request);
    const merged = mergeIncoming(defaults.lines, incoming);
    return { values: { ...defaults, lines: merged.lines.length ? merged.lines : [emptyLine()] }, note: merged.note };
    // Built once: the form owns the values from here on.
  }, []);
  const form = useForm<RequestFormValues>({ resolver: zodResolver(woodRequestSchema), defaultValues: start.values });
  const lines = useFieldArray({ control: form.control, name: 'lines' });
  const { errors } = form.formState;
  const [position, setPosition] = useState<{ state: 'idle' | 'asking' | 'error'; message?: string }>({ state: 'idle' });
  const [unplaced, setUnplaced] = useState<string[]>([]);
  const [showNote, setShowNote] = useState(true);

  const submitAs = (status: 'draft' | 'filed') =>
    form.handleSubmit(async (values) => {
      setUnplaced([]);
      try {
        const { request: saved } = await save.mutateAsync({ seasonId, input: { ...values, status } });
        form.reset(formDefaults(saved));
        setShowNote(false);
        onSaved?.(saved);
      } catch (error) {
        const known = [
          'destinationLat',
          'destinationLon',
          'destinationLabel',
          'maxDistanceKm',
          'notes',
          'status',
          ...form.getValues('lines').flatMap((_, i) => LINE_FIELDS.map((f) => `lines.${i}.${f}` as const)),
        ] as const;
        applyServerFieldErrors(error, form.setError, known as unknown as Path<RequestFormValues>[]);
        if (isApiError(error)) setUnplaced(Object.entries(error.fields).filter(([k]) => !(known as readonly string[]).includes(k)).map(([k, m]) => `${k}: ${m}`));
      }
    });

  const usePosition = () => {
    if (!('geolocation' in navigator)) {
      setPosition({ state: 'error', message: 'This browser cannot tell its position. Type the latitude and longitude instead.' });
      return;
    }
    setPosition({ state: 'asking' });
    navigator.geolocation.getCurrentPosition(
      (p) => {
        const round = (x: number) => Math.round(x * 1e5) / 1e5;
        form.setValue('destinationLat', round(p.coords.latitude), { shouldDirty: true, shouldValidate: true });
        form.setValue('destinationLon', round(p.coords.longitude), { shouldDirty: true, shouldValidate: true });
        setPosition({ state: 'idle' });
      },
      (e) =>
        setPosition({
          state: 'error',
          message: e.code === e.PERMISSION_DENIED ? 'Position not shared. Allow it in the browser, or type the latitude and longitude.' : 'The position could not be found. Type the latitude and longitude instead.',
        }),
      { enableHighAccuracy: true, timeout: 15_000 },
    );
  };

  const listError = errors.lines?.root?.message ?? errors.lines?.message;

  return (
    <form noValidate onSubmit={submitAs('filed')} className="flex flex-col gap-6">
      {start.note && showNote ? <Alert tone="info">{start.note}</Alert> : null}
      <fieldset className="flex flex-col gap-4">
        <legend className="mb-1 text-lg font-semibold">Where the wood goes</legend>
        <p className="text-ink-soft">The place you will plant, so farms can be matched within your distance.</p>
        <div className="grid gap-4 sm:grid-cols-2">
          <Field label="Latitude" hint="For example 52.0855" error={namedError('Latitude', errors.destinationLat?.message)}>
            <TextInput type="number" inputMode="decimal" step="any" {...form.register('destinationLat', { setValueAs: numberOrUndefined })} />
          </Field>
          <Field label="Longitude" hint="For example -2.6385 (west is negative)" error={namedError('Longitude', errors.destinationLon?.message)}>
            <TextInput type="number" inputMode="decimal" step="any" {...form.register('destinationLon', { setValueAs: numberOrUndefined })} />
          </Field>
        </div>
        <div className="flex flex-wrap items-center gap-3">
          <Button variant="secondary" onClick={usePosition} busy={position.state === 'asking'}>
            Use my position
          </Button>
          {position.state === 'error' ? <p className="text-sm font-medium text-rust">{position.message}</p> : null}
        </div>
        <Field label="Name of the place" optional hint="How you call it: “Lower field hedge”, “Allotment 14”." error={namedError('Name of the place', errors.destinationLabel?.message)}>
          <TextInput maxLength={200} {...form.register('destinationLabel')} />
        </Field>
        <Field label="Furthest distance you will travel (km)" hint="Only farms within this distance are matched to you." error={namedError('Distance', errors.maxDistanceKm?.message)}>
          <TextInput type="number" inputMode="decimal" min={1} max={1000} step="any" className="sm:w-48" {...form.register('maxDistanceKm', { setValueAs: numberOrUndefined })} />
        </Field>
      </fieldset>

      <section aria-labelledby="request-lines-title" className="flex flex-col gap-4">
        <h2 id="request-lines-title" className="text-lg font-semibold">
          What you ask for
        </h2>
        {listError ? <p className="font-medium text-rust">Lines: {listError}</p> : null}
        {lines.fields.map((field, index) => (
          <LineEditor
            key={field.id}
            index={index}
            control={form.control}
            register={form.register}
            setValue={form.setValue}
            errors={errors}
            species={species}
            onRemove={() => lines.remove(index)}
          />
        ))}
        <div>
          <Button variant="secondary" onClick={() => lines.append(emptyLine())}>
            Add a line
          </Button>
        </div>
      </section>

      <Field label="Notes for the coordinator" optional error={namedError('Notes', errors.notes?.message)}>
        <TextArea rows={3} maxLength={4000} {...form.register('notes')} />
      </Field>

      {save.isError ? (
        <Alert tone="danger" title="The request was not saved">
          {errorMessage(save.error)}
          {unplaced.length ? (
            <ul className="mt-1 list-disc pl-5">
              {unplaced.map((u) => (
                <li key={u}>{u}</li>
              ))}
            </ul>
          ) : null}
        </Alert>
      ) : null}
      <div className="flex flex-col gap-3 sm:flex-row">
        <Button type="submit" busy={save.isPending && save.variables?.input.status === 'filed'}>
          File the request
        </Button>
        <Button variant="secondary" onClick={submitAs('draft')} busy={save.isPending && save.variables?.input.status === 'draft'}>
          Save as draft
        </Button>
      </div>
      <p className="text-sm text-ink-soft">A draft is kept for you but not matched; a filed request goes into the allocation round.</p>
    </form>
  );
}
