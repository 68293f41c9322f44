import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { pickupWindowSchema, type PickupWindow } from '../../../../shared/schemas/seasons';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { Field, namedError, TextInput } from '../../../components/ui/field';
import { Loading } from '../../../components/ui/loading';
import { errorMessage } from '../../../lib/api-client';
import { formatDay } from '../../../lib/format';
import { applyServerFieldErrors } from '../../../lib/form-errors';
import { useAddPickupWindow, type PickupWindowInput } from '../api/add-pickup-window';
import { useDeletePickupWindow } from '../api/delete-pickup-window';
import { usePickupWindows } from '../api/get-pickup-windows';
import { windowText, zoneName } from '../lib/farm-time';

type Props = {
  seasonId: string;
  farmId: string;
  farmName: string;
  collectionStart: string;
  collectionEnd: string;
  /** The farm lead or a coordinator, while the stage allows windows. */
  canEdit: boolean;
  /** Why editing is not possible, when it is not. */
  readOnlyReason?: string;
};

function AddWindowForm({ seasonId, farmId, collectionStart, collectionEnd, zone }: Props & { zone: string | null }) {
  const add = useAddPickupWindow();
  const [added, setAdded] = useState<string | null>(null);
  const form = useForm({
    resolver: zodResolver(pickupWindowSchema),
    defaultValues: { date: collectionStart, from: '09:00', to: '12:00', note: '' },
  });
  const { errors } = form.formState;

  const onSubmit = form.handleSubmit(async (values) => {
    setAdded(null);
    try {
      const input: PickupWindowInput = values;
      await add.mutateAsync({ seasonId, farmId, input });
      setAdded(`Added ${formatDay(values.date)}, ${values.from}–${values.to}.`);
      form.reset({ ...values, note: values.note });
    } catch (error) {
      applyServerFieldErrors(error, form.setError, ['date', 'from', 'to', 'note']);
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4 rounded-lg border border-paper-edge bg-paper px-4 py-4">
      <h3 className="text-lg font-semibold">Add a pickup window</h3>
      <p className="text-ink-soft">
        In the farm’s local time{zone ? ` (${zone})` : ''}, on a day between {formatDay(collectionStart)} and {formatDay(collectionEnd)}.
      </p>
      {add.isError && !Object.keys(errors).length ? <Alert tone="danger">{errorMessage(add.error)}</Alert> : null}
      <div className="grid grid-cols-2 gap-4 sm:grid-cols-3">
        <Field label="Day" className="col-span-2 sm:col-span-1" error={namedError('Day', errors.date?.message)}>
          <TextInput type="date" min={collectionStart} max={collectionEnd} {...form.register('date')} />
        </Field>
        <Field label="From" error={namedError('From', errors.from?.message)}>
          <TextInput type="time" step={300} {...form.register('from')} />
        </Field>
        <Field label="To" error={namedError('To', errors.to?.message)}>
          <TextInput type="time" step={300} {...form.register('to')} />
        </Field>
      </div>
      <Field label="Note for growers" optional hint="Where bundles wait, where to park, what to bring." error={namedError('Note', errors.note?.message)}>
        <TextInput maxLength={500} {...form.register('note')} />
      </Field>
      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit" busy={add.isPending}>
          Add window
        </Button>
        {added ? (
          <p role="status" className="font-medium text-leaf-dark">
            {added}
          </p>
        ) : null}
      </div>
    </form>
  );
}

/** A farm's pickup windows for a season, in the farm's time, with add and delete for the lead. */
export function PickupWindows(props: Props) {
  const { seasonId, farmId, farmName, canEdit, readOnlyReason } = props;
  const windows = usePickupWindows({ seasonId, farmId });
  const remove = useDeletePickupWindow();
  const [toDelete, setToDelete] = useState<PickupWindow | null>(null);
  const items = windows.data?.items ?? [];
  const zone = items[0] ? `${items[0].timezone}, ${zoneName(items[0])}` : null;

  const onDelete = async () => {
    if (!toDelete) return;
    try {
      await remove.mutateAsync({ windowId: toDelete.id });
      setToDelete(null);
    } catch {
      // Shown in the dialog.
    }
  };

  return (
    <section id="pickup-windows" aria-labelledby="pickup-windows-title" className="scroll-mt-6 flex flex-col gap-4">
      <h2 id="pickup-windows-title" className="text-2xl font-bold tracking-tight">
        Pickup windows at {farmName}
      </h2>
      {windows.isPending ? (
        <Loading label="Loading pickup windows…" />
      ) : windows.isError ? (
        <Alert tone="danger" title="The pickup windows did not load">
          {errorMessage(windows.error)}
        </Alert>
      ) : items.length === 0 ? (
        <p className="text-ink-soft">No pickup windows yet. {canEdit ? 'Add the times growers can come for their bundles.' : 'The farm lead adds them.'}</p>
      ) : (
        <ul className="flex flex-col divide-y divide-paper-edge rounded-card border border-paper-edge bg-white/60 px-4">
          {items.map((w) => (
            <li key={w.id} className="flex flex-col gap-2 py-3 sm:flex-row sm:items-center sm:justify-between">
              <div>
                <p className="font-semibold">
                  {windowText(w)} <span className="font-normal text-ink-soft">({w.timezone})</span>
                </p>
                {w.note ? <p className="text-ink-soft">{w.note}</p> : null}
              </div>
              {canEdit ? (
                <Button
                  variant="secondary"
                  size="sm"
                  className="self-start sm:self-auto"
                  onClick={() => {
                    remove.reset();
                    setToDelete(w);
                  }}
                >
                  Delete<span className="sr-only"> the window {windowText(w)}</span>
                </Button>
              ) : null}
            </li>
          ))}
        </ul>
      )}
      {canEdit ? <AddWindowForm {...props} zone={zone} /> : readOnlyReason ? <p className="text-ink-soft">{readOnlyReason}</p> : null}
      <Dialog open={toDelete !== null} onClose={() => setToDelete(null)} title="Delete this pickup window?">
        {toDelete ? (
          <div className="flex flex-col gap-4">
            <p>{windowText(toDelete)}</p>
            {remove.isError ? <Alert tone="danger">{errorMessage(remove.error)}</Alert> : null}
            <div className="flex flex-wrap gap-3">
              <Button variant="danger" onClick={onDelete} busy={remove.isPending}>
                Yes, delete
              </Button>
              <Button variant="secondary" onClick={() => setToDelete(null)}>
                Keep it
              </Button>
            </div>
          </div>
        ) : null}
      </Dialog>
    </section>
  );
}
