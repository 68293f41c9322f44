import type { RoundBundle } from '../../../../shared/schemas/allocation';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { errorMessage } from '../../../lib/api-client';
import { useRemoveBundle } from '../api/remove-bundle';
import { count, woodName } from '../lib/round-facts';

export function RemoveBundleDialog({ roundId, bundle, onClose }: { roundId: string; bundle: RoundBundle | null; onClose: () => void }) {
  const remove = useRemoveBundle();
  const close = () => {
    remove.reset();
    onClose();
  };
  return (
    <Dialog open={bundle !== null} onClose={close} title="Remove this bundle?">
      {bundle ? (
        <div className="flex flex-col gap-4">
          <p>
            {bundle.growerName} would no longer get {count(bundle.cuttings)} cuttings of {woodName(bundle.speciesName, bundle.varietyName)} from{' '}
            <span className="font-mono font-semibold">{bundle.plantCode}</span> at {bundle.farmName}. A re-run may give that wood out again, unless other
            bundles are locked.
          </p>
          {remove.isError ? <Alert tone="danger">{errorMessage(remove.error)}</Alert> : null}
          <div className="flex flex-wrap gap-3">
            <Button
              variant="danger"
              busy={remove.isPending}
              onClick={async () => {
                try {
                  await remove.mutateAsync({ roundId, bundleId: bundle.id });
                  close();
                } catch {
                  // Shown above from the mutation's error.
                }
              }}
            >
              Remove the bundle
            </Button>
            <Button variant="secondary" onClick={close}>
              Keep it
            </Button>
          </div>
        </div>
      ) : null}
    </Dialog>
  );
}
