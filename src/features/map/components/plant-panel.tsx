import { Link } from 'react-router-dom';
import { paths } from '../../../app/paths';
import { Button } from '../../../components/ui/button';
import { StatusBadge } from '../../../components/ui/status-badge';
import type { MapFarm, MapPlant } from '../api/types';
import { formatLatLon } from '../lib/format';

export function PlantPanel({ plant, farm, onMove, onClose }: { plant: MapPlant; farm?: MapFarm; onMove?: () => void; onClose: () => void }) {
  return (
    <div className="flex flex-col gap-3" data-testid="plant-panel">
      <div className="flex items-start justify-between gap-2">
        <h2 className="text-lg font-semibold text-ink">{plant.code}</h2>
        <StatusBadge status={plant.healthStatus} />
      </div>
      <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-1 text-sm">
        <dt className="text-ink-soft">Species</dt>
        <dd className="text-ink">{plant.speciesName}</dd>
        <dt className="text-ink-soft">Variety</dt>
        <dd className="text-ink">{plant.varietyName ?? 'Not named'}</dd>
        <dt className="text-ink-soft">Farm</dt>
        <dd className="text-ink">{farm?.name ?? 'Unknown farm'}</dd>
        <dt className="text-ink-soft">{plant.full ? 'Position' : 'Near'}</dt>
        <dd className="tabular-nums text-ink">{formatLatLon(plant.lat, plant.lon)}</dd>
      </dl>
      {!plant.full ? (
        <p className="text-sm text-ink-soft">Shown near its farm (within about 1 km): only the farm’s own people and coordinators see where the bush stands.</p>
      ) : null}
      <div className="flex flex-wrap gap-2">
        <Link to={paths.plant(plant.id)} className="inline-flex min-h-touch items-center font-semibold">
          Open the plant’s page
        </Link>
        {onMove ? (
          <Button variant="secondary" onClick={onMove}>
            Move this plant
          </Button>
        ) : null}
        <Button variant="quiet" onClick={onClose}>
          Close
        </Button>
      </div>
    </div>
  );
}

export function FarmPanel({
  farm,
  plantCount,
  onZoom,
  onDraw,
  onClose,
}: {
  farm: MapFarm;
  plantCount: number;
  onZoom: () => void;
  onDraw?: () => void;
  onClose: () => void;
}) {
  return (
    <div className="flex flex-col gap-3" data-testid="farm-panel">
      <h2 className="text-lg font-semibold text-ink">
        {farm.name} <span className="font-normal text-ink-soft">({farm.code})</span>
      </h2>
      <p className="text-sm text-ink">
        {plantCount === 1 ? '1 plant' : `${plantCount} plants`} on the map with the current filters.
        {farm.outline ? '' : ' No outline drawn yet.'}
      </p>
      <div className="flex flex-wrap gap-2">
        <Button variant="secondary" onClick={onZoom}>
          Zoom to the farm
        </Button>
        {onDraw ? (
          <Button variant="secondary" onClick={onDraw}>
            Draw its outline and beds
          </Button>
        ) : null}
        <Button variant="quiet" onClick={onClose}>
          Close
        </Button>
      </div>
    </div>
  );
}
