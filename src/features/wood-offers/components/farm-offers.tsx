import { Alert } from '../../../components/ui/alert';
import { EmptyState } from '../../../components/ui/empty-state';
import { Loading } from '../../../components/ui/loading';
import { StatusBadge } from '../../../components/ui/status-badge';
import type { OfferRow } from '../../../../shared/schemas/seasons';
import { errorMessage } from '../../../lib/api-client';
import { plural } from '../../../lib/format';
import { useFarmOffers } from '../api/get-farm-offers';
import { OfferRowEditor } from './offer-row-editor';

type Group = { key: string; title: string; rows: OfferRow[] };

function groupRows(rows: OfferRow[]): Group[] {
  const groups = new Map<string, Group>();
  for (const row of rows) {
    const key = `${row.speciesName}|${row.varietyName ?? ''}`;
    let group = groups.get(key);
    if (!group) {
      group = { key, title: row.varietyName ? `${row.speciesName} · ${row.varietyName}` : `${row.speciesName} (variety not recorded)`, rows: [] };
      groups.set(key, group);
    }
    group.rows.push(row);
  }
  return [...groups.values()];
}

function IneligibleRow({ row }: { row: OfferRow }) {
  return (
    <div className="flex flex-col gap-2 py-4 sm:flex-row sm:items-start sm:gap-4">
      <div className="flex items-center gap-3 sm:w-56 sm:shrink-0">
        <h4 className="font-semibold">{row.code}</h4>
        <StatusBadge status={row.healthStatus} />
      </div>
      <p className="text-ink-soft">
        <span className="font-medium text-ink">Cannot give wood: </span>
        {row.whyNot ?? 'Not eligible this season.'}
      </p>
    </div>
  );
}

/** Every plant of the farm for the season, grouped by species and variety. */
export function FarmOffers({ seasonId, farmId, canChange }: { seasonId: string; farmId: string; canChange: boolean }) {
  const offers = useFarmOffers({ seasonId, farmId });

  if (offers.isPending) return <Loading label="Loading the farm's plants…" />;
  if (offers.isError) {
    return (
      <Alert tone="danger" title="The farm's plants did not load">
        {errorMessage(offers.error)}
      </Alert>
    );
  }

  const rows = offers.data.items;
  if (rows.length === 0) {
    return (
      <EmptyState title="No plants on this farm yet">
        Register the farm's mother plants first; each clean, recently inspected plant then appears here to offer wood from.
      </EmptyState>
    );
  }

  const eligible = rows.filter((r) => r.eligible);
  const offered = rows.filter((r) => r.offer && r.offer.offered > 0);
  const total = offered.reduce((sum, r) => sum + (r.offer?.offered ?? 0), 0);
  const groups = groupRows(rows);

  return (
    <div className="flex flex-col gap-6" aria-busy={offers.isFetching || undefined}>
      <p className="text-lg">
        <strong>{plural(eligible.length, 'plant')}</strong> of {rows.length} can give wood this season;{' '}
        <strong>{plural(offered.length, 'plant')}</strong> offer <strong>{total.toLocaleString('en')} cuttings</strong>.
      </p>
      {groups.map((group) => (
        <section key={group.key} aria-label={group.title} className="rounded-card border border-paper-edge bg-white/60 px-5">
          <h3 className="-mx-5 rounded-t-card border-b border-paper-edge bg-paper-deep px-5 py-3 text-lg font-semibold">
            {group.title} <span className="font-normal text-ink-soft">· {plural(group.rows.length, 'plant')}</span>
            <span className="block text-sm font-normal text-ink-soft">
              Cuttings {group.rows[0].cuttingLengthCm} cm long; the soft tip ({group.rows[0].softTipCm} cm) is discarded.
            </span>
          </h3>
          <div className="divide-y divide-paper-edge">
            {group.rows.map((row) =>
              row.eligible ? <OfferRowEditor key={row.plantId} seasonId={seasonId} row={row} canChange={canChange} /> : <IneligibleRow key={row.plantId} row={row} />,
            )}
          </div>
        </section>
      ))}
    </div>
  );
}
