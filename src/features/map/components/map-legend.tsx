import { HEALTH_STATUSES } from '../../../../shared/domain';
import { STATUS_LOOKS, StatusShapeIcon } from '../../../components/ui/status-badge';
import { cn } from '../../../lib/cn';
import { statusColourClass } from '../lib/marker-icons';

const MEANING: Record<(typeof HEALTH_STATUSES)[number], string> = {
  clean: 'may give wood',
  watch: 'being watched; no wood for now',
  hold: 'on hold; no wood, coordinator decides',
  retired: 'kept as history',
};

/** What the map's shapes and lines mean: every status is a shape and words, not only a colour. */
export function MapLegend({ className }: { className?: string }) {
  return (
    <section aria-labelledby="map-legend-title" className={cn('text-sm', className)}>
      <h2 id="map-legend-title" className="mb-2 font-semibold text-ink">
        Legend
      </h2>
      <ul className="flex flex-col gap-1.5" data-testid="map-legend">
        {HEALTH_STATUSES.map((s) => (
          <li key={s} className="flex items-center gap-2" data-status={s}>
            <span className={cn('flex w-5 justify-center', statusColourClass(s))}>
              <StatusShapeIcon shape={STATUS_LOOKS[s].shape} />
            </span>
            <span>
              <span className="font-medium text-ink">{STATUS_LOOKS[s].label}</span>
              <span className="text-ink-soft">: {MEANING[s]}</span>
            </span>
          </li>
        ))}
        <li className="flex items-center gap-2">
          <span className="flex w-5 justify-center" aria-hidden="true">
            <svg width="18" height="18" viewBox="0 0 18 18">
              <circle cx="9" cy="9" r="7.5" fill="#f8f4eb" stroke="#6f543d" strokeWidth="2" />
            </svg>
          </span>
          <span className="text-ink-soft">
            <span className="font-medium text-ink">Number in a ring</span>: plants close together; tap to zoom in
          </span>
        </li>
        <li className="flex items-center gap-2">
          <span className="flex w-5 justify-center text-currant" aria-hidden="true">
            <svg width="16" height="15" viewBox="0 0 16 15">
              <path d="M2 13V6.5L8 2l6 4.5V13z" fill="currentColor" />
            </svg>
          </span>
          <span className="font-medium text-ink">Farm</span>
        </li>
        <li className="flex items-center gap-2">
          <LineSample stroke="#6f543d" dash="5 3" />
          <span>
            <span className="font-medium text-ink">Farm outline</span>
            <span className="text-ink-soft">, </span>
            <span className="font-medium text-ink">bed</span>
            <span className="text-ink-soft"> (green area), </span>
            <span className="font-medium text-ink">row</span>
            <span className="text-ink-soft"> (green line)</span>
          </span>
        </li>
        <li className="flex items-center gap-2">
          <LineSample stroke="#6a1f48" width={3.5} />
          <span className="font-medium text-ink">Planned hedgerow</span>
        </li>
        <li className="flex items-center gap-2">
          <LineSample stroke="#a58a6c" width={1} />
          <span className="text-ink-soft">
            <span className="font-medium text-ink">Grid</span>: 10 m squares close in (50 m, then 100 m further out), where no detailed map is loaded
          </span>
        </li>
      </ul>
      <p className="mt-2 text-ink-soft">Other farms’ plants appear only while clean, and near their farm rather than at the bush (about 1 km).</p>
    </section>
  );
}

function LineSample({ stroke, dash, width = 2 }: { stroke: string; dash?: string; width?: number }) {
  return (
    <span className="flex w-5 justify-center" aria-hidden="true">
      <svg width="20" height="10" viewBox="0 0 20 10">
        <path d="M1 5h18" stroke={stroke} strokeWidth={width} strokeDasharray={dash} />
      </svg>
    </span>
  );
}
