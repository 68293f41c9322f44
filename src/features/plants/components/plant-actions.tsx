import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { LABELS } from '../../../../shared/domain';
import { uuidParam } from '../../../../shared/schemas/common';
import { liftHoldSchema, retireSchema, type PlantDetail } from '../../../../shared/schemas/register';
import { paths } from '../../../app/paths';
import { Alert } from '../../../components/ui/alert';
import { Button, ButtonLink } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { Field, Select, TextArea } from '../../../components/ui/field';
import { StatusShapeIcon, STATUS_LOOKS } from '../../../components/ui/status-badge';
import { errorMessage } from '../../../lib/api-client';
import { applyServerFieldErrors } from '../../../lib/form-errors';
import { useLiftHold } from '../api/lift-hold';
import { useRetirePlant } from '../api/retire-plant';
import { useUpdatePlant } from '../api/update-plant';
import type { FarmOption } from './plant-filters';
import { named } from './words';

const moveSchema = z.object({
  farmId: uuidParam,
  reason: z.string({ error: 'Reason is required' }).trim().min(3, 'Say why the plant moves (at least 3 characters)').max(500, 'Reason is at most 500 characters'),
});

function DialogButtons({ onCancel, cancelLabel, submitLabel, busy, danger }: { onCancel: () => void; cancelLabel: string; submitLabel: string; busy: boolean; danger?: boolean }) {
  return (
    <div className="flex flex-wrap justify-end gap-2">
      <Button variant="secondary" onClick={onCancel}>
        {cancelLabel}
      </Button>
      <Button type="submit" variant={danger ? 'danger' : 'primary'} busy={busy}>
        {submitLabel}
      </Button>
    </div>
  );
}

function RetireDialog({ plant, open, onClose }: { plant: PlantDetail; open: boolean; onClose: () => void }) {
  const retire = useRetirePlant();
  const form = useForm({ resolver: zodResolver(retireSchema), defaultValues: { reason: '' } });
  const close = () => {
    form.reset();
    retire.reset();
    onClose();
  };
  const submit = form.handleSubmit(async ({ reason }) => {
    try {
      await retire.mutateAsync({ id: plant.id, reason });
      close();
    } catch (error) {
      applyServerFieldErrors(error, form.setError, ['reason']);
    }
  });
  return (
    <Dialog open={open} onClose={close} title={`Retire ${plant.code}?`}>
      <form onSubmit={submit} noValidate className="flex flex-col gap-4">
        <p className="text-ink-soft">A retired plant gives no more wood and is no longer inspected. Its record and history stay in the register.</p>
        {retire.isError ? <Alert tone="danger">{errorMessage(retire.error)}</Alert> : null}
        <Field label="Reason" hint="Kept in the plant's audit log, e.g. “Grubbed out after reversion was confirmed”." error={named('Reason', form.formState.errors.reason?.message)}>
          <TextArea rows={3} {...form.register('reason')} />
        </Field>
        <DialogButtons onCancel={close} cancelLabel="Keep the plant" submitLabel="Retire the plant" busy={retire.isPending} danger />
      </form>
    </Dialog>
  );
}

function LiftHoldDialog({ plant, open, onClose }: { plant: PlantDetail; open: boolean; onClose: () => void }) {
  const lift = useLiftHold();
  const form = useForm({ resolver: zodResolver(liftHoldSchema), defaultValues: { to: 'watch' as const, reason: '' } });
  const close = () => {
    form.reset();
    lift.reset();
    onClose();
  };
  const submit = form.handleSubmit(async ({ to, reason }) => {
    try {
      await lift.mutateAsync({ id: plant.id, to, reason });
      close();
    } catch (error) {
      applyServerFieldErrors(error, form.setError, ['to', 'reason']);
    }
  });
  const { errors } = form.formState;
  return (
    <Dialog open={open} onClose={close} title={`Lift the hold on ${plant.code}?`}>
      <form onSubmit={submit} noValidate className="flex flex-col gap-4">
        <p className="text-ink-soft">Lift a hold only when the finding is dealt with: confirmed absent, or the affected wood removed and the plant re-inspected.</p>
        {lift.isError ? <Alert tone="danger">{errorMessage(lift.error)}</Alert> : null}
        <fieldset className="flex flex-col gap-2">
          <legend className="mb-1 font-medium">New status</legend>
          {(['watch', 'clean'] as const).map((to) => (
            <label key={to} className="flex min-h-touch items-center gap-3 rounded-lg border-2 border-paper-edge bg-white px-3">
              <input type="radio" value={to} className="h-5 w-5 accent-leaf" {...form.register('to')} />
              <StatusShapeIcon shape={STATUS_LOOKS[to].shape} className={to === 'clean' ? 'text-leaf' : 'text-amber'} />
              <span className="font-medium">{LABELS.health[to]}</span>
              <span className="text-sm text-ink-soft">{to === 'watch' ? 'follow it at the next inspection' : 'wood may be offered again'}</span>
            </label>
          ))}
          {errors.to?.message ? <p className="text-sm font-medium text-rust">{named('New status', errors.to.message)}</p> : null}
        </fieldset>
        <Field label="Reason" hint="Kept in the plant's audit log." error={named('Reason', errors.reason?.message)}>
          <TextArea rows={3} {...form.register('reason')} />
        </Field>
        <DialogButtons onCancel={close} cancelLabel="Keep on hold" submitLabel="Lift the hold" busy={lift.isPending} />
      </form>
    </Dialog>
  );
}

function MoveDialog({ plant, farms, open, onClose }: { plant: PlantDetail; farms: FarmOption[]; open: boolean; onClose: () => void }) {
  const update = useUpdatePlant();
  const form = useForm({ resolver: zodResolver(moveSchema), defaultValues: { farmId: '', reason: '' } });
  const close = () => {
    form.reset();
    update.reset();
    onClose();
  };
  const submit = form.handleSubmit(async ({ farmId, reason }) => {
    try {
      await update.mutateAsync({ id: plant.id, patch: { farmId, reason } });
      close();
    } catch (error) {
      applyServerFieldErrors(error, form.setError, ['farmId', 'reason']);
    }
  });
  const { errors } = form.formState;
  const others = farms.filter((farm) => farm.id !== plant.farmId);
  return (
    <Dialog open={open} onClose={close} title={`Move ${plant.code} to another farm`}>
      <form onSubmit={submit} noValidate className="flex flex-col gap-4">
        <p className="text-ink-soft">The plant keeps its code and history. Its new farm's people keep its record from now on.</p>
        {update.isError ? <Alert tone="danger">{errorMessage(update.error)}</Alert> : null}
        <Field
          label="New farm"
          error={errors.farmId ? (errors.farmId.type === 'server' ? named('New farm', errors.farmId.message) : 'New farm: choose the farm it moves to') : undefined}
        >
          <Select {...form.register('farmId')}>
            <option value="">Choose a farm…</option>
            {others.map((farm) => (
              <option key={farm.id} value={farm.id}>
                {farm.name} ({farm.code})
              </option>
            ))}
          </Select>
        </Field>
        <Field label="Reason" hint="Kept in the plant's audit log." error={named('Reason', errors.reason?.message)}>
          <TextArea rows={3} {...form.register('reason')} />
        </Field>
        <DialogButtons onCancel={close} cancelLabel="Cancel" submitLabel="Move the plant" busy={update.isPending} />
      </form>
    </Dialog>
  );
}

/** The buttons a person may use on this plant, from the server's `can`. */
export function PlantActions({ plant, farms }: { plant: PlantDetail; farms: FarmOption[] }) {
  const [open, setOpen] = useState<'retire' | 'lift' | 'move' | null>(null);
  const close = () => setOpen(null);
  const { can } = plant;
  if (!can.edit && !can.retire && !can.liftHold && !can.transfer) return null;
  return (
    <>
      {can.edit ? <ButtonLink to={paths.plantEdit(plant.id)}>Edit</ButtonLink> : null}
      {can.liftHold ? <Button onClick={() => setOpen('lift')}>Lift hold</Button> : null}
      {can.transfer ? (
        <Button variant="secondary" onClick={() => setOpen('move')}>
          Move to another farm
        </Button>
      ) : null}
      {can.retire ? (
        <Button variant="danger" onClick={() => setOpen('retire')}>
          Retire
        </Button>
      ) : null}
      {can.retire ? <RetireDialog plant={plant} open={open === 'retire'} onClose={close} /> : null}
      {can.liftHold ? <LiftHoldDialog plant={plant} open={open === 'lift'} onClose={close} /> : null}
      {can.transfer ? <MoveDialog plant={plant} farms={farms} open={open === 'move'} onClose={close} /> : null}
    </>
  );
}
