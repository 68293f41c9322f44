// The read cache (server/lib/read-cache.ts): answers kept per database snapshot, caller and
// address. What must hold: nobody ever gets an answer older than what was committed before
// they asked, callers never share answers, a suspension takes effect on the next request.
import { eq, sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { motherPlants, user } from '../../server/db/schema/index.js';
import { CLOCK_BUCKET_MS, newer, readCacheOf } from '../../server/lib/read-cache.js';
import { Client } from '../fixtures/http.js';
import { startTestApp, type TestApp } from '../fixtures/test-app.js';
import { makeUser } from '../fixtures/users.js';

type PlantItem = { id: string; code: string; farmId: string; healthStatus: string };
type PlantList = { items: PlantItem[]; total: number };

let app: TestApp;
const as: Record<'coordinator' | 'lead' | 'grower', Client> = {} as never;
let ownPlant: PlantItem;

beforeAll(async () => {
  app = await startTestApp({ seeded: true });
  for (const who of ['coordinator', 'lead', 'grower'] as const) {
    as[who] = new Client(app.url);
    await as[who].signIn(`${who}@heelwood.test`, 'heelwood-demo');
  }
  const leadFarmId = (await as.lead.get('/api/me')).body.farms[0].farmId;
  const list = (await as.lead.get<PlantList>(`/api/mother-plants?page=1&pageSize=25&farmId=${leadFarmId}`)).body;
  ownPlant = list.items.find((p) => p.farmId === leadFarmId)!;
  expect(ownPlant).toBeDefined();
});
afterAll(() => app?.close());

const stats = () => readCacheOf(app.ctx.db).stats();
const notesOf = async (c: Client, id: string) => {
  const r = await c.get(`/api/mother-plants/${id}`);
  expect(r.status).toBe(200);
  return r.body.notes as string;
};

describe('answers are kept while the database is unchanged', () => {
  it('a second identical read is served from the cache, with the same body', async () => {
    const path = '/api/mother-plants?page=1&pageSize=25&sort=code&dir=asc';
    const first = await as.coordinator.get(path);
    const before = stats();
    const second = await as.coordinator.get(path);
    const after = stats();
    expect(second.status).toBe(200);
    expect(second.text).toBe(first.text);
    expect(after.answerHits - before.answerHits).toBe(1);
    expect(after.answerMisses - before.answerMisses).toBe(0);
    // The caller (findActor) is kept too: the second request looked nobody up.
    expect(after.actorMisses - before.actorMisses).toBe(0);
  });

  it('answers 304 to a caller holding the same answer, and 200 with a new ETag after any commit', async () => {
    const path = `/api/mother-plants/${ownPlant.id}`;
    const first = await as.lead.get(path);
    const etag = first.headers.get('etag')!;
    expect(etag).toMatch(/^W\/"/);
    const revalidate = { 'if-none-match': etag, 'cache-control': 'max-age=0' };
    expect((await as.lead.request('GET', path, undefined, { headers: revalidate })).status).toBe(304);
    await app.ctx.db.update(motherPlants).set({ notes: 'etag check' }).where(eq(motherPlants.id, ownPlant.id));
    const changed = await as.lead.request('GET', path, undefined, { headers: revalidate });
    expect(changed.status).toBe(200);
    expect(changed.headers.get('etag')).not.toBe(etag);
    expect(changed.body.notes).toBe('etag check');
  });
});

describe('nobody gets an answer older than what was committed before they asked', () => {
  it('a change written straight to the database, past every route, shows on the next request', async () => {
    await notesOf(as.lead, ownPlant.id);
    await notesOf(as.lead, ownPlant.id);
    await app.ctx.db.update(motherPlants).set({ notes: 'written past the routes' }).where(eq(motherPlants.id, ownPlant.id));
    expect(await notesOf(as.lead, ownPlant.id)).toBe('written past the routes');
  });

  it('a change through a route shows on the same caller’s next read', async () => {
    for (const note of ['first edit', 'second edit', 'third edit']) {
      const r = await as.lead.patch(`/api/mother-plants/${ownPlant.id}`, { notes: note });
      expect(r.status).toBe(200);
      expect(await notesOf(as.lead, ownPlant.id)).toBe(note);
      expect(await notesOf(as.coordinator, ownPlant.id)).toBe(note);
    }
  });

  it('under concurrent writes, every read is at least as new as the last write finished before it was sent', async () => {
    // A writer commits notes "w1", "w2", … one after another, straight to the database, while
    // readers fire overlapping requests. For each read, the newest write whose commit had
    // returned before the request was sent is its floor: the answer must be that one or newer.
    const WRITES = 40;
    let committed = 0;
    const writer = (async () => {
      for (let k = 1; k <= WRITES; k++) {
        await app.ctx.db.update(motherPlants).set({ notes: `w${k}` }).where(eq(motherPlants.id, ownPlant.id));
        committed = k;
        await new Promise((r) => setTimeout(r, Math.random() * 4));
      }
    })();
    const reads: Promise<{ floor: number; got: number }>[] = [];
    const readers = ['coordinator', 'lead', 'coordinator', 'lead', 'coordinator'] as const;
    let i = 0;
    while (committed < WRITES) {
      const floor = committed;
      const who = as[readers[i++ % readers.length]];
      reads.push(notesOf(who, ownPlant.id).then((n) => ({ floor, got: /^w\d+$/.test(n) ? Number(n.slice(1)) : 0 })));
      await new Promise((r) => setTimeout(r, Math.random() * 3));
    }
    await writer;
    const results = await Promise.all(reads);
    expect(results.length).toBeGreaterThan(20);
    const stale = results.filter((r) => r.got < r.floor);
    expect(stale).toEqual([]);
    // After the last write, every caller reads the last value.
    expect(await notesOf(as.lead, ownPlant.id)).toBe(`w${WRITES}`);
    expect(await notesOf(as.coordinator, ownPlant.id)).toBe(`w${WRITES}`);
  });
});

describe('callers never share answers', () => {
  it('the same address answers each caller with what that caller may see', async () => {
    const path = '/api/mother-plants?page=1&pageSize=100&status=hold';
    const coordinator = (await as.coordinator.get<PlantList>(path)).body;
    const grower = (await as.grower.get<PlantList>(path)).body;
    // The demo register has plants on hold; a grower with no farm sees none of them.
    expect(coordinator.total).toBeGreaterThan(0);
    expect(grower.items.every((p) => coordinator.items.some((c) => c.id === p.id))).toBe(true);
    expect(grower.total).toBeLessThan(coordinator.total);
    const me = await as.grower.get('/api/me');
    expect(me.body.user.email).toBe('grower@heelwood.test');
    expect((await as.lead.get('/api/me')).body.user.email).toBe('lead@heelwood.test');
  });

  it('a member suspended while signed in is refused on the next request', async () => {
    const m = await makeUser(app);
    expect((await m.client.get('/api/me')).status).toBe(200);
    expect((await m.client.get('/api/seasons')).status).toBe(200);
    await app.ctx.db.update(user).set({ status: 'suspended' }).where(eq(user.id, m.id));
    expect((await m.client.get('/api/me')).status).toBe(401);
    expect((await m.client.get('/api/seasons')).status).toBe(401);
  });
});

describe('answers that depend on the date', () => {
  it('are rebuilt once the clock has moved on by a bucket, even with nothing written', async () => {
    const path = '/api/health/overview';
    await as.coordinator.get(path);
    const before = stats();
    await as.coordinator.get(path);
    expect(stats().answerHits - before.answerHits).toBe(1);
    const now = Date.now();
    const spy = vi.spyOn(Date, 'now').mockReturnValue(now + CLOCK_BUCKET_MS);
    try {
      const missesBefore = stats().answerMisses;
      expect((await as.coordinator.get(path)).status).toBe(200);
      expect(stats().answerMisses - missesBefore).toBe(1);
    } finally {
      spy.mockRestore();
    }
  });
});

describe('snapshot order (newer)', () => {
  // Text of PostgreSQL's pg_current_snapshot(): xmin:xmax:in-progress ids
  // (PostgreSQL 16 documentation, 9.27.5 "Transaction ID and Snapshot Information Functions").
  it('a larger xmax is newer; at the same xmax, fewer transactions in progress is newer', () => {
    expect(newer('754:754:', '753:753:')).toBe(true);
    expect(newer('753:753:', '754:754:')).toBe(false);
    expect(newer('750:755:751', '750:755:751,753')).toBe(true);
    expect(newer('750:755:751,753', '750:755:751')).toBe(false);
    expect(newer('753:753:', '753:753:')).toBe(false);
    expect(newer('753:753:', '')).toBe(true);
  });

  it('an embedded database is followed by its notifications, a server by its snapshots', () => {
    expect(readCacheOf(app.ctx.db).mode).toBe(app.ctx.database.kind === 'pglite' ? 'notify' : 'snapshot');
  });

  it('every table notifies its changes (a table added without the trigger would be cached forever)', async () => {
    const result = (await app.ctx.db.execute(sql`
      select t.tablename as name,
             exists (select 1 from pg_trigger g join pg_class c on c.oid = g.tgrelid
                     join pg_namespace n on n.oid = c.relnamespace
                     join pg_proc p on p.oid = g.tgfoid
                     where n.nspname = 'public' and c.relname = t.tablename and p.proname = 'notify_data_changed') as notifies
      from pg_tables t where t.schemaname = 'public' order by 1`)) as unknown as { rows: { name: string; notifies: boolean }[] };
    expect(result.rows.length).toBeGreaterThan(20);
    expect(result.rows.filter((r) => !r.notifies).map((r) => r.name)).toEqual([]);
  });

  it('the database gives a new text after every commit and the same text when nothing committed', async () => {
    const cache = readCacheOf(app.ctx.db);
    const a = await cache.snapshot();
    expect(await cache.snapshot()).toBe(a);
    await app.ctx.db.update(motherPlants).set({ notes: 'moves the snapshot' }).where(eq(motherPlants.id, ownPlant.id));
    const b = await cache.snapshot();
    expect(b).not.toBe(a);
    expect(newer(b, a)).toBe(true);
  });
});
