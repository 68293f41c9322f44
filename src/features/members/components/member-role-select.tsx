import { useId } from 'react';
import { LABELS, USER_ROLES, type UserRole } from '../../../../shared/domain';
import type { Member } from '../../../../shared/schemas/members';
import { Alert } from '../../../components/ui/alert';
import { Select } from '../../../components/ui/field';
import { errorMessage } from '../../../lib/api-client';
import { useUpdateMember } from '../api/update-member';
import { useMembersTableContext } from './members-context';

export function MemberRoleSelect({ member }: { member: Member }) {
  const { currentUserId } = useMembersTableContext();
  const update = useUpdateMember();
  const id = useId();
  // A coordinator cannot demote themselves here: it is too easy to lock the cooperative out.
  const isSelf = member.id === currentUserId;

  return (
    <div className="flex min-w-40 flex-col gap-1">
      <label htmlFor={id} className="sr-only">
        Role of {member.name}
      </label>
      <Select
        id={id}
        value={member.role}
        disabled={isSelf || update.isPending}
        aria-describedby={isSelf ? `${id}-self` : undefined}
        onChange={(event) => update.mutate({ id: member.id, patch: { role: event.target.value as UserRole } })}
      >
        {USER_ROLES.map((role) => (
          <option key={role} value={role}>
            {LABELS.role[role]}
          </option>
        ))}
      </Select>
      {isSelf ? (
        <p id={`${id}-self`} className="text-xs text-ink-faint">
          Your own role
        </p>
      ) : null}
      {update.isError ? (
        <Alert tone="danger" className="text-sm">
          {errorMessage(update.error)}
        </Alert>
      ) : null}
    </div>
  );
}
