import { useState } from 'react';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { errorMessage } from '../../../lib/api-client';
import { useWithdrawMyRequest } from '../api/withdraw-my-request';

/** Takes the whole request back; it can be filed again while requests are open. */
export function WithdrawRequest({ seasonId }: { seasonId: string }) {
  const withdraw = useWithdrawMyRequest();
  const [open, setOpen] = useState(false);
  const onConfirm = async () => {
    try {
      await withdraw.mutateAsync({ seasonId });
      setOpen(false);
    } catch {
      // Shown in the dialog.
    }
  };
  return (
    <>
      <Button
        variant="danger"
        onClick={() => {
          withdraw.reset();
          setOpen(true);
        }}
      >
        Withdraw the request
      </Button>
      <Dialog open={open} onClose={() => setOpen(false)} title="Withdraw your request?">
        <div className="flex flex-col gap-4">
          <p>It will not be matched to any wood. You can file it again until the deadline.</p>
          {withdraw.isError ? <Alert tone="danger">{errorMessage(withdraw.error)}</Alert> : null}
          <div className="flex flex-wrap gap-3">
            <Button variant="danger" onClick={onConfirm} busy={withdraw.isPending}>
              Yes, withdraw
            </Button>
            <Button variant="secondary" onClick={() => setOpen(false)}>
              Keep it
            </Button>
          </div>
        </div>
      </Dialog>
    </>
  );
}
