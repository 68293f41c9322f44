import type { RoundView } from '../../../../shared/schemas/allocation';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { errorMessage, isApiError } from '../../../lib/api-client';
import { plural } from '../../../lib/format';
import { useApproveRound, type RoundAndMail } from '../api/approve-round';
import { approvalPlan, count, heldBundleIds } from '../lib/round-facts';

/** Says what approval will do, in numbers, before it is done; approval cannot be taken back here. */
export function ApproveDialog({
  round,
  open,
  onClose,
  onApproved,
  onRefused,
}: {
  round: RoundView;
  open: boolean;
  onClose: () => void;
  onApproved: (result: RoundAndMail) => void;
  /** The server refused because some bundles' plants may no longer give wood. */
  onRefused: (bundleIds: string[], message: string) => void;
}) {
  const approve = useApproveRound();
  const plan = approvalPlan(round);

  const confirm = async () => {
    try {
      const result = await approve.mutateAsync(round.id);
      onApproved(result);
    } catch (error) {
      const ids = isApiError(error) ? heldBundleIds(error.fields) : [];
      if (ids.length) onRefused(ids, errorMessage(error));
    }
  };

  return (
    <Dialog
      open={open}
      onClose={() => {
        approve.reset();
        onClose();
      }}
      title="Approve and send pickup slips?"
    >
      <div className="flex flex-col gap-4">
        <p>Approving round {round.number} of {round.seasonName} will:</p>
        <ol className="flex list-decimal flex-col gap-2 pl-6">
          <li>
            reserve <strong>{count(plan.cuttings)} cuttings</strong> from {plural(plan.plants, 'plant')} at {plural(plan.farms, 'farm')}, so no other round can
            give that wood again;
          </li>
          <li>
            make <strong>{plural(plan.bundles, 'bundle')}</strong>, each with its own code for the label;
          </li>
          <li>
            e-mail a pickup slip to <strong>{plural(plan.growers, 'grower')}</strong>, with the farms in visiting order and calendar files for the pickup
            windows;
          </li>
          <li>
            e-mail a collection list to <strong>{plural(plan.farms, 'farm')}</strong>.
          </li>
        </ol>
        <p className="rounded-lg bg-paper-deep px-4 py-3 text-ink-soft">Once approved, the round can no longer be edited or run again.</p>
        {approve.isError ? <Alert tone="danger">{errorMessage(approve.error)}</Alert> : null}
        <div className="flex flex-wrap gap-3">
          <Button onClick={confirm} busy={approve.isPending} disabled={plan.bundles === 0}>
            Yes, approve and send
          </Button>
          <Button
            variant="secondary"
            onClick={() => {
              approve.reset();
              onClose();
            }}
          >
            Cancel
          </Button>
        </div>
      </div>
    </Dialog>
  );
}
