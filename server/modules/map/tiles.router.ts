// GET {mount}/{z}/{x}/{y}.png and {mount}/meta.json (mounted at /tiles).
//
// - A tile that exists: 200 with its image type, `Cache-Control: public, max-age=86400` and a
//   strong ETag (If-None-Match answers 304).
// - A well-formed address with no tile (outside the region, deeper than the source, or a source
//   that failed to read, which is logged): 404 with a blank transparent 256 x 256 PNG, so the map
//   shows nothing there instead of a broken image. Cached for an hour.
// - A malformed or impossible address (not integers, z outside 0..22, x or y outside 0..2^z-1):
//   400 in the API's error shape { error: { code, message } }.
// Never a 500: the source is read inside try/catch.
import { createHash } from 'node:crypto';
import { type Request, type Response, Router } from 'express';
import sharp from 'sharp';
import { isValidTile, MAX_TILE_ZOOM, TILE_SIZE } from '../../../shared/tile-math.js';
import type { TileSource } from './tiles.sources.js';

const TILE_CACHE = 'public, max-age=86400';
const MISSING_CACHE = 'public, max-age=3600';

let blankTile: Promise<Buffer> | undefined;
/** A fully transparent 256 x 256 PNG, made once. */
export function blankPng(): Promise<Buffer> {
  blankTile ??= sharp({ create: { width: TILE_SIZE, height: TILE_SIZE, channels: 4, background: { r: 0, g: 0, b: 0, alpha: 0 } } })
    .png({ compressionLevel: 9 })
    .toBuffer();
  return blankTile;
}

/** The image type from the first bytes, whatever the URL's extension says. */
export function imageType(buf: Buffer): string {
  if (buf.length >= 8 && buf.readUInt32BE(0) === 0x89504e47) return 'image/png';
  if (buf.length >= 3 && buf[0] === 0xff && buf[1] === 0xd8 && buf[2] === 0xff) return 'image/jpeg';
  if (buf.length >= 12 && buf.toString('latin1', 0, 4) === 'RIFF' && buf.toString('latin1', 8, 12) === 'WEBP') return 'image/webp';
  if (buf.length >= 12 && buf.toString('latin1', 4, 8) === 'ftyp' && /^avi[fs]$/.test(buf.toString('latin1', 8, 12))) return 'image/avif';
  return 'application/octet-stream';
}

function refuse(res: Response, status: number, code: string, message: string) {
  res.status(status).json({ error: { code, message } });
}

const INTEGER = /^\d{1,8}$/;

export function tilesRouter(source: TileSource): Router {
  const router = Router();

  router.get('/meta.json', (req: Request, res: Response) => {
    res.setHeader('Cache-Control', 'no-cache');
    res.json({
      kind: source.kind,
      minZoom: source.minZoom,
      maxZoom: source.maxZoom,
      ...(source.worldMaxZoom !== undefined ? { worldMaxZoom: source.worldMaxZoom } : {}),
      ...(source.bounds ? { bounds: source.bounds } : {}),
      attribution: source.attribution,
      tileUrl: `${req.baseUrl}/{z}/{x}/{y}.png`,
    });
  });

  router.get('/:z/:x/:y.png', async (req: Request, res: Response) => {
    const { z: zs, x: xs, y: ys } = req.params as Record<string, string>;
    if (![zs, xs, ys].every((s) => INTEGER.test(s))) {
      refuse(res, 400, 'invalid_tile', 'A tile address is three whole numbers: /tiles/{z}/{x}/{y}.png.');
      return;
    }
    const [z, x, y] = [Number(zs), Number(xs), Number(ys)];
    if (!isValidTile(z, x, y)) {
      const message =
        z > MAX_TILE_ZOOM
          ? `Zoom ${z} is beyond the deepest zoom served (${MAX_TILE_ZOOM}).`
          : `At zoom ${z}, x and y run from 0 to ${2 ** z - 1}.`;
      refuse(res, 400, 'tile_out_of_range', message);
      return;
    }

    let tile: Buffer | undefined;
    try {
      tile = await source.getTile(z, x, y);
    } catch (err) {
      console.error(`[heelwood] tile ${z}/${x}/${y} from the ${source.kind} source could not be read:`, err);
      tile = undefined;
    }

    if (!tile || tile.length === 0) {
      res.status(404).setHeader('Cache-Control', MISSING_CACHE).type('image/png').send(await blankPng());
      return;
    }

    const etag = `"${createHash('sha1').update(tile).digest('base64url')}"`;
    res.setHeader('Cache-Control', TILE_CACHE);
    res.setHeader('ETag', etag);
    const match = req.headers['if-none-match'];
    if (match && match.split(',').some((t) => t.trim() === etag || t.trim() === `W/${etag}`)) {
      res.status(304).end();
      return;
    }
    res.type(imageType(tile)).send(tile);
  });

  // Anything else under the mount is not a tile: answer here rather than fall through to the
  // client's index.html.
  router.use((req: Request, res: Response) => {
    refuse(res, 404, 'not_found', `No such tile route: ${req.method} ${req.originalUrl}. Tiles are at /tiles/{z}/{x}/{y}.png.`);
  });

  return router;
}
