import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { districtNoteSchema } from '../../../../shared/schemas/health';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Field, TextArea, TextInput } from '../../../components/ui/field';
import { errorMessage } from '../../../lib/api-client';
import { applyServerFieldErrors } from '../../../lib/form-errors';
import { useAddDistrictNote } from '../api/add-district-note';

function named(label: string, message: string | undefined): string | undefined {
  if (!message) return undefined;
  return message.toLowerCase().startsWith(label.toLowerCase().split(' ')[0]) ? message : `${label}: ${message}`;
}

function today(): string {
  const d = new Date();
  return `${d.getFullYear()}-${String(d.getMonth() + 1).padStart(2, '0')}-${String(d.getDate()).padStart(2, '0')}`;
}

const toNumberOrNull = (value: unknown) => (value === '' || value == null ? null : typeof value === 'number' ? value : Number(String(value).replace(',', '.')));

/**
 * A note about plant health in the district (a hedge with rust along the lane, mildew at a
 * neighbour's): any member may add one; the coordinator reads them on the health page.
 */
export function DistrictNoteForm({ onAdded }: { onAdded?: () => void }) {
  const add = useAddDistrictNote();
  const [done, setDone] = useState(false);
  const [locating, setLocating] = useState(false);
  const [where, setWhere] = useState<string | null>(null);
  const form = useForm({
    resolver: zodResolver(districtNoteSchema),
    defaultValues: { body: '', notedOn: today(), lat: null as number | null, lon: null as number | null },
  });
  const { errors } = form.formState;

  const onSubmit = form.handleSubmit(async (values) => {
    setDone(false);
    try {
      await add.mutateAsync(values);
      form.reset({ body: '', notedOn: today(), lat: null, lon: null });
      setWhere(null);
      setDone(true);
      onAdded?.();
    } catch (error) {
      applyServerFieldErrors(error, form.setError, ['body', 'notedOn', 'lat', 'lon']);
    }
  });

  const useMyPosition = () => {
    if (!('geolocation' in navigator)) {
      setWhere('This browser cannot give a position; type it instead.');
      return;
    }
    setLocating(true);
    navigator.geolocation.getCurrentPosition(
      (position) => {
        setLocating(false);
        const lat = Math.round(position.coords.latitude * 1e5) / 1e5;
        const lon = Math.round(position.coords.longitude * 1e5) / 1e5;
        form.setValue('lat', lat, { shouldDirty: true });
        form.setValue('lon', lon, { shouldDirty: true });
        setWhere(`Your position: ${lat}, ${lon}`);
      },
      () => {
        setLocating(false);
        setWhere('Your position could not be read. Allow location for this site, or type it.');
      },
      { enableHighAccuracy: true, timeout: 20_000 },
    );
  };

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      {done ? <Alert tone="success">Thank you. The note is with the coordinators.</Alert> : null}
      {add.isError ? <Alert tone="danger">{errorMessage(add.error)}</Alert> : null}
      <Field label="What you saw" hint="Where, on what plants, and how much, e.g. “Rust on blackcurrants in the hedge by Upper Lyde lane”." error={named('Note', errors.body?.message)}>
        <TextArea rows={3} {...form.register('body')} />
      </Field>
      <div className="grid gap-4 sm:grid-cols-3">
        <Field label="Date seen" error={named('Date seen', errors.notedOn?.message)}>
          <TextInput type="date" max={today()} {...form.register('notedOn')} />
        </Field>
        <Field label="Latitude" optional error={named('Latitude', errors.lat?.message)}>
          <TextInput autoComplete="off" {...form.register('lat', { setValueAs: toNumberOrNull })} />
        </Field>
        <Field label="Longitude" optional error={named('Longitude', errors.lon?.message)}>
          <TextInput autoComplete="off" {...form.register('lon', { setValueAs: toNumberOrNull })} />
        </Field>
      </div>
      <div className="flex flex-wrap items-center gap-2">
        <Button variant="secondary" onClick={useMyPosition} busy={locating}>
          Use my position
        </Button>
        {where ? <span className="text-sm text-ink-soft">{where}</span> : null}
      </div>
      <div>
        <Button type="submit" busy={add.isPending}>
          Add the note
        </Button>
      </div>
    </form>
  );
}
