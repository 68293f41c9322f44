// Photos of mother plants, of inspection findings and of strike reports (how a grower's
// cuttings rooted): who may add, see and remove them, and what happens to the bytes. Uploads are judged by their content (never by name or
// declared type), their GPS tag and date taken are read before anything is stripped, and
// only re-encoded copies without metadata are kept, so a photo never leaks where a
// member lives or what camera they own.
import { randomUUID } from 'node:crypto';
import { mkdir, rm, writeFile } from 'node:fs/promises';
import path from 'node:path';
import exifr from 'exifr';
import sharp, { type Metadata } from 'sharp';
import type { PhotoView } from '../../../shared/schemas/register.js';
import { MAX_REPORT_PHOTOS, type StrikeReportPhotoView } from '../../../shared/schemas/strike-reports.js';
import type { Actor } from '../../auth/guards.js';
import type { Config } from '../../config.js';
import type { Db, DbOrTx } from '../../db/client.js';
import { badRequest, conflict, forbidden, HttpError, notFound } from '../../lib/http-error.js';
import { isCoordinator, mayEdit, mayInspect, seesFull } from '../mother-plants/plant-access.js';
import { photoView, visiblePlant } from '../mother-plants/mother-plants.service.js';
import {
  countReportPhotos,
  deletePhotoRow,
  findPhoto,
  findReportForPhotos,
  insertPhoto,
  type NewPhotoRow,
  plantOfFinding,
  type PhotoRow,
} from './photos.repo.js';

export const MAX_UPLOAD_BYTES = 10 * 1024 * 1024;
/** Long side of the kept copy: sharp enough to tell a leaf spot, small enough for a phone. */
export const MAX_SIDE = 2000;
export const THUMB_SIDE = 320;
/** 10 MB of well-compressed PNG can unpack to gigabytes; no phone camera needs more than this. */
const MAX_INPUT_PIXELS = 100_000_000;

const FORMATS = {
  jpeg: { mime: 'image/jpeg', ext: 'jpg' },
  png: { mime: 'image/png', ext: 'png' },
  webp: { mime: 'image/webp', ext: 'webp' },
} as const;
type Format = keyof typeof FORMATS;

export type Gps = { lat: number; lon: number };
export type PhotoDeps = { db: Db; dir: string };
export type PhotoFields = { caption: string | null; findingId: string | null };

export function photosDir(config: Pick<Config, 'dataDir'>): string {
  return path.join(config.dataDir, 'photos');
}

const notAnImage = () =>
  new HttpError(415, 'unsupported_image', 'The photo must be a JPEG, PNG or WebP image.', { photo: 'not a JPEG, PNG or WebP image' });

const damaged = () =>
  badRequest('The photo could not be read; the file may be damaged.', { photo: 'could not be read as an image' });

type Inspected = { format: Format; gps: Gps | null; takenAt: Date | null };

/** What the bytes really are, and the position and date the camera wrote into them. */
async function inspectImage(buffer: Buffer): Promise<Inspected> {
  let meta: Metadata;
  try {
    meta = await sharp(buffer).metadata();
  } catch {
    throw notAnImage();
  }
  const format = meta.format as string;
  if (!(format in FORMATS)) throw notAnImage();
  if ((meta.width ?? 0) * (meta.height ?? 0) > MAX_INPUT_PIXELS) {
    throw new HttpError(413, 'image_too_large', 'The photo has more than 100 megapixels; send a smaller copy.', { photo: 'more than 100 megapixels' });
  }
  const tiff = tiffOf(meta.exif);
  const [gps, takenAt] = tiff ? await Promise.all([gpsOf(tiff), takenAtOf(tiff)]) : [null, null];
  return { format: format as Format, gps, takenAt };
}

/**
 * exifr cannot open a WebP container, so the EXIF block is taken out by sharp (which reads
 * all three formats) and handed to exifr as the TIFF structure it is. JPEG and WebP carry
 * it behind an "Exif\0\0" marker; PNG's eXIf chunk does not.
 */
function tiffOf(exif: Buffer | undefined): Buffer | undefined {
  if (!exif?.length) return undefined;
  return exif.subarray(0, 6).toString('latin1') === 'Exif\0\0' ? exif.subarray(6) : exif;
}

async function gpsOf(tiff: Buffer): Promise<Gps | null> {
  try {
    const g = await exifr.gps(tiff);
    if (!g || !Number.isFinite(g.latitude) || !Number.isFinite(g.longitude)) return null;
    if (Math.abs(g.latitude) > 90 || Math.abs(g.longitude) > 180) return null;
    return { lat: g.latitude, lon: g.longitude };
  } catch {
    // A broken tag costs the position, not the upload.
    return null;
  }
}

async function takenAtOf(tiff: Buffer): Promise<Date | null> {
  try {
    // Raw strings, because exifr would read the zoneless EXIF time in the server's own
    // time zone, and the same photo would get another date on another server.
    const t = await exifr.parse(tiff, { pick: ['DateTimeOriginal', 'OffsetTimeOriginal'], reviveValues: false });
    const m = /^(\d{4}):(\d{2}):(\d{2}) (\d{2}):(\d{2}):(\d{2})/.exec(String(t?.DateTimeOriginal ?? '').trim());
    if (!m) return null;
    const offset = /^[+-]\d{2}:\d{2}$/.test(String(t?.OffsetTimeOriginal ?? '').trim()) ? String(t.OffsetTimeOriginal).trim() : 'Z';
    const d = new Date(`${m[1]}-${m[2]}-${m[3]}T${m[4]}:${m[5]}:${m[6]}${offset}`);
    return Number.isNaN(d.getTime()) ? null : d;
  } catch {
    return null;
  }
}

/** Re-encoded copies: sharp writes no metadata unless asked, so EXIF, XMP and GPS are gone. */
async function encode(buffer: Buffer, format: Format) {
  // rotate() applies the EXIF orientation to the pixels, since the tag itself is dropped.
  const open = () => sharp(buffer, { limitInputPixels: MAX_INPUT_PIXELS }).rotate();
  const fit = (side: number) => ({ width: side, height: side, fit: 'inside' as const, withoutEnlargement: true });
  try {
    const [main, thumb] = await Promise.all([
      open()
        .resize(fit(MAX_SIDE))
        .toFormat(format, format === 'png' ? { compressionLevel: 9 } : { quality: 85 })
        .toBuffer({ resolveWithObject: true }),
      open().resize(fit(THUMB_SIDE)).webp({ quality: 75 }).toBuffer(),
    ]);
    return { main: main.data, width: main.info.width, height: main.info.height, thumb };
  } catch {
    throw damaged();
  }
}

/** A plant the caller may add photos to: the people of its farm, or a coordinator. */
export async function assertMayAddPhoto(db: Db, a: Actor, plantId: string) {
  const plant = await visiblePlant(db, a, plantId);
  if (!mayEdit(a, plant.farmId) && !mayInspect(a, plant.farmId)) {
    throw forbidden('Only the people of that farm, or a coordinator, may add photos to this plant.');
  }
  if (plant.healthStatus === 'retired') throw conflict('A retired plant is kept as history; no photos can be added.');
  return plant;
}

export async function addPhoto(
  deps: PhotoDeps,
  a: Actor,
  plantId: string,
  buffer: Buffer,
  fields: PhotoFields,
): Promise<{ photo: PhotoView; gps: Gps | null }> {
  await assertMayAddPhoto(deps.db, a, plantId);
  if (fields.findingId && (await plantOfFinding(deps.db, fields.findingId)) !== plantId) {
    throw badRequest('That finding was not recorded on this plant.', { findingId: 'not a finding on this plant' });
  }
  const { row, gps } = await storePhoto(deps, buffer, (stored) =>
    insertPhoto(deps.db, { ...stored, plantId, findingId: fields.findingId, caption: fields.caption, uploadedBy: a.id }),
  );
  // The position is offered, not applied: the person decides whether the plant stands there.
  return { photo: photoView(row), gps };
}

type StoredPhoto = Pick<NewPhotoRow, 'fileName' | 'thumbName' | 'mimeType' | 'width' | 'height' | 'bytes' | 'gpsLat' | 'gpsLon' | 'takenAt'>;

/**
 * Checks the bytes, writes the kept copy and the thumbnail, then lets `insert` write the row.
 * When anything fails the files are removed again: files without a row would never be served
 * or cleaned up.
 */
async function storePhoto(
  deps: PhotoDeps,
  buffer: Buffer,
  insert: (stored: StoredPhoto) => Promise<PhotoRow>,
  opts: { keepPosition: boolean } = { keepPosition: true },
): Promise<{ row: PhotoRow; gps: Gps | null }> {
  const info = await inspectImage(buffer);
  const out = await encode(buffer, info.format);

  await mkdir(deps.dir, { recursive: true });
  const fileName = `${randomUUID()}.${FORMATS[info.format].ext}`;
  const thumbName = `${randomUUID()}.webp`;
  const written: string[] = [];
  try {
    for (const [name, data] of [[fileName, out.main], [thumbName, out.thumb]] as const) {
      await writeFile(path.join(deps.dir, name), data, { flag: 'wx' });
      written.push(name);
    }
    const gps = opts.keepPosition ? info.gps : null;
    const row = await insert({
      fileName,
      thumbName,
      mimeType: FORMATS[info.format].mime,
      width: out.width,
      height: out.height,
      bytes: out.main.length,
      gpsLat: gps?.lat ?? null,
      gpsLon: gps?.lon ?? null,
      takenAt: info.takenAt,
    });
    return { row, gps };
  } catch (err) {
    await removePhotoFiles(deps.dir, written);
    throw err;
  }
}

/** Removes files of the photo folder by name; a failed unlink is logged, never thrown. */
export async function removePhotoFiles(dir: string, names: readonly string[]): Promise<void> {
  const results = await Promise.allSettled(names.map((n) => rm(path.join(dir, path.basename(n)), { force: true })));
  for (const r of results) if (r.status === 'rejected') console.error('[heelwood] photo file not removed:', r.reason);
}

// Photos of strike reports ------------------------------------------------------------------

type ReportOfPhotos = { id: string; reporterId: string | null };

/** The reporter and coordinators see a report's photos (a grower's own bench, not the register). */
export const seesReportPhotos = (a: Actor, report: Pick<ReportOfPhotos, 'reporterId'>) => report.reporterId === a.id || isCoordinator(a);

export function reportPhotoView(p: PhotoRow): StrikeReportPhotoView {
  const { gps: _noPosition, findingId: _noFinding, ...view } = photoView(p);
  return view;
}

/** Only the person who filed the report adds photos to it (others learn nothing of it), up to three. */
async function checkMayAddReportPhoto(db: DbOrTx, a: Actor, report: ReportOfPhotos | undefined) {
  if (!report || !seesReportPhotos(a, report)) throw notFound('That strike report');
  if (report.reporterId !== a.id) throw forbidden('Only the grower who filed this strike report may add photos to it.');
  if ((await countReportPhotos(db, report.id)) >= MAX_REPORT_PHOTOS) {
    throw conflict(`A strike report has at most ${MAX_REPORT_PHOTOS} photos; delete one to add another.`, {
      photo: `at most ${MAX_REPORT_PHOTOS} photos per report`,
    });
  }
}

export async function assertMayAddReportPhoto(db: Db, a: Actor, reportId: string): Promise<void> {
  await checkMayAddReportPhoto(db, a, await findReportForPhotos(db, reportId));
}

export async function addReportPhoto(
  deps: PhotoDeps,
  a: Actor,
  reportId: string,
  buffer: Buffer,
  fields: { caption: string | null },
): Promise<{ photo: StrikeReportPhotoView }> {
  // The router has checked before reading the upload; the transaction below checks again on
  // the locked report. No position is kept: it would say where the grower keeps their
  // cuttings, and nothing here uses it.
  const { row } = await storePhoto(
    deps,
    buffer,
    (stored) =>
      deps.db.transaction(async (tx) => {
        // Checked again on the locked report, so two uploads at once cannot make a fourth photo.
        await checkMayAddReportPhoto(tx, a, await findReportForPhotos(tx, reportId, true));
        return insertPhoto(tx, { ...stored, strikeReportId: reportId, caption: fields.caption, uploadedBy: a.id });
      }),
    { keepPosition: false },
  );
  return { photo: reportPhotoView(row) };
}

/** For placing a plant from a photo: the same checks, nothing kept. */
export async function readPhotoPosition(buffer: Buffer): Promise<{ gps: Gps | null; takenAt: string | null }> {
  const info = await inspectImage(buffer);
  return { gps: info.gps, takenAt: info.takenAt?.toISOString() ?? null };
}

/**
 * A photo the caller may see; finding photos are part of the health record, kept to the farm;
 * strike-report photos to the reporter and coordinators.
 */
async function visiblePhoto(db: Db, a: Actor, id: string) {
  const row = await findPhoto(db, id);
  if (!row) throw notFound('That photo');
  if (row.strikeReportId) {
    const report = await findReportForPhotos(db, row.strikeReportId);
    if (!report || !seesReportPhotos(a, report)) throw notFound('That photo');
    return { kind: 'report' as const, row, report };
  }
  const plantId = row.plantId ?? (row.findingId ? await plantOfFinding(db, row.findingId) : undefined);
  if (!plantId) throw notFound('That photo');
  let plant;
  try {
    plant = await visiblePlant(db, a, plantId);
  } catch (err) {
    // Say "photo", not "plant": the caller asked for a photo and should learn nothing more.
    if (err instanceof HttpError && err.status === 404) throw notFound('That photo');
    throw err;
  }
  if (row.findingId && !seesFull(a, plant.farmId)) throw notFound('That photo');
  return { kind: 'plant' as const, row, plant };
}

export async function photoFile(db: Db, a: Actor, id: string, kind: 'image' | 'thumb') {
  const { row } = await visiblePhoto(db, a, id);
  return kind === 'image'
    ? { name: row.fileName, mimeType: row.mimeType }
    : { name: row.thumbName, mimeType: 'image/webp' };
}

export async function removePhoto(deps: PhotoDeps, a: Actor, id: string): Promise<void> {
  const seen = await visiblePhoto(deps.db, a, id);
  if (seen.kind === 'report') {
    if (seen.report.reporterId !== a.id) throw forbidden('Only the grower who filed this strike report may remove its photos.');
  } else {
    if (!mayEdit(a, seen.plant.farmId)) throw forbidden('Only the people of that farm, or a coordinator, may remove its photos.');
    if (seen.plant.healthStatus === 'retired') throw conflict('A retired plant is kept as history; its photos stay.');
  }
  const row = await deletePhotoRow(deps.db, id);
  if (!row) return;
  // The row goes first: a file left behind by a failed unlink is unreachable, never a broken link.
  await removePhotoFiles(deps.dir, [row.fileName, row.thumbName]);
}
