import { useState } from 'react';
import { memberPatchSchema, type Member } from '../../../../shared/schemas/members';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { Field, TextArea } from '../../../components/ui/field';
import { errorMessage } from '../../../lib/api-client';
import { useUpdateMember } from '../api/update-member';
import { memberNameId, useMembersTableContext } from './members-context';

export function MemberStatusActions({ member }: { member: Member }) {
  const { currentUserId } = useMembersTableContext();
  const update = useUpdateMember();
  const [suspending, setSuspending] = useState(false);
  const isSelf = member.id === currentUserId;

  const setActive = () => update.mutate({ id: member.id, patch: { status: 'active' } });

  return (
    <div className="flex flex-col items-start gap-2">
      {member.status === 'pending' ? (
        <Button size="sm" onClick={setActive} busy={update.isPending} aria-describedby={memberNameId(member.id)}>
          Admit
        </Button>
      ) : null}
      {member.status === 'active' && !isSelf ? (
        <Button size="sm" variant="danger" onClick={() => setSuspending(true)} aria-describedby={memberNameId(member.id)}>
          Suspend
        </Button>
      ) : null}
      {member.status === 'suspended' ? (
        <Button size="sm" variant="secondary" onClick={setActive} busy={update.isPending} aria-describedby={memberNameId(member.id)}>
          Reinstate
        </Button>
      ) : null}
      {update.isError && !suspending ? (
        <Alert tone="danger" className="text-sm">
          {errorMessage(update.error)}
        </Alert>
      ) : null}
      <SuspendDialog member={member} open={suspending} onClose={() => setSuspending(false)} update={update} />
    </div>
  );
}

function SuspendDialog({
  member,
  open,
  onClose,
  update,
}: {
  member: Member;
  open: boolean;
  onClose: () => void;
  update: ReturnType<typeof useUpdateMember>;
}) {
  const [reason, setReason] = useState('');
  const [reasonError, setReasonError] = useState<string | undefined>();

  const confirm = async () => {
    const parsed = memberPatchSchema.safeParse({ status: 'suspended', reason: reason.trim() || undefined });
    if (!parsed.success) {
      setReasonError(parsed.error.issues.find((issue) => issue.path[0] === 'reason')?.message ?? parsed.error.issues[0]?.message);
      return;
    }
    setReasonError(undefined);
    try {
      await update.mutateAsync({ id: member.id, patch: parsed.data });
      setReason('');
      onClose();
    } catch {
      // The error is shown inside the dialog from the mutation's state.
    }
  };

  return (
    <Dialog open={open} onClose={onClose} title={`Suspend ${member.name}?`}>
      <div className="flex flex-col gap-4">
        <p className="text-ink-soft">
          A suspended member cannot sign in. Their farms and records stay as they are, and you can reinstate them at any time.
        </p>
        {update.isError ? <Alert tone="danger">{errorMessage(update.error)}</Alert> : null}
        <Field label="Reason" optional hint="Kept with the member's record." error={reasonError}>
          <TextArea rows={3} value={reason} onChange={(event) => setReason(event.target.value)} />
        </Field>
        <div className="flex flex-wrap justify-end gap-2">
          <Button variant="secondary" onClick={onClose}>
            Keep as member
          </Button>
          <Button variant="danger" onClick={confirm} busy={update.isPending}>
            Suspend
          </Button>
        </div>
      </div>
    </Dialog>
  );
}
