// Walks the authorization matrix (authz-matrix.table.ts): every route against every kind of
// caller on a copy of the demo cooperative. Each cell checks the status; every refusal also
// checks that nothing changed (every table's rows, and the photo folder).
// The first block fails when the app has a route the table does not list, so a new route
// cannot ship without its row.
import { readdirSync } from 'node:fs';
import path from 'node:path';
import { and, asc, desc, eq, is, sql } from 'drizzle-orm';
import { getTableConfig, PgTable } from 'drizzle-orm/pg-core';
import type { Express } from 'express';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app.js';
import * as schema from '../../server/db/schema/index.js';
import {
  allocationRounds,
  bundles,
  farmMemberships,
  farms,
  findings,
  inspections,
  mailbox,
  motherPlants,
  pests,
  pickupWindows,
  requestLines,
  seasons,
  settings,
  species,
  strikeReports,
  user,
  varieties,
  woodOffers,
  woodRequests,
} from '../../server/db/schema/index.js';
import { Client } from '../fixtures/http.js';
import { makeImage } from '../fixtures/images.js';
import { joinFarm } from '../fixtures/register.js';
import { startTestApp, type TestApp } from '../fixtures/test-app.js';
import { makeUser, TEST_PASSWORD } from '../fixtures/users.js';
import {
  CALLERS,
  type Call,
  type CallerKind,
  EXCLUDED_AUTH_ENDPOINTS,
  EXCLUDED_ROUTES,
  type Exchange,
  type ExchangeOptions,
  type Fx,
  MATRIX,
  type MatrixRow,
} from './authz-matrix.table.js';

// The demo's people (server/db/seed/demo-data.ts, PEOPLE) and their password.
const DEMO_PASSWORD = 'heelwood-demo';
const DEMO_EMAILS: Record<Exclude<CallerKind, 'anon' | 'suspended'>, string> = {
  pending: 'chris.hallam@heelwood.test',
  member: 'grower@heelwood.test',
  otherLead: 'megan.pritchard@heelwood.test',
  hand: 'hand@heelwood.test',
  lead: 'lead@heelwood.test',
  coordinator: 'coordinator@heelwood.test',
};
const ACTIVE: CallerKind[] = ['member', 'otherLead', 'hand', 'lead', 'coordinator'];

let app: TestApp;
let fx: Fx;
const clients = new Map<CallerKind, Client>();
const userIds = new Map<CallerKind, string>();
const spareSuspended: Client[] = [];

// Route discovery ----------------------------------------------------------------------------

type Layer = {
  route?: { path: string; methods: Record<string, boolean> };
  handle?: { stack?: Layer[] };
  rawPath?: unknown;
};

/** "METHOD /path" for every route of the Express app, mount paths included. */
function walkRoutes(express: Express): string[] {
  const out: string[] = [];
  const join = (prefix: string, p: string) => {
    const full = `${prefix}${p}`.replace(/\/+$/, '');
    return full === '' ? '/' : full;
  };
  const walk = (stack: Layer[], prefix: string) => {
    for (const layer of stack) {
      if (layer.route) {
        const methods = Object.keys(layer.route.methods).filter((m) => layer.route!.methods[m]);
        // app.all() marks every method Node knows; call it ALL.
        const list = methods.includes('_all') || methods.length > 20 ? ['ALL'] : methods.map((m) => m.toUpperCase());
        for (const m of list) out.push(`${m} ${join(prefix, layer.route.path)}`);
      } else if (layer.handle?.stack) {
        if (typeof layer.rawPath !== 'string') throw new Error(`router mounted on a non-string path: ${String(layer.rawPath)}`);
        walk(layer.handle.stack, layer.rawPath === '/' ? prefix : join(prefix, layer.rawPath));
      }
    }
  };
  walk((express as unknown as { router: { stack: Layer[] } }).router.stack, '');
  return [...new Set(out)].sort();
}

type AuthEndpoint = { path?: string; options?: { method?: string | string[]; metadata?: { SERVER_ONLY?: boolean } } };

/** better-auth endpoints reachable over HTTP: path → methods. */
function authEndpoints(): Map<string, string[]> {
  const out = new Map<string, string[]>();
  for (const e of Object.values(app.ctx.auth.api) as AuthEndpoint[]) {
    if (!e?.path || e.options?.metadata?.SERVER_ONLY) continue;
    const m = e.options?.method ?? 'GET';
    out.set(e.path, Array.isArray(m) ? m : [m]);
  }
  return out;
}

const rowKey = (r: MatrixRow) => `${r.method} ${r.path}`;
const rowName = (r: MatrixRow) => `${rowKey(r)}${r.target ? ` [${r.target}]` : ''}`;

// Snapshots -----------------------------------------------------------------------------------

const TABLES = (Object.values(schema) as unknown[])
  .filter((t): t is PgTable => is(t, PgTable))
  .map((t) => getTableConfig(t).name)
  .sort();

/**
 * Per table: the row count and the sum of its rows' xmin (the transaction that wrote each row
 * version), so any committed insert, update or delete shows, even one that keeps the count;
 * plus the number of files in the photo folder. (Four times cheaper than hashing row text.)
 */
async function snapshot(): Promise<Map<string, string>> {
  const query = TABLES.map((t) => `select '${t}' as t, count(*)::text || ':' || coalesce(sum(x.xmin::text::bigint), 0)::text as v from "${t}" x`).join(
    ' union all ',
  );
  const result = (await app.ctx.db.execute(sql.raw(query))) as unknown as { rows: { t: string; v: string }[] };
  const snap = new Map(result.rows.map((r) => [r.t, r.v]));
  let files: string[] = [];
  try {
    files = readdirSync(path.join(app.ctx.config.dataDir, 'photos'));
  } catch {
    /* no photo folder yet */
  }
  snap.set('(photo files)', String(files.length));
  return snap;
}

function changes(before: Map<string, string>, after: Map<string, string>): string[] {
  return [...before.keys()].filter((k) => before.get(k) !== after.get(k)).map((k) => `${k}: ${before.get(k)} -> ${after.get(k)}`);
}

// Requests --------------------------------------------------------------------------------------

function urlOf(pattern: string, call: Call): string {
  const p = pattern.replace(/:([A-Za-z_]\w*)/g, (_m, name: string) => {
    const v = call.params?.[name];
    if (v === undefined) throw new Error(`no value for :${name} in ${pattern}`);
    return encodeURIComponent(v);
  });
  const q = call.query ? `?${new URLSearchParams(call.query).toString()}` : '';
  return `${p}${q}`;
}

async function clientFor(caller: CallerKind, session: Call['session']): Promise<Client> {
  const main = clients.get(caller)!;
  if (session === 'clone') return main.clone();
  if (session === 'spare') {
    if (caller === 'anon') return new Client(app.url);
    if (caller === 'suspended') {
      const c = spareSuspended.pop();
      if (!c) throw new Error('no spare session of the suspended member left');
      return c;
    }
    const c = new Client(app.url);
    await c.signIn(DEMO_EMAILS[caller], DEMO_PASSWORD);
    return c;
  }
  return main;
}

// Fixtures ----------------------------------------------------------------------------------------

async function buildFixtures(): Promise<Fx> {
  const db = app.ctx.db;
  const coordinator = clients.get('coordinator')!;
  let n = 0;
  const tag = () => `${Date.now().toString(36)}${(n++).toString(36)}`;
  /** Letters only, so plant codes never move the farm's next automatic number. */
  const letters = (i: number) => {
    let s = '';
    do {
      s = String.fromCharCode(65 + (i % 26)) + s;
      i = Math.floor(i / 26) - 1;
    } while (i >= 0);
    return s;
  };
  let plantNo = 0;
  const today = new Date().toISOString().slice(0, 10);
  const daysAgo = (d: number) => new Date(Date.now() - d * 86_400_000);

  const [wth] = await db.select().from(farms).where(eq(farms.code, 'WTH'));
  const [arb] = await db.select().from(farms).where(eq(farms.code, 'ARB'));
  const [blackcurrant] = await db.select().from(species).where(eq(species.commonName, 'Blackcurrant'));
  const [variety] = await db.select().from(varieties).where(eq(varieties.speciesId, blackcurrant.id)).orderBy(asc(varieties.name)).limit(1);
  const [demoPlant] = await db
    .select()
    .from(motherPlants)
    .where(and(eq(motherPlants.farmId, wth.id), eq(motherPlants.healthStatus, 'clean')))
    .orderBy(asc(motherPlants.code))
    .limit(1);
  const [openSeason] = await db.select().from(seasons).where(eq(seasons.stage, 'requests_open')).limit(1);
  const [closedSeason] = await db.select().from(seasons).where(eq(seasons.stage, 'closed')).orderBy(desc(seasons.collectionStart)).limit(1);
  const [approvedRound] = await db.select().from(allocationRounds).where(eq(allocationRounds.seasonId, closedSeason.id)).limit(1);
  const [travelling] = await db.select().from(pests).where(eq(pests.travelsInWood, true)).orderBy(asc(pests.code)).limit(1);
  const [minorPest] = await db.select().from(pests).where(eq(pests.travelsInWood, false)).orderBy(asc(pests.code)).limit(1);
  for (const [what, v] of Object.entries({ wth, arb, blackcurrant, variety, demoPlant, openSeason, closedSeason, approvedRound, travelling, minorPest })) {
    if (!v) throw new Error(`demo data: ${what} not found`);
  }
  const farmOf = { wth, arb };

  async function freshPlant(opts: { status?: 'clean' | 'hold'; farm?: 'wth' | 'arb' } = {}) {
    const farm = farmOf[opts.farm ?? 'wth'];
    const [row] = await db
      .insert(motherPlants)
      .values({
        code: `${farm.code}-MX${letters(plantNo++)}`,
        farmId: farm.id,
        speciesId: blackcurrant.id,
        plantingYear: 2020,
        role: 'stock_bed',
        provenance: 'bought',
        healthStatus: opts.status ?? 'clean',
        lastInspectedOn: today,
        lat: farm.lat,
        lon: farm.lon,
      })
      .returning();
    return row.id;
  }

  async function freshUser(status: 'pending' | 'active') {
    const t = tag();
    const [row] = await db
      .insert(user)
      .values({ id: `matrix-${t}`, name: `Matrix Person ${t}`, email: `matrix-${t}@example.org`, role: 'member', status })
      .returning();
    return row.id;
  }

  async function addFinding(plantId: string, pestId: string) {
    const [i] = await db.insert(inspections).values({ plantId, inspectedOn: today, inspectorId: userIds.get('coordinator')!, notes: 'Matrix' }).returning();
    const [f] = await db.insert(findings).values({ inspectionId: i.id, pestId, severity: 'minor', notes: 'Matrix' }).returning();
    return f.id;
  }

  async function uploadPhoto(plantId: string, findingId?: string) {
    const form = new FormData();
    form.append('photo', new Blob([new Uint8Array(await makeImage('jpeg'))], { type: 'image/jpeg' }), 'leaf.jpg');
    if (findingId) form.append('findingId', findingId);
    const r = await coordinator.request('POST', `/api/mother-plants/${plantId}/photos`, undefined, { form });
    if (r.status !== 201) throw new Error(`photo upload failed: ${r.status} ${r.text}`);
    return (r.body as { photo: { id: string } }).photo.id;
  }

  async function uploadReportPhoto(reportId: string) {
    const form = new FormData();
    form.append('photo', new Blob([new Uint8Array(await makeImage('jpeg'))], { type: 'image/jpeg' }), 'cuttings.jpg');
    const r = await clients.get('member')!.request('POST', `/api/strike-reports/${reportId}/photos`, undefined, { form });
    if (r.status !== 201) throw new Error(`strike-report photo upload failed: ${r.status} ${r.text}`);
    return (r.body as { photo: { id: string } }).photo.id;
  }

  async function insertSeason(stage: 'planning' | 'allocating' | 'collections') {
    const [row] = await db
      .insert(seasons)
      .values({
        name: `Matrix season ${tag()}`,
        kind: 'dormant_hardwood',
        hemisphere: 'north',
        stage,
        requestDeadline: daysAgo(20),
        collectionStart: daysAgo(15).toISOString().slice(0, 10),
        collectionEnd: new Date(Date.now() + 60 * 86_400_000).toISOString().slice(0, 10),
        lookbackMonths: 12,
        createdBy: userIds.get('coordinator')!,
      })
      .returning();
    return row.id;
  }

  async function filedLine(seasonId: string, growerId: string) {
    const [req] = await db
      .insert(woodRequests)
      .values({ seasonId, growerId, status: 'filed', destinationLat: 51.99, destinationLon: -2.5, maxDistanceKm: 50 })
      .returning();
    const [line] = await db.insert(requestLines).values({ requestId: req.id, speciesId: blackcurrant.id, cuttings: 20 }).returning();
    return line.id;
  }

  async function exchange(opts: ExchangeOptions): Promise<Exchange> {
    const seasonId = await insertSeason(opts.stage);
    const plantId = await freshPlant();
    const cuttings = 20;
    const approved = opts.round === 'approved';
    const [offer] = await db
      .insert(woodOffers)
      .values({ seasonId, plantId, directCount: 100, estimatedYield: 100, capFraction: 0.9, offered: 50, reserved: approved ? cuttings : 0, createdBy: userIds.get('lead')! })
      .returning();
    const growerId = userIds.get(opts.grower ?? 'member')!;
    const lineId = await filedLine(seasonId, growerId);
    const spareLineId = await filedLine(seasonId, userIds.get('lead')!);
    let roundId = '';
    let bundleId = '';
    if (opts.round !== 'none') {
      const [round] = await db
        .insert(allocationRounds)
        .values({
          seasonId,
          number: 1,
          status: approved ? 'approved' : 'proposed',
          createdBy: userIds.get('coordinator')!,
          ...(approved ? { approvedBy: userIds.get('coordinator')!, approvedAt: daysAgo(12) } : {}),
        })
        .returning();
      roundId = round.id;
      const collected = opts.bundle === 'collected';
      const [b] = await db
        .insert(bundles)
        .values({
          roundId,
          offerId: offer.id,
          lineId,
          plantId,
          farmId: wth.id,
          growerId,
          cuttings,
          code: approved ? `MX-${tag().toUpperCase()}` : null,
          status: collected ? 'collected' : 'reserved',
          collectedAt: collected ? daysAgo(10) : null,
        })
        .returning();
      bundleId = b.id;
      if (opts.rooted !== undefined) {
        await db.insert(strikeReports).values({ bundleId, reporterId: growerId, stuck: cuttings, rooted: opts.rooted, assessedOn: today, treatment: 'none' });
      }
    }
    return { seasonId, plantId, offerId: offer.id, lineId, spareLineId, roundId, bundleId };
  }

  const shared = new Map<string, Promise<unknown>>();
  const once = <T,>(key: string, make: () => Promise<T>): Promise<T> => {
    if (!shared.has(key)) shared.set(key, make());
    return shared.get(key) as Promise<T>;
  };

  /** On its own bundle when for photos, so photo rows do not use up the cuttings the filing row reports on. */
  async function freshStrikeReport(bundle: 'reporting' | 'photos' = 'reporting') {
    const x = await once(bundle, () => exchange({ stage: 'collections', round: 'approved', bundle: 'collected', grower: 'member' }));
    const [r] = await db
      .insert(strikeReports)
      .values({ bundleId: x.bundleId, reporterId: userIds.get('member')!, stuck: 1, rooted: 1, assessedOn: today, treatment: 'none' })
      .returning();
    return r.id;
  }

  const heldPlant = await freshPlant({ status: 'hold' });
  const eligiblePlant = await freshPlant();
  const travellingPlant = await freshPlant({ status: 'hold' });
  await addFinding(travellingPlant, travelling.id);
  const photo = await uploadPhoto(demoPlant.id);
  const findingPhoto = await uploadPhoto(demoPlant.id, await addFinding(demoPlant.id, minorPest.id));
  const reportPhoto = await uploadReportPhoto(await freshStrikeReport('photos'));
  const attachment = Buffer.from('Pickup slip for the matrix.\n');
  const [mail] = await db
    .insert(mailbox)
    .values({
      fromAddress: 'heelwood@localhost',
      toAddresses: ['grower@heelwood.test'],
      subject: 'Matrix message',
      textBody: 'See the attachment.',
      attachments: [{ filename: 'slip.txt', contentType: 'text/plain', size: attachment.length, contentBase64: attachment.toString('base64') }],
      sizeBytes: 200,
    })
    .returning();

  return {
    ids: {
      wth: wth.id,
      arb: arb.id,
      plant: demoPlant.id,
      heldPlant,
      eligiblePlant,
      travellingPlant,
      species: blackcurrant.id,
      variety: variety.id,
      openSeason: openSeason.id,
      closedSeason: closedSeason.id,
      approvedRound: approvedRound.id,
      photo,
      findingPhoto,
      reportPhoto,
      mail: mail.id,
    },
    userId: (kind) => userIds.get(kind)!,
    tag,
    windowDate: openSeason.collectionStart,
    today,
    freshPlant,
    freshUser,
    async freshWthHand() {
      const id = await freshUser('active');
      await db.insert(farmMemberships).values({ farmId: wth.id, userId: id, farmRole: 'hand' });
      return id;
    },
    freshSeason: (stage) => insertSeason(stage),
    async freshOffer() {
      const plantId = await freshPlant();
      await db
        .insert(woodOffers)
        .values({ seasonId: openSeason.id, plantId, directCount: 40, estimatedYield: 40, capFraction: 0.9, offered: 10, createdBy: userIds.get('lead')! });
      return { seasonId: openSeason.id, plantId };
    },
    async freshWindow() {
      const start = new Date(`${openSeason.collectionStart}T10:00:00Z`);
      const [w] = await db
        .insert(pickupWindows)
        .values({ seasonId: openSeason.id, farmId: wth.id, startsAt: start, endsAt: new Date(start.getTime() + 2 * 3_600_000), note: 'Matrix' })
        .returning();
      return w.id;
    },
    freshPhoto: () => uploadPhoto(demoPlant.id),
    freshStrikeReport,
    freshReportPhoto: async () => uploadReportPhoto(await freshStrikeReport('photos')),
    async ensureRequest(kind) {
      if (!ACTIVE.includes(kind)) return;
      await db
        .insert(woodRequests)
        .values({ seasonId: openSeason.id, growerId: userIds.get(kind)!, status: 'filed', destinationLat: 51.99, destinationLon: -2.5, maxDistanceKm: 30 })
        .onConflictDoUpdate({ target: [woodRequests.seasonId, woodRequests.growerId], set: { status: 'filed' } });
    },
    exchange,
    once,
  };
}

// Setup ------------------------------------------------------------------------------------------

beforeAll(async () => {
  app = await startTestApp({ seeded: true });
  clients.set('anon', new Client(app.url));
  for (const [kind, email] of Object.entries(DEMO_EMAILS) as [CallerKind, string][]) {
    const c = new Client(app.url);
    await c.signIn(email, DEMO_PASSWORD);
    clients.set(kind, c);
    const [u] = await app.ctx.db.select({ id: user.id }).from(user).where(eq(user.email, email));
    userIds.set(kind, u.id);
  }
  // A lead of WTH, signed in (twice: one session is kept for the sign-out row), then
  // suspended by the coordinator through the API.
  const s = await makeUser(app, { name: 'Suspended Lead' });
  await joinFarm(app, s.id, (await app.ctx.db.select().from(farms).where(eq(farms.code, 'WTH')))[0].id, 'lead');
  const spare = new Client(app.url);
  await spare.signIn(s.email, TEST_PASSWORD);
  spareSuspended.push(spare);
  const r = await clients.get('coordinator')!.patch(`/api/members/${s.id}`, { status: 'suspended', reason: 'authorization matrix' });
  if (r.status !== 200) throw new Error(`suspending failed: ${r.status} ${r.text}`);
  clients.set('suspended', s.client);
  userIds.set('suspended', s.id);
  fx = await buildFixtures();
}, 120_000);

afterAll(() => app?.close());

// Coverage -----------------------------------------------------------------------------------------

describe('the matrix lists every route', () => {
  it('has a row (or a stated exclusion) for every route of the Express app', async () => {
    const routes = walkRoutes(await createApp(app.ctx));
    const rows = new Set(MATRIX.map(rowKey));
    const missing = routes.filter((r) => !rows.has(r) && !(r in EXCLUDED_ROUTES));
    expect(missing, 'add these routes to tests/integration/authz-matrix.table.ts').toEqual([]);
    const staleExclusions = Object.keys(EXCLUDED_ROUTES).filter((r) => !routes.includes(r));
    expect(staleExclusions).toEqual([]);
    // Rows must name real routes: an Express route, or a better-auth endpoint under /api/auth.
    const auth = authEndpoints();
    const unknown = MATRIX.filter((row) => {
      if (routes.includes(rowKey(row))) return false;
      const ep = row.path.startsWith('/api/auth/') ? auth.get(row.path.slice('/api/auth'.length)) : undefined;
      return !ep?.includes(row.method);
    }).map(rowKey);
    expect(unknown, 'rows that match no route').toEqual([]);
    const cells = MATRIX.length * CALLERS.length;
    console.log(
      `[authz-matrix] ${routes.length} Express routes (${Object.keys(EXCLUDED_ROUTES).length} excluded), ` +
        `${new Set(MATRIX.map(rowKey)).size} routes in ${MATRIX.length} rows, ${CALLERS.length} caller kinds, ${cells} cells`,
    );
  });

  it('snapshots notice a change that keeps every row count (so the refusal checks can fail)', async () => {
    const before = await snapshot();
    await app.ctx.db.update(settings).set({ updatedAt: new Date() }).where(eq(settings.key, 'cooperative'));
    expect(changes(before, await snapshot())).toEqual([expect.stringMatching(/^settings: /)]);
  });

  it('has a row (or a stated exclusion) for every better-auth endpoint', () => {
    const auth = authEndpoints();
    const rows = new Set(MATRIX.filter((r) => r.path.startsWith('/api/auth/')).map((r) => r.path.slice('/api/auth'.length)));
    const missing = [...auth.keys()].filter((p) => !rows.has(p) && !(p in EXCLUDED_AUTH_ENDPOINTS));
    expect(missing, 'add a row or an exclusion with a reason in authz-matrix.table.ts').toEqual([]);
    const stale = Object.keys(EXCLUDED_AUTH_ENDPOINTS).filter((p) => !auth.has(p));
    expect(stale).toEqual([]);
  });
});

// The matrix ---------------------------------------------------------------------------------------

for (const row of MATRIX) {
  describe(rowName(row), () => {
    for (const caller of CALLERS) {
      const expected = row.expect[caller];
      it(`${caller} ${expected}`, async () => {
        const call: Call = row.call ? await row.call(fx, caller) : {};
        const client = await clientFor(caller, call.session);
        const url = urlOf(row.path, call);
        const refusal = expected >= 400;
        const before = refusal ? await snapshot() : undefined;
        const form = call.form ? await call.form() : undefined;
        const body = row.method === 'GET' ? undefined : form ? undefined : call.body;
        const r = await client.request(row.method, url, body, form ? { form } : {});
        const said = `${caller}: ${row.method} ${url} answered ${r.status} ${r.text.slice(0, 300)}`;
        // Soft, so that a wrongly allowed write also reports what it changed.
        expect.soft(r.status, said).toBe(expected);
        if (r.status === expected) {
          // The refusal is the one the row means, not a mistake in the request or a missing route.
          if (expected === 401) expect(r.text, said).toMatch(/"code":"(unauthenticated|UNAUTHORIZED)"/);
          if (expected === 403) expect(r.text, said).toMatch(/"code":"forbidden"/);
          if (expected === 404) expect(r.text, said).not.toMatch(/No such API route/);
          const says = row.says?.[expected];
          if (says) expect(r.text, said).toMatch(says);
        }
        if (before) {
          expect(changes(before, await snapshot()), `${caller}: the refused ${row.method} ${url} changed data`).toEqual([]);
        }
      });
    }
  });
}
