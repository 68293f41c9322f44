import { useId, useState, type FormEvent } from 'react';
import { FARM_ROLES, LABELS, type FarmRole } from '../../../../shared/domain';
import type { FarmLink, Member } from '../../../../shared/schemas/members';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { Field, Select } from '../../../components/ui/field';
import { errorMessage } from '../../../lib/api-client';
import { useRemoveFarmMembership } from '../api/remove-farm-membership';
import { useSetFarmMembership } from '../api/set-farm-membership';
import { memberNameId, useMembersTableContext } from './members-context';

/** The farms a member belongs to, with their role on each, and the ways to change that. */
export function MemberFarms({ member }: { member: Member }) {
  const [adding, setAdding] = useState(false);
  const [removing, setRemoving] = useState<FarmLink | null>(null);

  return (
    <div className="flex min-w-48 flex-col items-start gap-2">
      {member.farms.length === 0 ? <p className="text-ink-faint">No farm</p> : null}
      <ul className="flex flex-col gap-1.5">
        {member.farms.map((farm) => (
          <li key={farm.farmId} className="flex flex-wrap items-center gap-x-2">
            <span>
              <span className="font-medium">{farm.farmName}</span>{' '}
              <span className="text-sm text-ink-soft">
                ({farm.farmCode}) · {LABELS.farmRole[farm.farmRole]}
              </span>
            </span>
            <button
              type="button"
              onClick={() => setRemoving(farm)}
              className="min-h-touch rounded px-2 text-sm font-medium text-rust underline underline-offset-2 hover:bg-rust-light"
              aria-label={`Remove from ${farm.farmName}`}
              aria-describedby={memberNameId(member.id)}
            >
              Remove
            </button>
          </li>
        ))}
      </ul>
      <Button size="sm" variant="secondary" onClick={() => setAdding(true)} aria-describedby={memberNameId(member.id)}>
        Add to farm
      </Button>
      <AddToFarmDialog member={member} open={adding} onClose={() => setAdding(false)} />
      <RemoveFromFarmDialog member={member} farm={removing} onClose={() => setRemoving(null)} />
    </div>
  );
}

function AddToFarmDialog({ member, open, onClose }: { member: Member; open: boolean; onClose: () => void }) {
  const { farms, farmsUnavailable, onMembershipChange } = useMembersTableContext();
  const setMembership = useSetFarmMembership();
  const [farmId, setFarmId] = useState('');
  const [farmRole, setFarmRole] = useState<FarmRole>('hand');
  const [farmError, setFarmError] = useState<string | undefined>();
  const formId = useId();

  const close = () => {
    setFarmId('');
    setFarmRole('hand');
    setFarmError(undefined);
    setMembership.reset();
    onClose();
  };

  const submit = async (event: FormEvent) => {
    event.preventDefault();
    if (!farmId) {
      setFarmError('Farm: choose the farm to add them to');
      return;
    }
    setFarmError(undefined);
    try {
      await setMembership.mutateAsync({ farmId, userId: member.id, farmRole });
      onMembershipChange?.();
      close();
    } catch {
      // Shown from the mutation's error below.
    }
  };

  const current = member.farms.find((farm) => farm.farmId === farmId);

  return (
    <Dialog open={open} onClose={close} title={`Add ${member.name} to a farm`}>
      {farmsUnavailable ? (
        <Alert tone="danger">{farmsUnavailable}</Alert>
      ) : farms.length === 0 ? (
        <p className="text-ink-soft">No farms are registered yet. Once a farm is registered it can be chosen here.</p>
      ) : (
        <form id={formId} onSubmit={submit} noValidate className="flex flex-col gap-4">
          {setMembership.isError ? <Alert tone="danger">{errorMessage(setMembership.error)}</Alert> : null}
          <Field label="Farm" error={farmError}>
            <Select value={farmId} onChange={(event) => setFarmId(event.target.value)}>
              <option value="">Choose a farm…</option>
              {farms.map((farm) => (
                <option key={farm.id} value={farm.id}>
                  {farm.name} ({farm.code})
                </option>
              ))}
            </Select>
          </Field>
          <Field
            label="Role on this farm"
            hint={current ? `Already ${LABELS.farmRole[current.farmRole].toLowerCase()} here; saving changes the role.` : 'A farm lead registers the plants and sets what wood they can spare; a farm hand records in the field.'}
          >
            <Select value={farmRole} onChange={(event) => setFarmRole(event.target.value as FarmRole)}>
              {FARM_ROLES.map((role) => (
                <option key={role} value={role}>
                  {LABELS.farmRole[role]}
                </option>
              ))}
            </Select>
          </Field>
          <div className="flex flex-wrap justify-end gap-2">
            <Button variant="secondary" onClick={close}>
              Cancel
            </Button>
            <Button type="submit" busy={setMembership.isPending}>
              Add to farm
            </Button>
          </div>
        </form>
      )}
      {farmsUnavailable || farms.length === 0 ? (
        <div className="mt-4 flex justify-end">
          <Button variant="secondary" onClick={close}>
            Close
          </Button>
        </div>
      ) : null}
    </Dialog>
  );
}

function RemoveFromFarmDialog({ member, farm, onClose }: { member: Member; farm: FarmLink | null; onClose: () => void }) {
  const { onMembershipChange } = useMembersTableContext();
  const remove = useRemoveFarmMembership();

  const close = () => {
    remove.reset();
    onClose();
  };

  const confirm = async () => {
    if (!farm) return;
    try {
      await remove.mutateAsync({ farmId: farm.farmId, userId: member.id });
      onMembershipChange?.();
      close();
    } catch {
      // Shown from the mutation's error below.
    }
  };

  return (
    <Dialog open={farm !== null} onClose={close} title={farm ? `Remove ${member.name} from ${farm.farmName}?` : 'Remove from farm'}>
      <div className="flex flex-col gap-4">
        <p className="text-ink-soft">They stay a member of the cooperative; only their place on this farm ends.</p>
        {remove.isError ? <Alert tone="danger">{errorMessage(remove.error)}</Alert> : null}
        <div className="flex flex-wrap justify-end gap-2">
          <Button variant="secondary" onClick={close}>
            Keep
          </Button>
          <Button variant="danger" onClick={confirm} busy={remove.isPending}>
            Remove from farm
          </Button>
        </div>
      </div>
    </Dialog>
  );
}
