import type { WoodHistoryItem } from '../../../../shared/schemas/register';
import { plural } from '../../../lib/format';

const BUNDLE_WORDS: Record<string, string> = { reserved: 'Reserved', ready: 'Ready', collected: 'Collected', cancelled: 'Cancelled' };

export function WoodHistory({ items }: { items: WoodHistoryItem[] }) {
  if (items.length === 0) {
    return <p className="text-ink-soft">No wood has been offered from this plant yet. Offers are made each season, from clean plants only.</p>;
  }
  return (
    <ul className="flex flex-col divide-y divide-paper-edge">
      {items.map((season) => (
        <li key={season.seasonId} className="py-3">
          <p className="font-semibold">{season.seasonName}</p>
          <p className="text-ink-soft">{season.offered != null ? `${plural(season.offered, 'cutting')} offered` : 'No offer recorded'}</p>
          {season.bundles.length > 0 ? (
            <ul className="mt-1 flex flex-col gap-1">
              {season.bundles.map((bundle) => (
                <li key={bundle.id} className="text-sm">
                  Bundle {bundle.code ?? '(no code yet)'}: {plural(bundle.cuttings, 'cutting')} for {bundle.growerName} ·{' '}
                  {BUNDLE_WORDS[bundle.status] ?? bundle.status}
                </li>
              ))}
            </ul>
          ) : null}
        </li>
      ))}
    </ul>
  );
}
