// The map page: filters, tools, the map and a side panel (the selected plant or farm, the
// open tool, the farms, the legend). Only one tool works the map at a time.
import type * as Leaflet from 'leaflet';
import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { Field, Select } from '../../../components/ui/field';
import { Loading } from '../../../components/ui/loading';
import { errorMessage } from '../../../lib/api-client';
import { useMapFeatures } from '../api/get-map-features';
import { useTileMeta } from '../api/get-tile-meta';
import type { MapFarm, MapFilters, MapPlant, UnplacedPlant } from '../api/types';
import { currentPosition, geolocationMessage } from '../lib/geolocation';
import { L } from '../lib/leaflet-plugins';
import { HedgerowTool } from './hedgerow-tool';
import { HeelwoodMap } from './heelwood-map';
import { ImageOverlayTool } from './image-overlay-tool';
import { MapErrorBoundary } from './map-error-boundary';
import { MapFiltersBar, type SpeciesOption } from './map-filters';
import { MapLegend } from './map-legend';
import { MovePlantTool } from './move-plant-tool';
import { OutlineEditor } from './outline-editor';
import { FarmPanel, PlantPanel } from './plant-panel';

type Mode =
  | { kind: 'browse' }
  | { kind: 'hedgerow' }
  | { kind: 'outline'; farmId: string | null }
  | { kind: 'move'; plant: MapPlant | UnplacedPlant }
  | { kind: 'overlay' };

type Selection = { kind: 'plant'; plant: MapPlant } | { kind: 'farm'; farm: MapFarm } | null;

type Props = {
  filters: MapFilters;
  onFiltersChange: (next: MapFilters) => void;
  species: SpeciesOption[];
  /** A plant's position changed (the register's caches may want to know). */
  onPlantMoved?: (id: string) => void;
};

const BROWSE: Mode = { kind: 'browse' };

export function MapPage({ filters, onFiltersChange, species, onPlantMoved }: Props) {
  const meta = useTileMeta();
  const features = useMapFeatures(filters);
  const [map, setMap] = useState<Leaflet.Map | null>(null);
  const [mode, setMode] = useState<Mode>(BROWSE);
  const [selection, setSelection] = useState<Selection>(null);
  const [drawn, setDrawn] = useState<number | null>(null);
  const [nearMe, setNearMe] = useState<{ busy: boolean; message: string | null; tone: 'info' | 'warning' }>({ busy: false, message: null, tone: 'info' });
  const here = useRef<Leaflet.LayerGroup | null>(null);

  const farms = useMemo(() => features.data?.farms ?? [], [features.data]);
  const plants = useMemo(() => features.data?.plants ?? [], [features.data]);
  const unplaced = features.data?.unplaced ?? [];
  const farmById = useMemo(() => new Map(farms.map((f) => [f.id, f])), [farms]);
  const editable = farms.filter((f) => f.canEditOutline);
  const editingFarmId = mode.kind === 'outline' ? mode.farmId : null;
  const shownFarms = useMemo(
    () => (editingFarmId ? farms.map((f) => (f.id === editingFarmId ? { ...f, outline: null } : f)) : farms),
    [farms, editingFarmId],
  );

  // Where to look: every farm, or the chosen farm and its plants.
  const fitKey = `${filters.farmId ?? 'all'}:${farms.length ? 'ready' : 'waiting'}`;
  const fitTo = useMemo(() => {
    if (filters.farmId) {
      const f = farmById.get(filters.farmId);
      const own = plants.filter((p) => p.farmId === filters.farmId && p.full);
      return [...(f ? [{ lat: f.lat, lon: f.lon }] : []), ...own.map((p) => ({ lat: p.lat, lon: p.lon }))];
    }
    return farms.map((f) => ({ lat: f.lat, lon: f.lon }));
  }, [filters.farmId, farmById, farms, plants]);

  const setTool = useCallback((next: Mode) => {
    setSelection(null);
    setMode(next);
  }, []);
  const hedgerowActive = useCallback((on: boolean) => setTool(on ? { kind: 'hedgerow' } : BROWSE), [setTool]);
  const overlayActive = useCallback((on: boolean) => setTool(on ? { kind: 'overlay' } : BROWSE), [setTool]);
  const onPlantsDrawn = useCallback((n: number) => {
    // A mark in the browser's performance timeline: scripts/bench-map.ts times the map by it.
    performance.mark('heelwood:map-plants-drawn', { detail: { count: n } });
    setDrawn(n);
  }, []);

  useEffect(() => () => void here.current?.remove(), []);

  const findMe = async () => {
    setNearMe({ busy: true, message: null, tone: 'info' });
    try {
      const fix = await currentPosition();
      here.current?.remove();
      if (map) {
        here.current = L.layerGroup([
          L.circle([fix.lat, fix.lon], { radius: fix.accuracyM, color: '#6a1f48', weight: 1, fillOpacity: 0.08, interactive: false }),
          L.circleMarker([fix.lat, fix.lon], { radius: 7, color: '#fff', weight: 2, fillColor: '#6a1f48', fillOpacity: 1, interactive: false }),
        ]).addTo(map);
        map.setView([fix.lat, fix.lon], Math.max(map.getZoom(), 16));
      }
      setNearMe({ busy: false, message: `You are here, to within about ${Math.max(1, Math.round(fix.accuracyM))} m.`, tone: 'info' });
    } catch (err) {
      setNearMe({ busy: false, message: geolocationMessage(err as GeolocationPositionError | Error), tone: 'warning' });
    }
  };

  const zoomToFarm = (f: MapFarm) => {
    if (!map) return;
    const own = plants.filter((p) => p.farmId === f.id && p.full);
    if (own.length > 1) map.fitBounds(L.latLngBounds(own.map((p) => [p.lat, p.lon] as [number, number])), { padding: [40, 40], maxZoom: 18 });
    else map.setView([f.lat, f.lon], 17);
  };

  const failed = meta.error ?? features.error;
  const count = plants.length;
  const outlineFarm = mode.kind === 'outline' && mode.farmId ? farmById.get(mode.farmId) : undefined;

  return (
    <div className="grid gap-5 lg:grid-cols-[minmax(0,1fr)_22rem]">
      <div className="flex min-w-0 flex-col gap-4">
        <MapFiltersBar filters={filters} species={species} farms={farms} onChange={onFiltersChange} />
        <div className="flex flex-wrap items-center gap-2" role="toolbar" aria-label="Map tools">
          <Button variant="secondary" onClick={findMe} busy={nearMe.busy}>
            Near me
          </Button>
          <Button variant={mode.kind === 'hedgerow' ? 'primary' : 'secondary'} aria-pressed={mode.kind === 'hedgerow'} onClick={() => hedgerowActive(mode.kind !== 'hedgerow')}>
            Plan a hedgerow
          </Button>
          {editable.length ? (
            <Button
              variant={mode.kind === 'outline' ? 'primary' : 'secondary'}
              aria-pressed={mode.kind === 'outline'}
              onClick={() => setTool(mode.kind === 'outline' ? BROWSE : { kind: 'outline', farmId: editable.length === 1 ? editable[0].id : null })}
            >
              {editable.length === 1 ? 'Draw my farm' : 'Draw a farm'}
            </Button>
          ) : null}
          <Button variant={mode.kind === 'overlay' ? 'primary' : 'secondary'} aria-pressed={mode.kind === 'overlay'} onClick={() => overlayActive(mode.kind !== 'overlay')}>
            Lay an image over the map
          </Button>
          <p className="ml-auto text-sm text-ink-soft" role="status" data-testid="map-count">
            {features.isPending ? 'Loading plants…' : `${count.toLocaleString('en-GB')} ${count === 1 ? 'plant' : 'plants'} on ${farms.length} farms`}
            {features.isFetching && !features.isPending ? ' (updating)' : ''}
          </p>
        </div>
        {nearMe.message ? <Alert tone={nearMe.tone}>{nearMe.message}</Alert> : null}
        {failed ? (
          <Alert tone="danger" title="The map could not load">
            {errorMessage(failed)} Reload the page to try again.
          </Alert>
        ) : null}
        <div data-plants-drawn={drawn ?? undefined} data-testid="map-frame">
          {meta.data ? (
            <MapErrorBoundary>
              <HeelwoodMap
                meta={meta.data}
                farms={shownFarms}
                plants={plants}
                fitKey={fitKey}
                fitTo={fitTo}
                capturing={mode.kind !== 'browse'}
                onSelectPlant={(plant) => {
                  if (mode.kind === 'browse') setSelection({ kind: 'plant', plant });
                }}
                onSelectFarm={(farm) => {
                  if (mode.kind === 'browse') setSelection({ kind: 'farm', farm });
                }}
                onPlantsDrawn={onPlantsDrawn}
                mapRef={setMap}
              />
            </MapErrorBoundary>
          ) : meta.isPending ? (
            <Loading label="Loading the map…" />
          ) : null}
        </div>
      </div>

      <aside className="flex flex-col gap-4" aria-label="Map details">
        <HedgerowTool map={map} active={mode.kind === 'hedgerow'} onActiveChange={hedgerowActive} />
        <ImageOverlayTool map={map} active={mode.kind === 'overlay'} onActiveChange={overlayActive} />

        {mode.kind === 'outline' ? (
          outlineFarm ? (
            <Card>
              <OutlineEditor key={outlineFarm.id} map={map} farm={outlineFarm} onDone={() => setTool(BROWSE)} />
            </Card>
          ) : (
            <Card>
              <Field label="Which farm?">
                <Select defaultValue="" onChange={(e) => e.target.value && setTool({ kind: 'outline', farmId: e.target.value })}>
                  <option value="">Choose a farm</option>
                  {editable.map((f) => (
                    <option key={f.id} value={f.id}>
                      {f.name}
                    </option>
                  ))}
                </Select>
              </Field>
            </Card>
          )
        ) : null}

        {mode.kind === 'move' ? (
          <Card>
            <MovePlantTool key={mode.plant.id} map={map} plant={mode.plant} onMoved={onPlantMoved} onDone={() => setTool(BROWSE)} />
          </Card>
        ) : null}

        {mode.kind === 'browse' && selection?.kind === 'plant' ? (
          <Card>
            <PlantPanel
              plant={selection.plant}
              farm={farmById.get(selection.plant.farmId)}
              onMove={selection.plant.full && farmById.get(selection.plant.farmId)?.canPlace ? () => setTool({ kind: 'move', plant: selection.plant }) : undefined}
              onClose={() => setSelection(null)}
            />
          </Card>
        ) : null}
        {mode.kind === 'browse' && selection?.kind === 'farm' ? (
          <Card>
            <FarmPanel
              farm={selection.farm}
              plantCount={plants.filter((p) => p.farmId === selection.farm.id).length}
              onZoom={() => zoomToFarm(selection.farm)}
              onDraw={selection.farm.canEditOutline ? () => setTool({ kind: 'outline', farmId: selection.farm.id }) : undefined}
              onClose={() => setSelection(null)}
            />
          </Card>
        ) : null}

        {mode.kind === 'browse' && !selection ? (
          <p className="text-sm text-ink-soft">Tap a plant or a farm for its details. Numbers in rings are plants close together: tap one to zoom in.</p>
        ) : null}

        {mode.kind === 'browse' && unplaced.length ? (
          <section aria-labelledby="unplaced-title">
            <h2 id="unplaced-title" className="mb-2 font-semibold text-ink">
              Plants without a position ({unplaced.length})
            </h2>
            <ul className="flex max-h-60 flex-col gap-1 overflow-y-auto">
              {unplaced.slice(0, 200).map((p) => (
                <li key={p.id} className="flex items-center justify-between gap-2 text-sm">
                  <span>
                    <span className="font-medium">{p.code}</span> {p.speciesName}
                    {p.varietyName ? ` ${p.varietyName}` : ''}
                  </span>
                  <Button size="sm" variant="secondary" onClick={() => setTool({ kind: 'move', plant: p })}>
                    Place
                  </Button>
                </li>
              ))}
            </ul>
          </section>
        ) : null}

        {farms.length ? (
          <section aria-labelledby="farms-title">
            <h2 id="farms-title" className="mb-2 font-semibold text-ink">
              Farms ({farms.length})
            </h2>
            <ul className="flex flex-col" data-testid="map-farms">
              {farms.map((f) => (
                <li key={f.id}>
                  <button
                    type="button"
                    className="flex min-h-touch w-full items-center justify-between gap-2 rounded-lg px-2 text-left text-ink hover:bg-paper-deep"
                    onClick={() => {
                      zoomToFarm(f);
                      if (mode.kind === 'browse') setSelection({ kind: 'farm', farm: f });
                    }}
                  >
                    <span className="font-medium">{f.name}</span>
                    <span className="text-sm text-ink-soft">{f.code}</span>
                  </button>
                </li>
              ))}
            </ul>
          </section>
        ) : null}

        <MapLegend />
      </aside>
    </div>
  );
}
