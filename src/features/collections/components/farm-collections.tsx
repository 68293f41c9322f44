import type { FarmCollection } from '../../../../shared/schemas/allocation';
import { paths } from '../../../app/paths';
import { Alert } from '../../../components/ui/alert';
import { Button, ButtonLink } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { Loading } from '../../../components/ui/loading';
import { StatusBadge } from '../../../components/ui/status-badge';
import { errorMessage } from '../../../lib/api-client';
import { cn } from '../../../lib/cn';
import { plural } from '../../../lib/format';
import { useCollections } from '../api/get-collections';
import { useFarmWindows } from '../api/get-farm-windows';
import { useMarkCollection } from '../api/mark-collection';
import { collectionCounts, visitsByGrower, type GrowerVisit } from '../lib/collection-groups';
import { formatWindow, zoneWords } from '../lib/farm-time';

const big = 'min-h-[3.25rem] w-full px-5 text-lg sm:w-auto';

function BundleItem({ bundle, seasonId, farmId }: { bundle: FarmCollection; seasonId: string; farmId: string }) {
  const mark = useMarkCollection();
  const collected = bundle.status === 'collected';
  const label = `${bundle.code ?? 'bundle'}: ${bundle.cuttings} ${bundle.speciesName}`;
  return (
    <li
      className={cn('flex flex-col gap-3 rounded-lg border-2 p-3 sm:flex-row sm:items-center sm:justify-between', collected ? 'border-leaf/50 bg-leaf-light/40' : 'border-paper-edge bg-white')}
      data-testid="collection-bundle"
    >
      <div className="min-w-0">
        <p className="flex flex-wrap items-center gap-x-3 gap-y-1">
          <span className="font-mono text-xl font-bold tracking-wide">{bundle.code ?? '—'}</span>
          <StatusBadge status={bundle.status} />
        </p>
        <p className="mt-1">
          <span className="font-semibold tabular-nums">{bundle.cuttings.toLocaleString('en')}</span> cuttings of {bundle.speciesName}
          {bundle.varietyName ? ` ‘${bundle.varietyName}’` : ''}
        </p>
        <p className="text-sm text-ink-soft">
          Cut from plant <span className="font-mono font-semibold text-ink">{bundle.plantCode}</span>
        </p>
        {mark.isError ? <p className="mt-1 text-sm font-medium text-rust">{errorMessage(mark.error)}</p> : null}
      </div>
      {bundle.status === 'cancelled' ? (
        <p className="font-semibold text-ink-soft">Cancelled: do not cut</p>
      ) : collected ? (
        <Button
          variant="secondary"
          className={big}
          busy={mark.isPending}
          aria-label={`Mark ${label} as not collected`}
          onClick={() => mark.mutate({ bundleId: bundle.bundleId, collected: false, seasonId, farmId })}
        >
          Not collected after all
        </Button>
      ) : (
        <Button className={big} busy={mark.isPending} aria-label={`Mark ${label} as collected`} onClick={() => mark.mutate({ bundleId: bundle.bundleId, collected: true, seasonId, farmId })}>
          Mark collected
        </Button>
      )}
    </li>
  );
}

function Visit({ visit, timezone, seasonId, farmId }: { visit: GrowerVisit; timezone: string | null; seasonId: string; farmId: string }) {
  const done = visit.bundles.every((b) => b.status === 'collected' || b.status === 'cancelled');
  return (
    <li className="rounded-card border border-paper-edge bg-white/60 p-4 sm:p-5" data-testid="collection-visit">
      <div className="flex flex-wrap items-start justify-between gap-2">
        <div>
          <h2 className="text-lg font-semibold">{visit.growerName}</h2>
          <p className="text-sm">
            <a href={`mailto:${visit.growerEmail}`} className="break-all">
              {visit.growerEmail}
            </a>
          </p>
        </div>
        <p className="sm:text-right">
          {visit.window && timezone ? (
            <>
              <span className="block font-semibold tabular-nums">{formatWindow(visit.window.startsAt, visit.window.endsAt, timezone)}</span>
              <span className="block text-sm text-ink-soft">{zoneWords(timezone)}</span>
            </>
          ) : visit.window ? (
            <span className="font-semibold">{new Date(visit.window.startsAt).toLocaleString('en-GB')}</span>
          ) : (
            <span className="text-ink-soft">No window set: agree a time with the grower</span>
          )}
        </p>
      </div>
      {done ? <p className="mt-2 text-sm font-semibold text-leaf-dark">Everything for {visit.growerName} is collected.</p> : null}
      <ul className="mt-3 flex flex-col gap-2" aria-label={`Bundles for ${visit.growerName}`}>
        {visit.bundles.map((b) => (
          <BundleItem key={b.bundleId} bundle={b} seasonId={seasonId} farmId={farmId} />
        ))}
      </ul>
    </li>
  );
}

/** The list a farm works from on collection days: who comes when, and what to hand over. */
export function FarmCollectionsView({ items, timezone, seasonId, farmId }: { items: FarmCollection[]; timezone: string | null; seasonId: string; farmId: string }) {
  const counts = collectionCounts(items);
  const visits = visitsByGrower(items);
  return (
    <div className="flex flex-col gap-5">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <p>
          {plural(counts.bundles, 'bundle')} for {plural(counts.growers, 'grower')}, {counts.cuttings.toLocaleString('en')} cuttings in all.{' '}
          <span className="font-semibold">{counts.collected} collected</span>, {counts.bundles - counts.collected} to go.
        </p>
        <ButtonLink variant="secondary" to={paths.bundleLabels(seasonId, farmId)}>
          Print bundle labels
        </ButtonLink>
      </div>
      <p className="rounded-lg bg-paper-deep px-4 py-3 text-sm">
        Cut from the named plant only, label each bundle with its code, and keep the wood cool and moist until it is collected. Sharp tools: cut away from
        your body and clean the blades between plants.
      </p>
      <ol className="flex flex-col gap-4" aria-label="Growers in the order they come">
        {visits.map((v) => (
          <Visit key={v.growerEmail} visit={v} timezone={timezone} seasonId={seasonId} farmId={farmId} />
        ))}
      </ol>
    </div>
  );
}

export function FarmCollections({ seasonId, farmId, farmName }: { seasonId: string; farmId: string; farmName: string }) {
  const list = useCollections(seasonId, farmId);
  const windows = useFarmWindows(seasonId, farmId);
  if (list.isPending) return <Loading label="Loading the collections…" />;
  if (list.isError) {
    return (
      <Alert tone="danger" title="The collections did not load">
        {errorMessage(list.error)}
      </Alert>
    );
  }
  if (list.data.items.length === 0) {
    return (
      <EmptyState title={`Nothing to collect at ${farmName} yet`}>
        Once the coordinator approves an allocation round that takes wood from this farm, the growers, their bundles and their pickup windows are listed
        here, and the farm gets the list by e-mail.
      </EmptyState>
    );
  }
  const timezone = windows.data?.items[0]?.timezone ?? null;
  return <FarmCollectionsView items={list.data.items} timezone={timezone} seasonId={seasonId} farmId={farmId} />;
}
