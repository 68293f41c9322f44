// Photo uploads end to end over HTTP on a copy of the demo database: content checks,
// GPS read before stripping, nothing stored on refusal, who may see and remove.
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import type { Server } from 'node:http';
import path from 'node:path';
import { and, count, eq, ne } from 'drizzle-orm';
import exifr from 'exifr';
import express from 'express';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app.js';
import { farmMemberships, findings, inspections, motherPlants, pests, photos, user } from '../../server/db/schema/index.js';
import { errorHandler } from '../../server/lib/error-handler.js';
import { photosRouter } from '../../server/modules/photos/photos.router.js';
import { freePort } from '../fixtures/free-port.js';
import { Client } from '../fixtures/http.js';
import { makeImage, textFile } from '../fixtures/images.js';
import { startTestApp, type TestApp } from '../fixtures/test-app.js';

const DEMO_PASSWORD = 'heelwood-demo';

/** A signed-in person who can send multipart forms and read binary answers. */
class Member {
  constructor(
    private readonly base: string,
    private readonly cookie: string,
  ) {}

  static async signIn(app: TestApp, base: string, email: string) {
    const r = await new Client(app.url).signIn(email, DEMO_PASSWORD);
    const cookie = r.headers
      .getSetCookie()
      .map((c) => c.split(';')[0])
      .join('; ');
    return new Member(base, cookie);
  }

  async send(method: string, url: string, body?: FormData) {
    const res = await fetch(new URL(url, this.base), { method, body, headers: { cookie: this.cookie, origin: this.base } });
    const bytes = Buffer.from(await res.arrayBuffer());
    let json: any;
    try {
      json = JSON.parse(bytes.toString('utf8'));
    } catch {
      /* an image */
    }
    return { status: res.status, headers: res.headers, bytes, body: json };
  }

  upload(url: string, file: Buffer, opts: { name?: string; type?: string; fields?: Record<string, string> } = {}) {
    const form = new FormData();
    for (const [k, v] of Object.entries(opts.fields ?? {})) form.append(k, v);
    form.append('photo', new Blob([new Uint8Array(file)], { type: opts.type ?? 'image/jpeg' }), opts.name ?? 'photo.jpg');
    return this.send('POST', url, form);
  }

  get(url: string) {
    return this.send('GET', url);
  }

  delete(url: string) {
    return this.send('DELETE', url);
  }
}

/**
 * Until app.ts mounts photosRouter, serve it in front of the real app on another port, so
 * these tests run the same router, guards and error middleware either way.
 */
async function photosBase(app: TestApp): Promise<{ url: string; close(): Promise<void> }> {
  const probe = await fetch(`${app.url}/api/photos/read-gps`, { method: 'POST' });
  const body = (await probe.json()) as { error?: { message?: string } };
  if (!(probe.status === 404 && /No such API route/.test(body.error?.message ?? ''))) return { url: app.url, close: async () => {} };
  const outer = express();
  outer.use('/api', photosRouter(app.ctx));
  outer.use(await createApp(app.ctx));
  outer.use(errorHandler);
  const port = await freePort();
  const server: Server = await new Promise((resolve) => {
    const s = outer.listen(port, '127.0.0.1', () => resolve(s));
  });
  return {
    url: `http://localhost:${port}`,
    close: async () => {
      server.closeAllConnections();
      await new Promise((r) => server.close(r));
    },
  };
}

let app: TestApp;
let base: Awaited<ReturnType<typeof photosBase>>;
let lead: Member;
let hand: Member;
let grower: Member;
let coordinator: Member;
let plantId: string;
let plantPosition: { lat: number | null; lon: number | null };
/** A plant of the lead's farm on watch: members of other farms may not see it. */
let watchPlantId: string;
let findingId: string;
let otherFindingId: string;
let photoDir: string;

async function photoCount() {
  const [{ n }] = await app.ctx.db.select({ n: count() }).from(photos);
  return n;
}
const storedFiles = () => (existsSync(photoDir) ? readdirSync(photoDir).sort() : []);
const snapshot = async () => ({ rows: await photoCount(), files: storedFiles() });
const rowOf = async (id: string) => (await app.ctx.db.select().from(photos).where(eq(photos.id, id)))[0];

async function addFinding(onPlant: string, inspectorId: string) {
  const [pest] = await app.ctx.db.select({ id: pests.id }).from(pests).limit(1);
  const [insp] = await app.ctx.db
    .insert(inspections)
    .values({ plantId: onPlant, inspectedOn: '2025-06-01', inspectorId, notes: 'photo test' })
    .returning();
  const [f] = await app.ctx.db.insert(findings).values({ inspectionId: insp.id, pestId: pest.id, severity: 'minor' }).returning();
  return f.id;
}

beforeAll(async () => {
  app = await startTestApp({ seeded: true });
  base = await photosBase(app);
  photoDir = path.join(app.ctx.config.dataDir, 'photos');
  [lead, hand, grower, coordinator] = await Promise.all(
    ['lead', 'hand', 'grower', 'coordinator'].map((who) => Member.signIn(app, base.url, `${who}@heelwood.test`)),
  );
  const db = app.ctx.db;
  const [leadUser] = await db.select({ id: user.id }).from(user).where(eq(user.email, 'lead@heelwood.test'));
  const [membership] = await db.select().from(farmMemberships).where(eq(farmMemberships.userId, leadUser.id));
  const plants = await db
    .select()
    .from(motherPlants)
    .where(and(eq(motherPlants.farmId, membership.farmId), ne(motherPlants.healthStatus, 'retired')))
    .limit(2);
  expect(plants.length).toBe(2);
  plantId = plants[0].id;
  watchPlantId = plants[1].id;
  // Fixed statuses, whatever the demo drew: clean is visible to every member, watch is not.
  await db.update(motherPlants).set({ healthStatus: 'clean' }).where(eq(motherPlants.id, plantId));
  await db.update(motherPlants).set({ healthStatus: 'watch' }).where(eq(motherPlants.id, watchPlantId));
  plantPosition = { lat: plants[0].lat, lon: plants[0].lon };
  findingId = await addFinding(plantId, leadUser.id);
  otherFindingId = await addFinding(watchPlantId, leadUser.id);
}, 120_000);

afterAll(async () => {
  await base?.close();
  await app?.close();
});

const uploadUrl = (id: string) => `/api/mother-plants/${id}/photos`;

describe('upload', () => {
  it('reads the GPS tag and date, stores copies without any metadata, and leaves the plant where it was', async () => {
    const gps = { lat: 52.0712345, lon: -2.6543219 };
    const jpeg = await makeImage('jpeg', { gps, takenAt: '2025:04:12 09:30:00', takenAtOffset: '+01:00' });
    expect((await exifr.gps(jpeg))?.latitude).toBeCloseTo(gps.lat, 6);

    const r = await lead.upload(uploadUrl(plantId), jpeg, { fields: { caption: '  Spring growth, north row  ' } });
    expect(r.status).toBe(201);
    expect(Math.abs(r.body.gps.lat - gps.lat)).toBeLessThan(1e-5);
    expect(Math.abs(r.body.gps.lon - gps.lon)).toBeLessThan(1e-5);
    expect(r.body.photo).toMatchObject({
      caption: 'Spring growth, north row',
      width: 64,
      height: 48,
      findingId: null,
      url: `/api/photos/${r.body.photo.id}/image`,
      thumbUrl: `/api/photos/${r.body.photo.id}/thumb`,
    });
    expect(Math.abs(r.body.photo.gps.lat - gps.lat)).toBeLessThan(1e-5);

    const row = await rowOf(r.body.photo.id);
    expect(row.mimeType).toBe('image/jpeg');
    expect(row.takenAt?.toISOString()).toBe('2025-04-12T08:30:00.000Z');
    expect(row.fileName).toMatch(/^[0-9a-f-]{36}\.jpg$/);
    expect(row.thumbName).toMatch(/^[0-9a-f-]{36}\.webp$/);

    const stored = readFileSync(path.join(photoDir, row.fileName));
    expect(row.bytes).toBe(stored.length);
    expect(await exifr.parse(stored)).toBeUndefined();
    expect(await exifr.gps(stored)).toBeUndefined();
    const meta = await sharp(stored).metadata();
    expect(meta.format).toBe('jpeg');
    expect(meta.exif).toBeUndefined();
    expect(meta.xmp).toBeUndefined();

    const thumb = await sharp(readFileSync(path.join(photoDir, row.thumbName))).metadata();
    expect(thumb.format).toBe('webp');
    expect(thumb.exif).toBeUndefined();

    const [plant] = await app.ctx.db.select().from(motherPlants).where(eq(motherPlants.id, plantId));
    expect({ lat: plant.lat, lon: plant.lon }).toEqual(plantPosition);
  });

  it('answers gps: null for a photo without a position', async () => {
    const r = await lead.upload(uploadUrl(plantId), await makeImage('jpeg'));
    expect(r.status).toBe(201);
    expect(r.body.gps).toBeNull();
    expect(r.body.photo.gps).toBeNull();
  });

  it('turns the pixels by the EXIF orientation before dropping the tag', async () => {
    const r = await lead.upload(uploadUrl(plantId), await makeImage('jpeg', { width: 64, height: 48, orientation: 6 }));
    expect(r.status).toBe(201);
    expect(r.body.photo).toMatchObject({ width: 48, height: 64 });
    const meta = await sharp(readFileSync(path.join(photoDir, (await rowOf(r.body.photo.id)).fileName))).metadata();
    expect([meta.width, meta.height, meta.orientation, meta.exif]).toEqual([48, 64, undefined, undefined]);
  });

  it('keeps at most 2000 px on the long side and makes a WebP thumbnail of at most 320 px', async () => {
    const r = await lead.upload(uploadUrl(plantId), await makeImage('jpeg', { width: 3000, height: 1200 }));
    expect(r.status).toBe(201);
    expect(r.body.photo).toMatchObject({ width: 2000, height: 800 });
    const row = await rowOf(r.body.photo.id);
    const thumb = await sharp(readFileSync(path.join(photoDir, row.thumbName))).metadata();
    expect(thumb.format).toBe('webp');
    expect(Math.max(thumb.width!, thumb.height!)).toBe(320);
  });

  it('accepts PNG and WebP, keeps their format, and reads GPS from both', async () => {
    const gps = { lat: -41.2867611, lon: 174.7775 };
    for (const [format, mime, ext] of [
      ['png', 'image/png', 'png'],
      ['webp', 'image/webp', 'webp'],
    ] as const) {
      const r = await hand.upload(uploadUrl(plantId), await makeImage(format, { gps }), { name: `leaf.${ext}`, type: mime });
      expect(r.status, `${format}: ${JSON.stringify(r.body)}`).toBe(201);
      expect(Math.abs(r.body.gps.lat - gps.lat)).toBeLessThan(1e-5);
      expect(Math.abs(r.body.gps.lon - gps.lon)).toBeLessThan(1e-5);
      const row = await rowOf(r.body.photo.id);
      expect(row.mimeType).toBe(mime);
      expect(row.fileName.endsWith(`.${ext}`)).toBe(true);
      const stored = readFileSync(path.join(photoDir, row.fileName));
      const meta = await sharp(stored).metadata();
      expect(meta.format).toBe(format);
      expect(meta.exif).toBeUndefined();
      const thumb = await sharp(readFileSync(path.join(photoDir, row.thumbName))).metadata();
      expect(thumb.format).toBe('webp');
      expect(Math.max(thumb.width!, thumb.height!)).toBeLessThanOrEqual(320);
    }
  });

  it('judges the content, not the name: a WebP named .jpg is stored as WebP', async () => {
    const r = await lead.upload(uploadUrl(plantId), await makeImage('webp'), { name: 'photo.jpg', type: 'image/jpeg' });
    expect(r.status).toBe(201);
    expect((await rowOf(r.body.photo.id)).mimeType).toBe('image/webp');
  });

  it('lets a coordinator add photos to any farm', async () => {
    const r = await coordinator.upload(uploadUrl(watchPlantId), await makeImage('jpeg'));
    expect(r.status).toBe(201);
  });

  it('refuses 20 MB with 413, naming the field, and stores nothing', async () => {
    const before = await snapshot();
    const big = Buffer.alloc(20 * 1024 * 1024, 0xab);
    const r = await lead.upload(uploadUrl(plantId), big);
    expect(r.status).toBe(413);
    expect(r.body.error.code).toBe('file_too_large');
    expect(r.body.error.fields).toEqual({ photo: 'larger than 10 MB' });
    expect(await snapshot()).toEqual(before);
  });

  it('refuses a text file named .jpg and stores nothing', async () => {
    const before = await snapshot();
    const r = await lead.upload(uploadUrl(plantId), textFile(), { name: 'photo.jpg', type: 'image/jpeg' });
    expect(r.status).toBe(415);
    expect(r.body.error.fields).toEqual({ photo: 'not a JPEG, PNG or WebP image' });
    expect(await snapshot()).toEqual(before);
  });

  it('refuses a GIF: a real image, but not one of the three formats', async () => {
    const gif = await sharp({ create: { width: 8, height: 8, channels: 3, background: '#ccc' } }).gif().toBuffer();
    const r = await lead.upload(uploadUrl(plantId), gif, { name: 'photo.gif', type: 'image/gif' });
    expect(r.status).toBe(415);
    expect(r.body.error.fields.photo).toBe('not a JPEG, PNG or WebP image');
  });

  it('refuses a grower with no farm (403) and stores nothing', async () => {
    const before = await snapshot();
    const r = await grower.upload(uploadUrl(plantId), await makeImage('jpeg'));
    expect(r.status).toBe(403);
    expect(r.body.error.code).toBe('forbidden');
    expect(await snapshot()).toEqual(before);
  });

  it('answers 404 to a grower for a plant they may not see, and for no such plant', async () => {
    const before = await snapshot();
    expect((await grower.upload(uploadUrl(watchPlantId), await makeImage('jpeg'))).status).toBe(404);
    expect((await lead.upload(uploadUrl('00000000-0000-4000-8000-000000000000'), await makeImage('jpeg'))).status).toBe(404);
    expect((await lead.upload('/api/mother-plants/not-an-id/photos', await makeImage('jpeg'))).status).toBe(400);
    expect(await snapshot()).toEqual(before);
  });

  it('refuses a request without a file, and one signed out', async () => {
    const form = new FormData();
    form.append('caption', 'no photo here');
    const r = await fetch(new URL(uploadUrl(plantId), base.url), { method: 'POST', body: form });
    expect(r.status).toBe(401);
    const before = await snapshot();
    const noFile = await lead.send('POST', uploadUrl(plantId), form);
    expect(noFile.status).toBe(400);
    expect(noFile.body.error.fields).toEqual({ photo: 'no file was sent' });
    expect(await snapshot()).toEqual(before);
  });

  it('attaches a photo to a finding of this plant only', async () => {
    const before = await snapshot();
    const wrong = await lead.upload(uploadUrl(plantId), await makeImage('jpeg'), { fields: { findingId: otherFindingId } });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.fields).toEqual({ findingId: 'not a finding on this plant' });
    const bad = await lead.upload(uploadUrl(plantId), await makeImage('jpeg'), { fields: { findingId: 'nope' } });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.findingId).toBeDefined();
    expect(await snapshot()).toEqual(before);

    const ok = await hand.upload(uploadUrl(plantId), await makeImage('jpeg'), { fields: { findingId, caption: '' } });
    expect(ok.status).toBe(201);
    expect(ok.body.photo).toMatchObject({ findingId, caption: null });
  });
});

describe('read-gps', () => {
  it('reads position and date for any active member and stores nothing', async () => {
    const before = await snapshot();
    const gps = { lat: 52.2275, lon: -2.7365 };
    const r = await grower.upload('/api/photos/read-gps', await makeImage('jpeg', { gps, takenAt: '2025:03:01 12:00:00' }));
    expect(r.status).toBe(200);
    expect(Math.abs(r.body.gps.lat - gps.lat)).toBeLessThan(1e-5);
    expect(Math.abs(r.body.gps.lon - gps.lon)).toBeLessThan(1e-5);
    expect(r.body.takenAt).toBe('2025-03-01T12:00:00.000Z');
    const none = await grower.upload('/api/photos/read-gps', await makeImage('png'), { type: 'image/png', name: 'x.png' });
    expect(none.body).toEqual({ gps: null, takenAt: null });
    const text = await grower.upload('/api/photos/read-gps', textFile());
    expect(text.status).toBe(415);
    expect(text.body.error.fields).toEqual({ photo: 'not a JPEG, PNG or WebP image' });
    expect(await snapshot()).toEqual(before);
  });
});

describe('viewing and removing', () => {
  let plain: { id: string };
  let onWatch: { id: string };
  let ofFinding: { id: string };

  beforeAll(async () => {
    plain = (await lead.upload(uploadUrl(plantId), await makeImage('jpeg', { gps: { lat: 52, lon: -2.5 } }))).body.photo;
    onWatch = (await lead.upload(uploadUrl(watchPlantId), await makeImage('png'), { type: 'image/png', name: 'a.png' })).body.photo;
    ofFinding = (await lead.upload(uploadUrl(plantId), await makeImage('jpeg'), { fields: { findingId } })).body.photo;
  });

  it('streams the image and thumbnail with type, private caching and nosniff', async () => {
    const row = await rowOf(plain.id);
    const image = await lead.get(`/api/photos/${plain.id}/image`);
    expect(image.status).toBe(200);
    expect(image.headers.get('content-type')).toBe('image/jpeg');
    expect(image.headers.get('cache-control')).toBe('private, max-age=86400');
    expect(image.headers.get('x-content-type-options')).toBe('nosniff');
    expect(image.bytes.equals(readFileSync(path.join(photoDir, row.fileName)))).toBe(true);

    const thumb = await lead.get(`/api/photos/${plain.id}/thumb`);
    expect(thumb.status).toBe(200);
    expect(thumb.headers.get('content-type')).toBe('image/webp');
    expect(thumb.headers.get('cache-control')).toBe('private, max-age=86400');
    expect((await sharp(thumb.bytes).metadata()).format).toBe('webp');

    const png = await lead.get(`/api/photos/${onWatch.id}/image`);
    expect(png.headers.get('content-type')).toBe('image/png');
  });

  it('shows photos only to those who may see the plant, and finding photos only to its farm', async () => {
    // A clean plant is visible to every member, so its own photos are too.
    expect((await grower.get(`/api/photos/${plain.id}/image`)).status).toBe(200);
    expect((await grower.get(`/api/photos/${onWatch.id}/image`)).status).toBe(404);
    expect((await grower.get(`/api/photos/${onWatch.id}/thumb`)).status).toBe(404);
    expect((await grower.get(`/api/photos/${ofFinding.id}/image`)).status).toBe(404);
    expect((await hand.get(`/api/photos/${ofFinding.id}/image`)).status).toBe(200);
    expect((await coordinator.get(`/api/photos/${onWatch.id}/image`)).status).toBe(200);
    expect((await fetch(new URL(`/api/photos/${plain.id}/image`, base.url))).status).toBe(401);
    expect((await lead.get('/api/photos/00000000-0000-4000-8000-000000000000/image')).status).toBe(404);
  });

  it('lets only the farm remove a photo, and removes its files', async () => {
    const row = await rowOf(plain.id);
    const files = [path.join(photoDir, row.fileName), path.join(photoDir, row.thumbName)];
    expect(files.every((f) => existsSync(f))).toBe(true);

    expect((await grower.delete(`/api/photos/${plain.id}`)).status).toBe(403);
    expect((await grower.delete(`/api/photos/${onWatch.id}`)).status).toBe(404);
    expect(await rowOf(plain.id)).toBeDefined();

    const r = await lead.delete(`/api/photos/${plain.id}`);
    expect(r.status).toBe(204);
    expect(await rowOf(plain.id)).toBeUndefined();
    expect(files.some((f) => existsSync(f))).toBe(false);
    expect((await lead.get(`/api/photos/${plain.id}/image`)).status).toBe(404);
    expect((await lead.delete(`/api/photos/${plain.id}`)).status).toBe(404);
  });
});
