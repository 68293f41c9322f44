// The tile route over HTTP with each kind of source: the shipped basemap folder, an .mbtiles
// file and a .pmtiles archive made here, plus the answers for bad and missing addresses.
// No database: an Express app with only the tiles router.
import { mkdtempSync, rmSync } from 'node:fs';
import { writeFile } from 'node:fs/promises';
import { createRequire } from 'node:module';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { gzipSync } from 'node:zlib';
import express from 'express';
import { zxyToTileId } from 'pmtiles';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { tilesRouter } from '../../server/modules/map/tiles.router.js';
import { ATTRIBUTION, createTileSource, TileSourceError, type TileSource } from '../../server/modules/map/tiles.sources.js';
import { flipY, lonLatToTile } from '../../shared/tile-math.js';

const require = createRequire(import.meta.url);
const { Database } = require('node-sqlite3-wasm') as typeof import('node-sqlite3-wasm');

const SHIPPED = path.resolve(import.meta.dirname, '../../tiles');
const work = mkdtempSync(path.join(tmpdir(), 'heelwood-tiles-'));
afterAll(() => rmSync(work, { recursive: true, force: true }));

type Served = { url: string; close: () => Promise<void> };

async function serve(source: TileSource): Promise<Served> {
  const app = express();
  app.use('/tiles', tilesRouter(source));
  const server = app.listen(0, '127.0.0.1');
  await new Promise<void>((resolve) => server.once('listening', () => resolve()));
  const { port } = server.address() as AddressInfo;
  return {
    url: `http://127.0.0.1:${port}`,
    close: async () => {
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await source.close();
    },
  };
}

async function get(base: Served, p: string, headers: Record<string, string> = {}) {
  const res = await fetch(`${base.url}${p}`, { headers });
  const body = Buffer.from(await res.arrayBuffer());
  return { status: res.status, headers: res.headers, body };
}

/** A solid-colour 256 x 256 PNG; the colour tells tiles apart. */
function solidPng(r: number, g: number, b: number): Promise<Buffer> {
  return sharp({ create: { width: 256, height: 256, channels: 3, background: { r, g, b } } }).png().toBuffer();
}

async function centreColour(png: Buffer): Promise<[number, number, number]> {
  const { data, info } = await sharp(png).removeAlpha().raw().toBuffer({ resolveWithObject: true });
  const i = (128 * info.width + 128) * 3;
  return [data[i], data[i + 1], data[i + 2]];
}

// --- A minimal PMTiles v3 writer (the pmtiles package only reads) -------------------------------
// Layout per the PMTiles v3 specification: 127-byte header, root directory, JSON metadata, tile
// data; one directory entry per tile (run length 1), no leaf directories, no internal compression.

function varint(out: number[], value: number) {
  let v = value;
  while (v >= 0x80) {
    out.push((v & 0x7f) | 0x80);
    v = Math.floor(v / 128);
  }
  out.push(v);
}

type PmTile = { z: number; x: number; y: number; data: Buffer };

function pmtilesArchive(tiles: PmTile[], opts: { tileType: number; tileCompression: number; bounds: [number, number, number, number]; attribution?: string }): Buffer {
  const entries = tiles.map((t) => ({ id: zxyToTileId(t.z, t.x, t.y), data: t.data })).sort((a, b) => a.id - b.id);
  let offset = 0;
  const placed = entries.map((e) => {
    const p = { ...e, offset, length: e.data.length };
    offset += e.data.length;
    return p;
  });
  const dir: number[] = [];
  varint(dir, placed.length);
  let lastId = 0;
  for (const e of placed) {
    varint(dir, e.id - lastId);
    lastId = e.id;
  }
  for (const _ of placed) varint(dir, 1);
  for (const e of placed) varint(dir, e.length);
  placed.forEach((e, i) => varint(dir, i > 0 && e.offset === placed[i - 1].offset + placed[i - 1].length ? 0 : e.offset + 1));
  const rootDir = Buffer.from(dir);
  const json = Buffer.from(JSON.stringify(opts.attribution ? { attribution: opts.attribution } : {}));
  const data = Buffer.concat(placed.map((e) => e.data));

  const header = Buffer.alloc(127);
  header.write('PMTiles', 0, 'latin1');
  header.writeUInt8(3, 7);
  const u64 = (v: number, at: number) => header.writeBigUInt64LE(BigInt(v), at);
  const rootOffset = 127;
  const jsonOffset = rootOffset + rootDir.length;
  const dataOffset = jsonOffset + json.length;
  u64(rootOffset, 8);
  u64(rootDir.length, 16);
  u64(jsonOffset, 24);
  u64(json.length, 32);
  u64(dataOffset, 40); // leaf directories: none
  u64(0, 48);
  u64(dataOffset, 56);
  u64(data.length, 64);
  u64(placed.length, 72); // addressed tiles
  u64(placed.length, 80); // tile entries
  u64(placed.length, 88); // tile contents
  header.writeUInt8(1, 96); // clustered
  header.writeUInt8(1, 97); // internal compression: none
  header.writeUInt8(opts.tileCompression, 98);
  header.writeUInt8(opts.tileType, 99);
  const zs = tiles.map((t) => t.z);
  header.writeUInt8(Math.min(...zs), 100);
  header.writeUInt8(Math.max(...zs), 101);
  const [w, s, e, n] = opts.bounds;
  header.writeInt32LE(Math.round(w * 1e7), 102);
  header.writeInt32LE(Math.round(s * 1e7), 106);
  header.writeInt32LE(Math.round(e * 1e7), 110);
  header.writeInt32LE(Math.round(n * 1e7), 114);
  header.writeUInt8(Math.min(...zs), 118);
  header.writeInt32LE(Math.round(((w + e) / 2) * 1e7), 119);
  header.writeInt32LE(Math.round(((s + n) / 2) * 1e7), 123);
  return Buffer.concat([header, rootDir, json, data]);
}

// --- The shipped basemap -------------------------------------------------------------------------

describe('shipped basemap folder', () => {
  let srv: Served;
  let source: TileSource;
  beforeAll(async () => {
    source = await createTileSource(undefined, SHIPPED);
    srv = await serve(source);
  });
  afterAll(() => srv?.close());

  it('reads the folder and its metadata', () => {
    expect(source.kind).toBe('folder');
    expect(source.minZoom).toBe(0);
    expect(source.maxZoom).toBeGreaterThanOrEqual(12);
    expect(source.worldMaxZoom).toBe(5);
    expect(source.attribution).toBe(ATTRIBUTION);
  });

  it('serves the world tile 0/0/0 as a 256 x 256 PNG with cache headers', async () => {
    const r = await get(srv, '/tiles/0/0/0.png');
    expect(r.status).toBe(200);
    expect(r.headers.get('content-type')).toBe('image/png');
    expect(r.headers.get('cache-control')).toBe('public, max-age=86400');
    expect(r.headers.get('etag')).toMatch(/^"[\w-]+"$/);
    expect(r.headers.get('content-encoding')).toBeNull();
    const meta = await sharp(r.body).metadata();
    expect([meta.format, meta.width, meta.height]).toEqual(['png', 256, 256]);
  });

  it('answers a repeat request carrying the ETag with 304', async () => {
    const first = await get(srv, '/tiles/1/0/0.png');
    const again = await get(srv, '/tiles/1/0/0.png', { 'If-None-Match': first.headers.get('etag')! });
    expect(again.status).toBe(304);
    expect(again.body.length).toBe(0);
  });

  it('has the demo region at zoom 12: the tile holding Hereford', async () => {
    const { x, y } = lonLatToTile(-2.7163, 52.0565, 12);
    const r = await get(srv, `/tiles/12/${x}/${y}.png`);
    expect(r.status).toBe(200);
    expect(r.headers.get('content-type')).toBe('image/png');
  });

  it('tells the map page its zooms, bounds and credit', async () => {
    const r = await fetch(`${srv.url}/tiles/meta.json`);
    expect(r.status).toBe(200);
    const body = await r.json();
    expect(body).toMatchObject({ kind: 'folder', minZoom: 0, worldMaxZoom: 5, attribution: ATTRIBUTION, tileUrl: '/tiles/{z}/{x}/{y}.png' });
    expect(body.maxZoom).toBeGreaterThanOrEqual(12);
    const [w, s, e, n] = body.bounds;
    expect(w).toBeLessThanOrEqual(-2.7163);
    expect(e).toBeGreaterThanOrEqual(-2.7163);
    expect(s).toBeLessThanOrEqual(52.0565);
    expect(n).toBeGreaterThanOrEqual(52.0565);
  });

  it('answers a missing tile with 404 and a blank transparent tile, never 500', async () => {
    for (const p of ['/tiles/12/0/0.png', '/tiles/18/130000/87000.png', '/tiles/22/0/4194303.png']) {
      const r = await get(srv, p);
      expect(r.status, p).toBe(404);
      expect(r.headers.get('content-type')).toBe('image/png');
      const { data, info } = await sharp(r.body).raw().toBuffer({ resolveWithObject: true });
      expect([info.width, info.height, info.channels]).toEqual([256, 256, 4]);
      expect(data.every((v, i) => i % 4 !== 3 || v === 0)).toBe(true);
    }
  });

  it('refuses impossible and malformed addresses with 400 in the error shape', async () => {
    const cases = ['/tiles/23/0/0.png', '/tiles/3/8/0.png', '/tiles/3/0/8.png', '/tiles/0/1/0.png', '/tiles/-1/0/0.png', '/tiles/3/0/-1.png', '/tiles/a/0/0.png', '/tiles/1.5/0/0.png', '/tiles/3/0/0x1.png', '/tiles/99999999999/0/0.png'];
    for (const p of cases) {
      const r = await get(srv, p);
      expect(r.status, p).toBe(400);
      expect(r.headers.get('content-type')).toMatch(/application\/json/);
      const body = JSON.parse(r.body.toString());
      expect(body.error.code, p).toMatch(/^(invalid_tile|tile_out_of_range)$/);
      expect(typeof body.error.message).toBe('string');
    }
  });

  it('answers other paths under /tiles with a JSON 404', async () => {
    const r = await get(srv, '/tiles/3/0/0.jpg');
    expect(r.status).toBe(404);
    expect(JSON.parse(r.body.toString()).error.code).toBe('not_found');
  });
});

describe('a source that fails', () => {
  it('turns a read error into a 404 blank tile and logs it', async () => {
    const errors = vi.spyOn(console, 'error').mockImplementation(() => {});
    const broken: TileSource = {
      kind: 'folder',
      minZoom: 0,
      maxZoom: 5,
      attribution: 'test',
      getTile: async () => {
        throw new Error('disk on fire');
      },
      close: async () => {},
    };
    const srv = await serve(broken);
    try {
      const r = await get(srv, '/tiles/2/1/1.png');
      expect(r.status).toBe(404);
      expect(r.headers.get('content-type')).toBe('image/png');
      expect(errors).toHaveBeenCalled();
    } finally {
      errors.mockRestore();
      await srv.close();
    }
  });
});

// --- MBTiles -----------------------------------------------------------------------------------

describe('an .mbtiles source', () => {
  let srv: Served;
  let red: Buffer;
  let blue: Buffer;
  beforeAll(async () => {
    red = await solidPng(200, 30, 30);
    blue = await solidPng(30, 30, 200);
    const file = path.join(work, 'region.mbtiles');
    const db = new Database(file);
    db.exec('CREATE TABLE metadata (name TEXT, value TEXT); CREATE TABLE tiles (zoom_level INTEGER, tile_column INTEGER, tile_row INTEGER, tile_data BLOB);');
    for (const [name, value] of [
      ['name', 'Test region'],
      ['format', 'png'],
      ['minzoom', '0'],
      ['maxzoom', '3'],
      ['bounds', '-3.3,51.8,-2.2,52.45'],
      ['attribution', '<a href="https://example.org">Our survey</a> &copy; 2024'],
    ])
      db.run('INSERT INTO metadata VALUES (?, ?)', [name, value]);
    // XYZ 3/2/1 is stored at TMS row 2^3 - 1 - 1 = 6; XYZ 3/2/6 at row 1.
    db.run('INSERT INTO tiles VALUES (?, ?, ?, ?)', [3, 2, flipY(1, 3), red]);
    db.run('INSERT INTO tiles VALUES (?, ?, ?, ?)', [3, 2, flipY(6, 3), blue]);
    db.run('INSERT INTO tiles VALUES (?, ?, ?, ?)', [0, 0, 0, blue]);
    db.close();
    const source = await createTileSource(file, SHIPPED);
    expect(source.kind).toBe('mbtiles');
    srv = await serve(source);
  });
  afterAll(() => srv?.close());

  it('serves each tile at its XYZ address (rows flipped from TMS)', async () => {
    const a = await get(srv, '/tiles/3/2/1.png');
    expect(a.status).toBe(200);
    expect(a.headers.get('content-type')).toBe('image/png');
    expect(a.headers.get('cache-control')).toBe('public, max-age=86400');
    expect(a.body.equals(red)).toBe(true);
    expect(await centreColour(a.body)).toEqual([200, 30, 30]);
    const b = await get(srv, '/tiles/3/2/6.png');
    expect(b.body.equals(blue)).toBe(true);
  });

  it('answers 404 where the file has no tile', async () => {
    expect((await get(srv, '/tiles/3/0/0.png')).status).toBe(404);
    expect((await get(srv, '/tiles/9/0/0.png')).status).toBe(404);
  });

  it('reports its zooms, bounds and credit as plain text', async () => {
    const body = await (await fetch(`${srv.url}/tiles/meta.json`)).json();
    expect(body).toEqual({
      kind: 'mbtiles',
      minZoom: 0,
      maxZoom: 3,
      bounds: [-3.3, 51.8, -2.2, 52.45],
      attribution: 'Our survey © 2024',
      tileUrl: '/tiles/{z}/{x}/{y}.png',
    });
  });
});

// --- PMTiles -----------------------------------------------------------------------------------

describe('a .pmtiles source', () => {
  let srv: Served;
  let green: Buffer;
  let amber: Buffer;
  beforeAll(async () => {
    green = await solidPng(40, 160, 60);
    amber = await solidPng(220, 160, 40);
    const here = lonLatToTile(-2.7163, 52.0565, 12);
    const archive = pmtilesArchive(
      [
        { z: 0, x: 0, y: 0, data: amber },
        { z: 1, x: 0, y: 0, data: green },
        { z: 12, x: here.x, y: here.y, data: green },
        { z: 12, x: here.x + 1, y: here.y, data: amber },
      ],
      { tileType: 2, tileCompression: 1, bounds: [-3.3, 51.8, -2.2, 52.45], attribution: 'Aerial survey 2023' },
    );
    const file = path.join(work, 'farms.pmtiles');
    await writeFile(file, archive);
    const source = await createTileSource(file, SHIPPED);
    expect(source.kind).toBe('pmtiles');
    srv = await serve(source);
  });
  afterAll(() => srv?.close());

  it('serves tiles from the archive at their addresses', async () => {
    const here = lonLatToTile(-2.7163, 52.0565, 12);
    const a = await get(srv, `/tiles/12/${here.x}/${here.y}.png`);
    expect(a.status).toBe(200);
    expect(a.headers.get('content-type')).toBe('image/png');
    expect(a.headers.get('cache-control')).toBe('public, max-age=86400');
    expect(a.body.equals(green)).toBe(true);
    const b = await get(srv, `/tiles/12/${here.x + 1}/${here.y}.png`);
    expect(b.body.equals(amber)).toBe(true);
    expect((await get(srv, '/tiles/0/0/0.png')).body.equals(amber)).toBe(true);
    expect((await get(srv, '/tiles/1/0/0.png')).body.equals(green)).toBe(true);
  });

  it('answers 404 with a blank tile where the archive has none', async () => {
    const r = await get(srv, '/tiles/1/1/1.png');
    expect(r.status).toBe(404);
    expect(r.headers.get('content-type')).toBe('image/png');
  });

  it('reports zooms and bounds from the header', async () => {
    const body = await (await fetch(`${srv.url}/tiles/meta.json`)).json();
    expect(body.kind).toBe('pmtiles');
    expect(body.minZoom).toBe(0);
    expect(body.maxZoom).toBe(12);
    expect(body.attribution).toBe('Aerial survey 2023');
    expect(body.bounds[0]).toBeCloseTo(-3.3, 6);
    expect(body.bounds[3]).toBeCloseTo(52.45, 6);
  });

  it('sends gzip-compressed archive tiles already decompressed, without Content-Encoding', async () => {
    const file = path.join(work, 'gz.pmtiles');
    await writeFile(file, pmtilesArchive([{ z: 0, x: 0, y: 0, data: gzipSync(green) }], { tileType: 2, tileCompression: 2, bounds: [-180, -85, 180, 85] }));
    const gz = await serve(await createTileSource(file, SHIPPED));
    try {
      const r = await get(gz, '/tiles/0/0/0.png');
      expect(r.status).toBe(200);
      expect(r.headers.get('content-encoding')).toBeNull();
      expect(r.body.equals(green)).toBe(true);
    } finally {
      await gz.close();
    }
  });
});

describe('choosing a source from TILES_SOURCE', () => {
  it('refuses an archive of vector tiles with a clear message', async () => {
    const file = path.join(work, 'vector.pmtiles');
    await writeFile(file, pmtilesArchive([{ z: 0, x: 0, y: 0, data: Buffer.from([0x1a, 0x00]) }], { tileType: 1, tileCompression: 1, bounds: [-180, -85, 180, 85] }));
    await expect(createTileSource(file, SHIPPED)).rejects.toThrow(/raster tiles/);
  });

  it('refuses a path that is neither a folder nor an archive, or does not exist', async () => {
    await expect(createTileSource(path.join(work, 'nothing-here.pmtiles'), SHIPPED)).rejects.toBeInstanceOf(TileSourceError);
    await expect(createTileSource(path.join(work, 'nothing-here.mbtiles'), SHIPPED)).rejects.toBeInstanceOf(TileSourceError);
    await expect(createTileSource(path.join(work, 'tiles.zip'), SHIPPED)).rejects.toThrow(/folder of \{z\}\/\{x\}\/\{y\}\.png tiles/);
  });

  it('serves a cooperative folder of XYZ tiles', async () => {
    const dir = path.join(work, 'own-tiles');
    const { mkdirSync, writeFileSync } = await import('node:fs');
    mkdirSync(path.join(dir, '14', '8100'), { recursive: true });
    const png = await solidPng(10, 100, 10);
    writeFileSync(path.join(dir, '14', '8100', '5400.png'), png);
    const source = await createTileSource(dir, SHIPPED);
    expect(source).toMatchObject({ kind: 'folder', minZoom: 14, maxZoom: 14 });
    const srv = await serve(source);
    try {
      const r = await get(srv, '/tiles/14/8100/5400.png');
      expect(r.status).toBe(200);
      expect(r.body.equals(png)).toBe(true);
      expect((await get(srv, '/tiles/0/0/0.png')).status).toBe(404);
    } finally {
      await srv.close();
    }
  });
});
