// The Leaflet map itself: the offline basemap served by this application, farms with their
// drawings, plants in clusters, a metric grid where the basemap has no detail, the scale,
// the cursor's coordinates and the credit for every data source.
import type { FeatureCollection } from 'geojson';
import type * as Leaflet from 'leaflet';
import { useEffect, useMemo, useRef, useState, type Ref } from 'react';
import { AttributionControl, MapContainer, ScaleControl, useMap } from 'react-leaflet';
import type { MapFarm, MapPlant, OutlineFeature, TileMeta } from '../api/types';
import { escapeHtml, formatLatLon } from '../lib/format';
import { gridLines, gridStepForZoom } from '../lib/grid';
import { L } from '../lib/leaflet-plugins';
import { clusterIconHtml, farmIconHtml, plantIconHtml } from '../lib/marker-icons';
import { isCluster, PlantClusters } from '../lib/plant-clusters';
import './map.css';

export const MAP_MAX_ZOOM = 19;
/** From here in, plants carry their code beside the shape. */
const LABEL_ZOOM = 18;
/** From here in, farm outlines and beds carry the detail, and farm tags step aside. */
const NEAR_ZOOM = 16;
const BED_LABEL_ZOOM = 17;
/** Farm zoom: where a basemap enlarged this far has nothing more to show. */
const FARM_ZOOM = 14;
/** Zooms past its deepest that the world layer is still enlarged, beside a detail region. */
const WORLD_ENLARGE = 4;
/** A cooperative is regional: below this the clusters would only repeat the world. */
const MIN_ZOOM = 3;

export const NO_DETAIL_NOTE = 'No detailed map is loaded for this area: farm outlines, beds and the grid carry the detail';

const FARM_DRAWING_CREDIT = 'Farm outlines and beds: drawn by the cooperative’s members';

export const KIND_STYLE: Record<OutlineFeature['properties']['kind'], Leaflet.PathOptions> = {
  outline: { color: '#6f543d', weight: 2, dashArray: '6 4', fill: true, fillColor: '#efe7d6', fillOpacity: 0.18 },
  bed: { color: '#2f6b34', weight: 1.5, fill: true, fillColor: '#dcebd5', fillOpacity: 0.45 },
  row: { color: '#224f27', weight: 2.5, fill: false },
};

export const HEDGEROW_STYLE: Leaflet.PathOptions = { color: '#6a1f48', weight: 4, opacity: 0.9 };

type Props = {
  meta: TileMeta;
  farms: MapFarm[];
  plants: MapPlant[];
  /** Fit the view to these farms and plants when the key changes. */
  fitKey: string;
  fitTo: { lat: number; lon: number }[];
  /** Taps go to the map (drawing or placing), not to markers. */
  capturing: boolean;
  onSelectPlant: (p: MapPlant) => void;
  onSelectFarm: (f: MapFarm) => void;
  onPlantsDrawn?: (count: number) => void;
  mapRef: Ref<Leaflet.Map>;
};

function tileBounds(b: NonNullable<TileMeta['bounds']>): Leaflet.LatLngBoundsExpression {
  const [w, s, e, n] = b;
  return [
    [s, w],
    [n, e],
  ];
}

/** The deepest zoom the basemap really has at a point. */
function nativeMaxAt(meta: TileMeta, lat: number, lon: number): number {
  if (meta.worldMaxZoom === undefined) return meta.maxZoom;
  const b = meta.bounds;
  if (b && lon >= b[0] && lon <= b[2] && lat >= b[1] && lat <= b[3]) return meta.maxZoom;
  return meta.worldMaxZoom;
}

export function HeelwoodMap(props: Props) {
  const { meta } = props;
  const [noDetail, setNoDetail] = useState(false);
  const cursorRef = useRef<HTMLParagraphElement>(null);
  const initialCenter = useMemo<[number, number]>(() => {
    if (meta.bounds) return [(meta.bounds[1] + meta.bounds[3]) / 2, (meta.bounds[0] + meta.bounds[2]) / 2];
    return [20, 0];
  }, [meta.bounds]);

  return (
    <div className="relative">
      <MapContainer
        ref={props.mapRef}
        center={initialCenter}
        zoom={meta.bounds ? 9 : 2}
        minZoom={Math.max(MIN_ZOOM, meta.minZoom)}
        maxZoom={MAP_MAX_ZOOM}
        attributionControl={false}
        // geoman's editing is opt-in per layer; the map itself takes part.
        pmIgnore={false}
        className={`hw-map h-[62vh] min-h-[22rem] w-full rounded-card border border-paper-edge lg:h-[70vh]${props.capturing ? ' hw-drawing' : ''}`}
      >
        <AttributionControl prefix="Leaflet" position="bottomright" />
        <ScaleControl imperial={false} metric position="bottomleft" maxWidth={160} />
        <BaseLayers meta={meta} />
        <ZoomClasses />
        <FitView fitKey={props.fitKey} points={props.fitTo} />
        <FarmLayer farms={props.farms} onSelect={props.onSelectFarm} />
        <PlantClusterLayer plants={props.plants} onSelect={props.onSelectPlant} onDrawn={props.onPlantsDrawn} />
        <DetailGrid meta={meta} onNoDetail={setNoDetail} />
        <CursorPosition target={cursorRef} />
      </MapContainer>
      {noDetail ? (
        <p
          role="status"
          className="pointer-events-none absolute left-[4.25rem] right-3 top-3 z-[1000] rounded-lg border border-paper-edge bg-paper/95 px-3 py-2 text-center text-sm text-ink shadow-sm sm:right-[4.25rem]"
        >
          {NO_DETAIL_NOTE}
        </p>
      ) : null}
      <p
        ref={cursorRef}
        aria-live="off"
        data-testid="map-cursor"
        className="pointer-events-none absolute bottom-9 left-3 z-[1000] rounded bg-paper/90 px-2 py-0.5 font-mono text-xs text-ink-soft tabular-nums"
      />
    </div>
  );
}

/** The world to `worldMaxZoom`, the region's detail within its bounds, both enlarged to 19. */
function BaseLayers({ meta }: { meta: TileMeta }) {
  const map = useMap();
  useEffect(() => {
    const attribution = escapeHtml(meta.attribution);
    const layers: Leaflet.TileLayer[] = [];
    const split = meta.worldMaxZoom !== undefined && meta.bounds && meta.maxZoom > meta.worldMaxZoom;
    if (split) {
      layers.push(
        // The world tiles stop a few zooms past their own depth: inside the region the detail
        // layer covers them, and a world tile blown up 16,000 times costs whole seconds a frame
        // to paint without a GPU (measured with scripts/bench-map.ts).
        L.tileLayer(meta.tileUrl, { minZoom: 0, maxZoom: meta.worldMaxZoom! + WORLD_ENLARGE, maxNativeZoom: meta.worldMaxZoom, attribution }),
        L.tileLayer(meta.tileUrl, {
          minZoom: meta.worldMaxZoom! + 1,
          minNativeZoom: meta.worldMaxZoom! + 1,
          maxNativeZoom: meta.maxZoom,
          maxZoom: MAP_MAX_ZOOM,
          bounds: tileBounds(meta.bounds!),
        }),
      );
    } else {
      layers.push(
        L.tileLayer(meta.tileUrl, {
          minZoom: 0,
          minNativeZoom: meta.minZoom,
          maxNativeZoom: meta.worldMaxZoom ?? meta.maxZoom,
          maxZoom: MAP_MAX_ZOOM,
          bounds: meta.bounds ? tileBounds(meta.bounds) : undefined,
          attribution,
        }),
      );
    }
    for (const l of layers) l.addTo(map);
    return () => {
      for (const l of layers) l.remove();
    };
  }, [map, meta]);
  return null;
}

/** Classes on the map for what CSS shows at which zoom (labels, farm tags, bed names). */
function ZoomClasses() {
  const map = useMap();
  useEffect(() => {
    const el = map.getContainer();
    // A named region: a name on a plain div (Leaflet's container) is not announced.
    el.setAttribute('role', 'region');
    el.setAttribute('aria-label', "Map of the cooperative's farms and mother plants. Arrow keys pan, plus and minus zoom.");
    const update = () => {
      const z = map.getZoom();
      el.classList.toggle('hw-labels', z >= LABEL_ZOOM);
      el.classList.toggle('hw-near', z >= NEAR_ZOOM);
      el.classList.toggle('hw-beds', z >= BED_LABEL_ZOOM);
    };
    update();
    map.on('zoomend', update);
    return () => {
      map.off('zoomend', update);
    };
  }, [map]);
  return null;
}

function FitView({ fitKey, points }: { fitKey: string; points: { lat: number; lon: number }[] }) {
  const map = useMap();
  const last = useRef<string | null>(null);
  useEffect(() => {
    if (last.current === fitKey || !points.length) return;
    // The first view jumps straight there: an animated zoom would hold up the clustering.
    const animate = last.current !== null;
    last.current = fitKey;
    if (points.length === 1) {
      map.setView([points[0].lat, points[0].lon], 16, { animate });
      return;
    }
    const b = L.latLngBounds(points.map((p) => [p.lat, p.lon] as [number, number]));
    map.fitBounds(b, { padding: [36, 36], maxZoom: 17, animate });
  }, [map, fitKey, points]);
  return null;
}

function FarmLayer({ farms, onSelect }: { farms: MapFarm[]; onSelect: (f: MapFarm) => void }) {
  const map = useMap();
  const onSelectRef = useRef(onSelect);
  onSelectRef.current = onSelect;
  useEffect(() => {
    const group = L.layerGroup();
    const drawings = L.layerGroup([], { attribution: FARM_DRAWING_CREDIT });
    for (const f of farms) {
      const m = L.marker([f.lat, f.lon], {
        // A zero-size anchor: CSS lifts the tag above the point, clear of the plants' cluster there.
        icon: L.divIcon({ html: farmIconHtml(f.name, f.code), className: 'hw-farm-icon', iconSize: [0, 0] }),
        keyboard: true,
        title: f.name,
        zIndexOffset: 500,
        riseOnHover: true,
      });
      m.on('click', () => onSelectRef.current(f));
      group.addLayer(m);
      if (f.outline) {
        L.geoJSON(f.outline as unknown as FeatureCollection, {
          interactive: false,
          style: (feature) => KIND_STYLE[(feature?.properties as OutlineFeature['properties'] | undefined)?.kind ?? 'outline'],
          onEachFeature: (feature, layer) => {
            const p = feature.properties as OutlineFeature['properties'];
            const label = p.kind === 'outline' ? f.name : p.label;
            if (!label) return;
            // Names sit just above each shape's top edge, not in the middle where its plants are.
            const b = (layer as Leaflet.Polyline).getBounds();
            L.tooltip({ permanent: true, direction: 'top', offset: [0, -2], className: 'hw-bed-label', interactive: false })
              .setLatLng([b.getNorth(), b.getCenter().lng])
              .setContent(escapeHtml(label))
              .addTo(drawings);
          },
        }).addTo(drawings);
      }
    }
    drawings.addTo(map);
    group.addTo(map);
    // Zoomed out, the names of neighbouring beds would print over each other: show the first
    // of any that overlap (outlines come before their beds) and hide the rest until there is room.
    const declutter = () => {
      const shown: DOMRect[] = [];
      drawings.eachLayer((layer) => {
        const el = layer instanceof L.Tooltip ? layer.getElement() : undefined;
        if (!el) return;
        el.style.visibility = '';
        const r = el.getBoundingClientRect();
        const hit = shown.some((o) => r.left < o.right && o.left < r.right && r.top < o.bottom && o.top < r.bottom);
        if (hit) el.style.visibility = 'hidden';
        else shown.push(r);
      });
    };
    declutter();
    map.on('zoomend', declutter);
    return () => {
      map.off('zoomend', declutter);
      group.remove();
      drawings.remove();
    };
  }, [map, farms]);
  return null;
}

/**
 * A plant's icon, whose HTML is written only when the marker is actually drawn: of 10,000
 * markers only the few hundred unclustered in view ever are.
 */
let PlantIcon: (new (plant: MapPlant) => Leaflet.DivIcon) | undefined;
function plantIcon(plant: MapPlant): Leaflet.DivIcon {
  PlantIcon ??= L.DivIcon.extend({
    initialize(this: Leaflet.DivIcon & { plant: MapPlant }, p: MapPlant) {
      this.plant = p;
      L.Util.setOptions(this, { className: 'hw-plant-icon', iconSize: [28, 28] });
    },
    createIcon(this: Leaflet.DivIcon & { plant: MapPlant }, old?: HTMLElement) {
      this.options.html = plantIconHtml(this.plant);
      return L.DivIcon.prototype.createIcon.call(this, old);
    },
  }) as unknown as new (plant: MapPlant) => Leaflet.DivIcon;
  return new PlantIcon(plant);
}

/**
 * Plants in clusters (supercluster): the index is built once per plants array, and on every
 * move only the clusters and plants in the padded view become markers, in one layer group;
 * markers still wanted after a move are kept as they are.
 */
function PlantClusterLayer({ plants, onSelect, onDrawn }: { plants: MapPlant[]; onSelect: (p: MapPlant) => void; onDrawn?: (n: number) => void }) {
  const map = useMap();
  const onSelectRef = useRef(onSelect);
  onSelectRef.current = onSelect;
  const onDrawnRef = useRef(onDrawn);
  onDrawnRef.current = onDrawn;
  const [group, setGroup] = useState<Leaflet.LayerGroup | null>(null);

  useEffect(() => {
    const g = L.layerGroup().addTo(map);
    // The map exists and awaits its plants (scripts/bench-map.ts reads this mark).
    performance.mark('heelwood:map-mounted');
    setGroup(g);
    return () => {
      g.remove();
    };
  }, [map]);

  useEffect(() => {
    if (!group) return;
    group.clearLayers();
    const index = new PlantClusters(plants);
    const shown = new Map<string, Leaflet.Marker>();
    const render = () => {
      const zoom = Math.round(map.getZoom());
      const b = map.getBounds().pad(0.5);
      const bbox: [number, number, number, number] = [
        Math.max(-180, b.getWest()),
        Math.max(-85, b.getSouth()),
        Math.min(180, b.getEast()),
        Math.min(85, b.getNorth()),
      ];
      const wanted = new Map<string, Leaflet.Marker>();
      for (const f of index.clusters(bbox, zoom)) {
        const [lon, lat] = f.geometry.coordinates;
        if (isCluster(f)) {
          const p = f.properties;
          const key = `c${zoom}:${p.cluster_id}`;
          let m = shown.get(key);
          if (!m) {
            const { html, size } = clusterIconHtml(p.point_count, { clean: p.clean, watch: p.watch, hold: p.hold, retired: p.retired });
            m = L.marker([lat, lon], { icon: L.divIcon({ html, className: 'hw-cluster-icon', iconSize: [size, size] }), keyboard: true });
            const id = p.cluster_id;
            m.on('click', () => map.setView([lat, lon], Math.min(index.expansionZoom(id, zoom), MAP_MAX_ZOOM)));
          }
          wanted.set(key, m);
        } else {
          const plant = f.properties.plant;
          const key = `p${plant.id}`;
          let m = shown.get(key);
          if (!m) {
            m = L.marker([lat, lon], { icon: plantIcon(plant), keyboard: true });
            m.on('click', () => onSelectRef.current(plant));
          }
          wanted.set(key, m);
        }
      }
      for (const [key, m] of shown) if (!wanted.has(key)) group.removeLayer(m);
      for (const [key, m] of wanted) if (!shown.has(key)) group.addLayer(m);
      shown.clear();
      for (const [key, m] of wanted) shown.set(key, m);
    };
    render();
    // Drawn: the browser paints the markers in the next frame.
    const frame = requestAnimationFrame(() => onDrawnRef.current?.(index.total));
    map.on('moveend', render);
    return () => {
      cancelAnimationFrame(frame);
      map.off('moveend', render);
      group.clearLayers();
    };
  }, [map, group, plants]);
  return null;
}

/** Where the basemap is only enlarged: a note (through onNoDetail) and a light metric grid. */
function DetailGrid({ meta, onNoDetail }: { meta: TileMeta; onNoDetail: (v: boolean) => void }) {
  const map = useMap();
  useEffect(() => {
    const renderer = L.canvas({ padding: 0.2 });
    let grid: Leaflet.Polyline | null = null;
    let lastKey = '';
    const update = () => {
      const z = map.getZoom();
      const c = map.getCenter();
      const none = z >= FARM_ZOOM && z > nativeMaxAt(meta, c.lat, c.lng) + 1;
      onNoDetail(none);
      const step = none ? gridStepForZoom(z) : null;
      const b = map.getBounds().pad(0.25);
      const key = step ? `${step}:${b.toBBoxString()}` : '';
      if (key === lastKey) return;
      lastKey = key;
      grid?.remove();
      grid = null;
      if (!step) return;
      const lines = gridLines({ south: b.getSouth(), west: b.getWest(), north: b.getNorth(), east: b.getEast() }, step);
      if (!lines.length) return;
      grid = L.polyline(lines, { renderer, interactive: false, color: '#a58a6c', weight: 0.8, opacity: 0.4 }).addTo(map);
    };
    update();
    map.on('moveend zoomend', update);
    return () => {
      map.off('moveend zoomend', update);
      grid?.remove();
    };
  }, [map, meta, onNoDetail]);
  return null;
}

/** The pointer's position (or the map centre on a touch screen), written straight to the DOM. */
function CursorPosition({ target }: { target: React.RefObject<HTMLParagraphElement | null> }) {
  const map = useMap();
  useEffect(() => {
    const write = (prefix: string, ll: Leaflet.LatLng) => {
      if (target.current) target.current.textContent = `${prefix} ${formatLatLon(ll.lat, ll.lng)}`;
    };
    const onMove = (e: Leaflet.LeafletMouseEvent) => write('Pointer', e.latlng);
    const onCentre = () => write('Centre', map.getCenter());
    onCentre();
    map.on('mousemove', onMove);
    map.on('moveend', onCentre);
    map.on('mouseout', onCentre);
    return () => {
      map.off('mousemove', onMove);
      map.off('moveend', onCentre);
      map.off('mouseout', onCentre);
    };
  }, [map, target]);
  return null;
}
