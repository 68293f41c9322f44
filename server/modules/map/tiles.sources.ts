// Where map tiles come from: the basemap shipped in tiles/ (a folder of {z}/{x}/{y}.png), or
// what a cooperative points TILES_SOURCE at: its own XYZ folder, an .mbtiles file (SQLite,
// read with node-sqlite3-wasm: no native build) or a .pmtiles archive (read with the pmtiles
// package through a small source over the local file). All three answer the same getTile().
import { existsSync, readdirSync, readFileSync, statSync } from 'node:fs';
import { open, readFile, type FileHandle } from 'node:fs/promises';
import { createRequire } from 'node:module';
import path from 'node:path';
import { PMTiles, TileType, type RangeResponse, type Source } from 'pmtiles';
import { type BBox, flipY } from '../../../shared/tile-math.js';

/** Credit for the shipped basemap; the map page shows it (as text) in its attribution control. */
export const ATTRIBUTION = 'Map: Natural Earth (public domain) · Places: GeoNames (CC BY 4.0)';

export type TileSourceKind = 'folder' | 'mbtiles' | 'pmtiles';

export type TileSource = {
  kind: TileSourceKind;
  minZoom: number;
  /** The deepest zoom with tiles; the map enlarges these beyond it (Leaflet maxNativeZoom). */
  maxZoom: number;
  /** Where the deepest tiles are, [west, south, east, north], when the source says. */
  bounds?: BBox;
  /** Zooms up to which the whole world is covered (the shipped basemap: 5), when known. */
  worldMaxZoom?: number;
  /** Plain text, never HTML. */
  attribution: string;
  /** The tile's bytes (already decompressed), or undefined when the source has none there. */
  getTile(z: number, x: number, y: number): Promise<Buffer | undefined>;
  close(): Promise<void>;
};

/** TILES_SOURCE names something that cannot serve raster tiles; the message says what to do. */
export class TileSourceError extends Error {}

const RASTER_FORMATS = new Set(['png', 'jpg', 'jpeg', 'webp', 'avif']);

/** Attribution strings in MBTiles/PMTiles metadata are often HTML links; keep the words. */
function plainText(s: unknown): string | undefined {
  if (typeof s !== 'string') return undefined;
  const t = s
    .replace(/<[^>]*>/g, '')
    .replace(/&copy;/gi, '©')
    .replace(/&amp;/gi, '&')
    .replace(/\s+/g, ' ')
    .trim();
  return t || undefined;
}

function parseBounds(v: unknown): BBox | undefined {
  const nums = Array.isArray(v) ? v.map(Number) : typeof v === 'string' ? v.split(',').map(Number) : [];
  if (nums.length !== 4 || nums.some((n) => !Number.isFinite(n))) return undefined;
  const [w, s, e, n] = nums;
  return w < e && s < n ? [w, s, e, n] : undefined;
}

function isMissing(err: unknown): boolean {
  const code = (err as NodeJS.ErrnoException)?.code;
  return code === 'ENOENT' || code === 'ENOTDIR';
}

// --- Folder of {z}/{x}/{y}.png --------------------------------------------------------------

const FOLDER_EXTENSIONS = ['png', 'jpg', 'jpeg', 'webp'];

function folderSource(dir: string, shipped: boolean): TileSource {
  if (!existsSync(dir) || !statSync(dir).isDirectory()) throw new TileSourceError(`TILES_SOURCE ${dir} is not a folder.`);
  const zooms = readdirSync(dir)
    .filter((d) => /^\d{1,2}$/.test(d))
    .map(Number)
    .sort((a, b) => a - b);
  // scripts/render-tiles.ts writes metadata.json beside the tiles (MBTiles-style keys).
  let meta: Record<string, unknown> = {};
  try {
    meta = JSON.parse(readFileSync(path.join(dir, 'metadata.json'), 'utf8')) as Record<string, unknown>;
  } catch {
    // A cooperative's own folder need not have one.
  }
  if (!zooms.length && !shipped) throw new TileSourceError(`TILES_SOURCE ${dir} has no zoom folders (0, 1, 2, …) with {z}/{x}/{y}.png tiles.`);
  const num = (v: unknown, fallback: number) => (Number.isInteger(v) ? (v as number) : fallback);
  return {
    kind: 'folder',
    minZoom: num(meta.minzoom, zooms[0] ?? 0),
    maxZoom: num(meta.maxzoom, zooms.at(-1) ?? 0),
    bounds: parseBounds(meta.bounds),
    worldMaxZoom: Number.isInteger(meta.worldMaxZoom) ? (meta.worldMaxZoom as number) : undefined,
    attribution: shipped ? ATTRIBUTION : (plainText(meta.attribution) ?? 'Map tiles provided by the cooperative'),
    async getTile(z, x, y) {
      for (const ext of FOLDER_EXTENSIONS) {
        try {
          return await readFile(path.join(dir, String(z), String(x), `${y}.${ext}`));
        } catch (err) {
          if (!isMissing(err)) throw err;
        }
      }
      return undefined;
    },
    async close() {},
  };
}

// --- MBTiles ------------------------------------------------------------------------------------

async function mbtilesSource(file: string): Promise<TileSource> {
  const require = createRequire(import.meta.url);
  // node-sqlite3-wasm is CommonJS without named ESM exports.
  const { Database } = require('node-sqlite3-wasm') as typeof import('node-sqlite3-wasm');
  let db: InstanceType<typeof Database>;
  try {
    db = new Database(file, { readOnly: true, fileMustExist: true });
  } catch (err) {
    throw new TileSourceError(`TILES_SOURCE ${file} cannot be opened as an MBTiles file: ${(err as Error).message}`);
  }
  try {
    const meta = new Map<string, string>();
    for (const row of db.all('SELECT name, value FROM metadata')) meta.set(String(row.name), String(row.value));
    const format = (meta.get('format') ?? 'png').toLowerCase();
    if (!RASTER_FORMATS.has(format)) {
      throw new TileSourceError(`TILES_SOURCE ${file} holds ${format} tiles; Heelwood's map needs raster tiles (png, jpg or webp).`);
    }
    const range = db.get('SELECT MIN(zoom_level) AS lo, MAX(zoom_level) AS hi FROM tiles') as { lo: number | null; hi: number | null } | null;
    if (range?.hi == null) throw new TileSourceError(`TILES_SOURCE ${file} has no tiles.`);
    const stmt = db.prepare('SELECT tile_data FROM tiles WHERE zoom_level = ? AND tile_column = ? AND tile_row = ?');
    const int = (v: string | undefined, fallback: number) => (v !== undefined && /^\d+$/.test(v) ? Number(v) : fallback);
    return {
      kind: 'mbtiles',
      minZoom: int(meta.get('minzoom'), Number(range.lo)),
      maxZoom: int(meta.get('maxzoom'), Number(range.hi)),
      bounds: parseBounds(meta.get('bounds')),
      attribution: plainText(meta.get('attribution')) ?? `Map tiles: ${meta.get('name') ?? path.basename(file)}`,
      async getTile(z, x, y) {
        // MBTiles counts rows from the south (TMS): row = 2^z - 1 - y.
        const row = stmt.get([z, x, flipY(y, z)]);
        const data = row?.tile_data;
        return data instanceof Uint8Array ? Buffer.from(data) : undefined;
      },
      async close() {
        stmt.finalize();
        db.close();
      },
    };
  } catch (err) {
    db.close();
    if (err instanceof TileSourceError) throw err;
    throw new TileSourceError(`TILES_SOURCE ${file} is not a readable MBTiles file: ${(err as Error).message}`);
  }
}

// --- PMTiles ------------------------------------------------------------------------------------

/** pmtiles' own FileSource expects a browser File; this one reads byte ranges with fs. */
class LocalFileSource implements Source {
  constructor(
    private readonly handle: FileHandle,
    private readonly key: string,
  ) {}
  getKey() {
    return this.key;
  }
  async getBytes(offset: number, length: number): Promise<RangeResponse> {
    const buf = Buffer.alloc(length);
    const { bytesRead } = await this.handle.read(buf, 0, length, offset);
    // A fresh ArrayBuffer of exactly the bytes read (the reader asks past the end for the header).
    const data = new ArrayBuffer(bytesRead);
    new Uint8Array(data).set(buf.subarray(0, bytesRead));
    return { data };
  }
}

const PM_TYPES: Partial<Record<TileType, string>> = {
  [TileType.Png]: 'png',
  [TileType.Jpeg]: 'jpg',
  [TileType.Webp]: 'webp',
  [TileType.Avif]: 'avif',
};

async function pmtilesSource(file: string): Promise<TileSource> {
  let handle: FileHandle;
  try {
    handle = await open(file, 'r');
  } catch (err) {
    throw new TileSourceError(`TILES_SOURCE ${file} cannot be opened: ${(err as Error).message}`);
  }
  try {
    const archive = new PMTiles(new LocalFileSource(handle, file));
    const header = await archive.getHeader();
    if (!PM_TYPES[header.tileType]) {
      throw new TileSourceError(`TILES_SOURCE ${file} holds vector or unknown tiles; Heelwood's map needs raster tiles (png, jpg or webp).`);
    }
    let attribution: string | undefined;
    try {
      const meta = (await archive.getMetadata()) as Record<string, unknown> | null;
      attribution = plainText(meta?.attribution);
    } catch {
      // Metadata is optional in practice.
    }
    const bounds = parseBounds([header.minLon, header.minLat, header.maxLon, header.maxLat]);
    return {
      kind: 'pmtiles',
      minZoom: header.minZoom,
      maxZoom: header.maxZoom,
      bounds,
      attribution: attribution ?? `Map tiles: ${path.basename(file)}`,
      async getTile(z, x, y) {
        // getZxy() has already undone the archive's tile compression: send the bytes as they are.
        const r = await archive.getZxy(z, x, y);
        return r ? Buffer.from(r.data) : undefined;
      },
      async close() {
        await handle.close();
      },
    };
  } catch (err) {
    await handle.close();
    if (err instanceof TileSourceError) throw err;
    throw new TileSourceError(`TILES_SOURCE ${file} is not a readable PMTiles archive: ${(err as Error).message}`);
  }
}

// --- Choosing -----------------------------------------------------------------------------------

/**
 * The tile source for TILES_SOURCE (spec), or the shipped basemap when it is unset. Relative
 * paths resolve against the working directory; pass an absolute path to be sure.
 * Throws TileSourceError with a sentence fit for a start-up message when spec is unusable.
 */
export async function createTileSource(spec: string | undefined, shippedDir: string): Promise<TileSource> {
  if (!spec?.trim()) return folderSource(shippedDir, true);
  const target = path.resolve(spec.trim());
  const lower = target.toLowerCase();
  if (lower.endsWith('.mbtiles')) return mbtilesSource(target);
  if (lower.endsWith('.pmtiles')) return pmtilesSource(target);
  if (existsSync(target) && statSync(target).isDirectory()) return folderSource(target, false);
  throw new TileSourceError(
    `TILES_SOURCE ${target} is not usable: give a folder of {z}/{x}/{y}.png tiles, an .mbtiles file or a .pmtiles file.`,
  );
}
