// Photos on strike reports, over HTTP on a copy of the demo cooperative: the grower who filed a
// report adds up to three photos of the rooted cuttings; they come back with the grower's
// bundles; only the reporter and coordinators get the files; refusals store nothing; removing
// a photo or the whole report removes the files from disk.
import { existsSync, readdirSync } from 'node:fs';
import path from 'node:path';
import { count, eq } from 'drizzle-orm';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  allocationRounds,
  bundles,
  farms,
  motherPlants,
  photos,
  requestLines,
  seasons,
  species,
  strikeReports,
  user,
  woodOffers,
  woodRequests,
} from '../../server/db/schema/index.js';
import { Client } from '../fixtures/http.js';
import { makeImage, textFile } from '../fixtures/images.js';
import { startTestApp, type TestApp } from '../fixtures/test-app.js';

const DEMO_PASSWORD = 'heelwood-demo';

let app: TestApp;
let photoDir: string;
/** grower: the reporter (Sam Okafor); lead: another grower; coordinator. */
const as = {} as Record<'grower' | 'lead' | 'coordinator', Client>;
let bundleId: string;

async function signedIn(email: string) {
  const c = new Client(app.url);
  await c.signIn(email, DEMO_PASSWORD);
  return c;
}

const storedFiles = () => (existsSync(photoDir) ? readdirSync(photoDir).sort() : []);
async function snapshot() {
  const [{ n }] = await app.ctx.db.select({ n: count() }).from(photos);
  return { rows: n, files: storedFiles() };
}
const rowOf = async (id: string) => (await app.ctx.db.select().from(photos).where(eq(photos.id, id)))[0];

function upload(who: Client, reportId: string, file: Buffer, opts: { caption?: string; name?: string; type?: string } = {}) {
  const form = new FormData();
  if (opts.caption !== undefined) form.append('caption', opts.caption);
  form.append('photo', new Blob([new Uint8Array(file)], { type: opts.type ?? 'image/jpeg' }), opts.name ?? 'cuttings.jpg');
  return who.request('POST', `/api/strike-reports/${reportId}/photos`, undefined, { form });
}

/** A file answer as bytes (the JSON client would decode it as text). */
async function fetchBytes(who: Client, url: string) {
  const res = await fetch(new URL(url, app.url), { headers: { cookie: who.cookieHeader() } });
  return { status: res.status, type: res.headers.get('content-type'), bytes: Buffer.from(await res.arrayBuffer()) };
}

async function fileReport(stuck = 4, rooted = 3): Promise<string> {
  const r = await as.grower.post(`/api/bundles/${bundleId}/strike-reports`, { stuck, rooted, assessedOn: '2026-03-20', notes: 'In a cold frame.' });
  if (r.status !== 201) throw new Error(`filing a report failed: ${r.status} ${r.text}`);
  expect(r.body.mine).toBe(true);
  expect(r.body.photos).toEqual([]);
  return r.body.id;
}

async function myReport(who: Client, reportId: string) {
  const r = await who.get('/api/my/bundles');
  expect(r.status).toBe(200);
  for (const b of r.body.items) for (const rep of b.reports) if (rep.id === reportId) return rep;
  return undefined;
}

// A collected bundle of 40 blackcurrant cuttings from a WTH plant to the demo grower (Sam Okafor).
async function makeBundle() {
  const db = app.ctx.db;
  const [grower] = await db.select({ id: user.id }).from(user).where(eq(user.email, 'grower@heelwood.test'));
  const [wth] = await db.select().from(farms).where(eq(farms.code, 'WTH'));
  const [blackcurrant] = await db.select().from(species).where(eq(species.commonName, 'Blackcurrant'));
  const [plant] = await db
    .insert(motherPlants)
    .values({ code: 'WTH-PHOTOA', farmId: wth.id, speciesId: blackcurrant.id, plantingYear: 2019, role: 'stock_bed', provenance: 'bought', lastInspectedOn: '2025-10-01' })
    .returning();
  const [season] = await db
    .insert(seasons)
    .values({
      name: 'Photo test hardwood 2025–26',
      kind: 'dormant_hardwood',
      hemisphere: 'north',
      stage: 'closed',
      requestDeadline: new Date('2025-11-15T18:00:00Z'),
      collectionStart: '2025-12-01',
      collectionEnd: '2026-02-28',
    })
    .returning();
  const [offer] = await db
    .insert(woodOffers)
    .values({ seasonId: season.id, plantId: plant.id, directCount: 100, estimatedYield: 100, capFraction: 0.9, offered: 60, reserved: 40 })
    .returning();
  const [request] = await db
    .insert(woodRequests)
    .values({ seasonId: season.id, growerId: grower.id, status: 'filed', destinationLat: 52.1, destinationLon: -2.6, maxDistanceKm: 50 })
    .returning();
  const [line] = await db.insert(requestLines).values({ requestId: request.id, speciesId: blackcurrant.id, cuttings: 40, treatment: 'willow' }).returning();
  const [round] = await db
    .insert(allocationRounds)
    .values({ seasonId: season.id, number: 1, status: 'notified', approvedAt: new Date('2025-11-20T12:00:00Z'), notifiedAt: new Date('2025-11-20T12:01:00Z') })
    .returning();
  const [b] = await db
    .insert(bundles)
    .values({
      code: 'BP5-0001',
      roundId: round.id,
      offerId: offer.id,
      lineId: line.id,
      plantId: plant.id,
      farmId: wth.id,
      growerId: grower.id,
      cuttings: 40,
      status: 'collected',
      collectedAt: new Date('2025-12-13T10:30:00Z'),
    })
    .returning();
  bundleId = b.id;
}

beforeAll(async () => {
  app = await startTestApp({ seeded: true });
  photoDir = path.join(app.ctx.config.dataDir, 'photos');
  for (const who of ['grower', 'lead', 'coordinator'] as const) as[who] = await signedIn(`${who}@heelwood.test`);
  await makeBundle();
}, 120_000);

afterAll(async () => {
  await app?.close();
});

describe('photos of a strike report', () => {
  let reportId: string;
  let photo: { id: string; url: string; thumbUrl: string; caption: string | null };

  beforeAll(async () => {
    reportId = await fileReport();
  });

  it('the reporter adds one; it comes back with the bundles, and its files are images without a position', async () => {
    const before = await snapshot();
    const r = await upload(as.grower, reportId, await makeImage('jpeg', { width: 300, height: 200, gps: { lat: 52.06, lon: -2.7 }, takenAt: '2026:03:20 09:00:00' }), {
      caption: '  Roots on the willow-soaked ones  ',
    });
    expect(r.status, r.text).toBe(201);
    photo = r.body.photo;
    expect(photo).toMatchObject({ caption: 'Roots on the willow-soaked ones', width: 300, height: 200, url: `/api/photos/${photo.id}/image`, thumbUrl: `/api/photos/${photo.id}/thumb` });
    const after = await snapshot();
    expect(after.rows).toBe(before.rows + 1);
    expect(after.files.length).toBe(before.files.length + 2);

    // Tied to the report only, with no position kept (it would say where the grower lives).
    const row = await rowOf(photo.id);
    expect(row).toMatchObject({ strikeReportId: reportId, plantId: null, findingId: null, gpsLat: null, gpsLon: null });

    const mine = await myReport(as.grower, reportId);
    expect(mine.mine).toBe(true);
    expect(mine.photos).toEqual([{ id: photo.id, url: photo.url, thumbUrl: photo.thumbUrl, caption: photo.caption, width: 300, height: 200, createdAt: expect.any(String) }]);

    const image = await fetchBytes(as.grower, mine.photos[0].url);
    expect(image.status).toBe(200);
    expect(image.type).toBe('image/jpeg');
    const meta = await sharp(image.bytes).metadata();
    expect(meta).toMatchObject({ format: 'jpeg', width: 300, height: 200 });
    expect(meta.exif).toBeUndefined();

    const thumb = await fetchBytes(as.grower, mine.photos[0].thumbUrl);
    expect(thumb.status).toBe(200);
    expect(thumb.type).toBe('image/webp');
    const t = await sharp(thumb.bytes).metadata();
    expect(t.format).toBe('webp');
    // THUMB_SIDE in photos.service.ts: 320 px on the long side, never enlarged.
    expect(Math.max(t.width!, t.height!)).toBe(300);
  });

  it('another grower gets 404 for the upload (before the body is read) and for the files; nothing is stored', async () => {
    const before = await snapshot();
    const r = await upload(as.lead, reportId, await makeImage('jpeg'));
    expect(r.status).toBe(404);
    expect(r.body.error.code).toBe('not_found');
    // 20 MB would be refused with 413 if the body were read first.
    const big = await upload(as.lead, reportId, Buffer.alloc(20 * 1024 * 1024, 0xab));
    expect(big.status).toBe(404);
    expect((await fetchBytes(as.lead, photo.url)).status).toBe(404);
    expect((await fetchBytes(as.lead, photo.thumbUrl)).status).toBe(404);
    // The lead's own bundle list never holds this report.
    expect(await myReport(as.lead, reportId)).toBeUndefined();
    expect(await snapshot()).toEqual(before);
  });

  it('a coordinator fetches the files, but may not add a photo to a report they did not file', async () => {
    const image = await fetchBytes(as.coordinator, photo.url);
    expect(image.status).toBe(200);
    expect((await sharp(image.bytes).metadata()).format).toBe('jpeg');
    expect((await fetchBytes(as.coordinator, photo.thumbUrl)).status).toBe(200);

    const before = await snapshot();
    const r = await upload(as.coordinator, reportId, await makeImage('jpeg'));
    expect(r.status).toBe(403);
    expect(r.body.error.code).toBe('forbidden');
    expect(await snapshot()).toEqual(before);
  });

  it('refuses a file that is not an image, naming the field, and stores nothing', async () => {
    const before = await snapshot();
    const r = await upload(as.grower, reportId, textFile(), { name: 'roots.jpg', type: 'image/jpeg' });
    expect(r.status).toBe(415);
    expect(r.body.error.fields).toEqual({ photo: 'not a JPEG, PNG or WebP image' });
    const none = await as.grower.request('POST', `/api/strike-reports/${reportId}/photos`, undefined, { form: new FormData() });
    expect(none.status).toBe(400);
    expect(none.body.error.fields).toEqual({ photo: 'no file was sent' });
    const long = await upload(as.grower, reportId, await makeImage('jpeg'), { caption: 'x'.repeat(501) });
    expect(long.status).toBe(400);
    expect(Object.keys(long.body.error.fields)).toEqual(['caption']);
    expect(await snapshot()).toEqual(before);
  });

  it('takes three photos at most and refuses a fourth, naming the field photo', async () => {
    expect((await upload(as.grower, reportId, await makeImage('png'), { name: 'b.png', type: 'image/png' })).status).toBe(201);
    expect((await upload(as.grower, reportId, await makeImage('webp'), { name: 'c.webp', type: 'image/webp' })).status).toBe(201);
    const before = await snapshot();
    const r = await upload(as.grower, reportId, await makeImage('jpeg'));
    expect(r.status).toBe(409);
    expect(Object.keys(r.body.error.fields)).toEqual(['photo']);
    expect(r.body.error.fields.photo).toMatch(/at most 3/);
    expect(await snapshot()).toEqual(before);
    expect((await myReport(as.grower, reportId)).photos.map((p: { id: string }) => p.id)[0]).toBe(photo.id);
  });

  it('lets only the reporter remove a photo, and removes its files', async () => {
    const row = await rowOf(photo.id);
    const files = [path.join(photoDir, row.fileName), path.join(photoDir, row.thumbName)];
    expect(files.every((f) => existsSync(f))).toBe(true);

    expect((await as.lead.delete(`/api/photos/${photo.id}`)).status).toBe(404);
    expect((await as.coordinator.delete(`/api/photos/${photo.id}`)).status).toBe(403);
    expect(await rowOf(photo.id)).toBeDefined();

    expect((await as.grower.delete(`/api/photos/${photo.id}`)).status).toBe(204);
    expect(await rowOf(photo.id)).toBeUndefined();
    expect(files.some((f) => existsSync(f))).toBe(false);
    expect((await fetchBytes(as.grower, photo.url)).status).toBe(404);
    expect((await myReport(as.grower, reportId)).photos).toHaveLength(2);
    // With room again, a new one is taken.
    expect((await upload(as.grower, reportId, await makeImage('jpeg'))).status).toBe(201);
  });

  it('deleting the report removes its photo rows and their files on disk', async () => {
    const rows = await app.ctx.db.select().from(photos).where(eq(photos.strikeReportId, reportId));
    expect(rows).toHaveLength(3);
    const files = rows.flatMap((p) => [path.join(photoDir, p.fileName), path.join(photoDir, p.thumbName)]);
    expect(files.every((f) => existsSync(f))).toBe(true);
    const before = await snapshot();

    const r = await as.grower.delete(`/api/strike-reports/${reportId}`);
    expect(r.status).toBe(204);
    expect(await app.ctx.db.select().from(strikeReports).where(eq(strikeReports.id, reportId))).toEqual([]);
    expect(await app.ctx.db.select().from(photos).where(eq(photos.strikeReportId, reportId))).toEqual([]);
    expect(files.some((f) => existsSync(f))).toBe(false);
    const after = await snapshot();
    expect(after.rows).toBe(before.rows - 3);
    expect(after.files.length).toBe(before.files.length - 6);
    for (const p of rows) expect((await fetchBytes(as.coordinator, `/api/photos/${p.id}/image`)).status).toBe(404);
    expect((await upload(as.grower, reportId, await makeImage('jpeg'))).status).toBe(404);
  });

  it('a report whose removal is refused keeps its photos and files', async () => {
    // Plants raised from the bundle rest on the rooted cuttings of this report (removeStrikeReport).
    const id = await fileReport(5, 5);
    const added = await upload(as.grower, id, await makeImage('jpeg'));
    expect(added.status).toBe(201);
    // The demo grower works on no farm, so the raised plants are written straight to the database.
    const [b] = await app.ctx.db.select().from(bundles).where(eq(bundles.id, bundleId));
    const [wth] = await app.ctx.db.select().from(farms).where(eq(farms.code, 'WTH'));
    const [blackcurrant] = await app.ctx.db.select().from(species).where(eq(species.commonName, 'Blackcurrant'));
    for (let i = 0; i < 5; i++) {
      await app.ctx.db.insert(motherPlants).values({
        code: `WTH-PHOTOR${String.fromCharCode(65 + i)}`,
        farmId: wth.id,
        speciesId: blackcurrant.id,
        plantingYear: 2026,
        role: 'stock_bed',
        provenance: 'exchange',
        sourceBundleId: b.id,
      });
    }
    const before = await snapshot();
    const r = await as.grower.delete(`/api/strike-reports/${id}`);
    expect(r.status).toBe(409);
    expect(await snapshot()).toEqual(before);
    expect((await fetchBytes(as.grower, added.body.photo.url)).status).toBe(200);
  });
});
