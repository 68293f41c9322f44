// The real server, killed with SIGKILL in the middle of approving an allocation round, then
// started again on the same data: the approval is all or nothing, nothing is over-reserved,
// the data opens, and the round can then be approved once. On PGlite (a fresh data dir with
// the demo seed written on first start) and, when TEST_DATABASE_URL is set, on PostgreSQL.
// HEELWOOD_TEST_APPROVAL_DELAY_MS (a test hook, refused in production) holds the approval
// open after its first writes, and the server prints a line when it gets there: the kill
// lands inside the transaction every time, not by luck of timing.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { sql } from 'drizzle-orm';
import { afterAll, describe, expect, inject, it } from 'vitest';
import { type Database, openDatabase } from '../../server/db/client.js';
import { Client } from '../fixtures/http.js';
import { databaseUrl, dropDatabase, freshName, recreateDatabase } from '../fixtures/pg.js';
import { ROOT, startServerProcess, type ServerProcess } from '../fixtures/server-process.js';

const migrationsFolder = path.join(ROOT, 'drizzle');
const COORDINATOR = ['coordinator@heelwood.test', 'heelwood-demo'] as const;

type Target = { name: string; env: Record<string, string>; open(): Promise<Database>; cleanup(): Promise<void> };

function pgliteTarget(): Target {
  const dataDir = mkdtempSync(path.join(tmpdir(), 'heelwood-durability-'));
  return {
    name: 'PGlite',
    env: { DATA_DIR: dataDir, SEED_DEMO: 'true' },
    open: () => openDatabase({ dataDir: path.join(dataDir, 'pglite'), migrationsFolder }),
    cleanup: async () => rmSync(dataDir, { recursive: true, force: true }),
  };
}

async function pgTarget(adminUrl: string, template: string): Promise<Target> {
  const name = freshName();
  await recreateDatabase(adminUrl, name, template);
  const url = databaseUrl(adminUrl, name);
  const dataDir = mkdtempSync(path.join(tmpdir(), 'heelwood-durability-'));
  return {
    name: 'PostgreSQL',
    env: { DATA_DIR: dataDir, DATABASE_URL: url, SEED_DEMO: 'true' },
    open: () => openDatabase({ databaseUrl: url, migrationsFolder }),
    cleanup: async () => {
      await dropDatabase(adminUrl, name);
      rmSync(dataDir, { recursive: true, force: true });
    },
  };
}

async function rows<T>(db: Database, query: ReturnType<typeof sql>): Promise<T[]> {
  return ((await db.db.execute(query)) as unknown as { rows: T[] }).rows;
}

/** What the database holds about one round, read with the server stopped. */
async function inspect(target: Target, roundId: string) {
  const database = await target.open();
  try {
    const [round] = await rows<{ status: string; approved_at: Date | null }>(database, sql`select status, approved_at from allocation_rounds where id = ${roundId}`);
    const bundles = await rows<{ code: string | null; status: string }>(database, sql`select code, status from bundles where round_id = ${roundId} and status <> 'cancelled'`);
    // Per offer: what is reserved, what approved bundles hold, what was offered.
    const offers = await rows<{ offered: number; reserved: number; held: number }>(
      database,
      sql`select o.offered, o.reserved,
                 coalesce(sum(b.cuttings) filter (where r.status in ('approved', 'notified') and b.status <> 'cancelled'), 0)::int as held
            from wood_offers o
            left join bundles b on b.offer_id = o.id
            left join allocation_rounds r on r.id = b.round_id
           group by o.id, o.offered, o.reserved`,
    );
    const [audit] = await rows<{ n: number }>(database, sql`select count(*)::int as n from audit_log where entity = 'allocation_round' and entity_id = ${roundId} and action = 'approve'`);
    const [dupes] = await rows<{ n: number }>(database, sql`select count(*)::int as n from (select code from bundles where code is not null group by code having count(*) > 1) d`);
    return { round, bundles, offers, approvals: audit.n, duplicateCodes: dupes.n };
  } finally {
    await database.close();
  }
}

type State = Awaited<ReturnType<typeof inspect>>;

/** All or nothing, and never more reserved than offered. */
function expectConsistent(s: State) {
  for (const o of s.offers) {
    expect(o.reserved).toBeLessThanOrEqual(o.offered);
    expect(o.reserved).toBe(o.held);
  }
  expect(s.duplicateCodes).toBe(0);
  if (s.round.status === 'approved' || s.round.status === 'notified') {
    for (const b of s.bundles) {
      expect(b.code).toMatch(/^B\d\d-\d{4}$/);
      expect(b.status).toBe('reserved');
    }
    expect(s.approvals).toBe(1);
  } else {
    expect(s.round.status).toBe('proposed');
    // A proposed bundle has no code yet (its status column already reads 'reserved' by default).
    for (const b of s.bundles) expect(b.code).toBeNull();
    expect(s.approvals).toBe(0);
    // Nothing from this round is reserved (held counts approved rounds only).
  }
}

async function signedIn(url: string) {
  const c = new Client(url);
  await c.signIn(...COORDINATOR);
  return c;
}

async function scenario(target: Target) {
  let server: ServerProcess | undefined;
  try {
    // 1. First start (demo seed), with the approval pause switched on.
    server = await startServerProcess({ ...target.env, HEELWOOD_TEST_APPROVAL_DELAY_MS: '120000' });
    let c = await signedIn(server.url);
    const seasons = (await c.get('/api/seasons')).body.items as { id: string; stage: string }[];
    const season = seasons.find((s) => s.stage === 'requests_open');
    expect(season, 'the demo has a season taking requests').toBeDefined();
    expect((await c.post(`/api/seasons/${season!.id}/stage`, { stage: 'allocating' })).status).toBe(200);
    const run = await c.post(`/api/seasons/${season!.id}/rounds?wait=true`);
    expect(run.status).toBe(202);
    const roundId: string = run.body.id;
    const proposed = (await c.get(`/api/rounds/${roundId}`)).body;
    expect(proposed.status).toBe('proposed');
    const bundleCount: number = proposed.bundles.length;
    expect(bundleCount).toBeGreaterThan(1);

    // 2. Approve, and kill the server once the approval is inside its transaction.
    const pending = c.post(`/api/rounds/${roundId}/approve`).then(
      (r) => ({ status: r.status }),
      (e: unknown) => ({ error: e }),
    );
    await server.waitFor(new RegExp(`approval of round ${roundId} paused inside its transaction`), 60_000);
    const killed = await server.kill('SIGKILL');
    expect(killed.signal).toBe('SIGKILL');
    const reply = await pending;
    expect('error' in reply, 'the approval never answered: the connection died with the server').toBe(true);

    // 3. The data opens without error and holds no part of the approval; what was committed
    // before (the proposal and its bundles) is all there.
    const afterKill = await inspect(target, roundId);
    expectConsistent(afterKill);
    expect(afterKill.round.status).toBe('proposed');
    expect(afterKill.bundles).toHaveLength(bundleCount);

    // 4. Start again on the same data (no pause): the round approves, once.
    server = await startServerProcess(target.env);
    if (target.name === 'PGlite') expect(server.output()).toMatch(/stopped without closing the database/);
    c = await signedIn(server.url);
    const approve = await c.post(`/api/rounds/${roundId}/approve`);
    expect(approve.status).toBe(200);
    expect(approve.body.round.status).toBe('notified');
    expect(approve.body.round.bundles).toHaveLength(bundleCount);
    const again = await c.post(`/api/rounds/${roundId}/approve`);
    expect(again.status).toBe(409);

    if (target.name === 'PGlite') {
      // A second server on the same data directory is refused while the first runs.
      const second = await startServerProcess(target.env, { ready: false });
      const end = await second.exited;
      expect(end.code).toBe(1);
      expect(second.output()).toMatch(/data directory is in use by the Heelwood server/);
    }

    const stopped = await server.kill('SIGTERM');
    expect(stopped.code).toBe(0);
    server = undefined;

    // 5. After a clean stop: approved in full, every bundle coded, reservations match.
    const final = await inspect(target, roundId);
    expectConsistent(final);
    expect(final.round.status).toBe('notified');
    expect(final.bundles).toHaveLength(bundleCount);
    expect(final.offers.reduce((s, o) => s + o.reserved, 0)).toBeGreaterThan(0);
  } finally {
    if (server) await server.kill('SIGKILL');
  }
}

const cleanups: Array<() => Promise<void>> = [];
afterAll(async () => {
  for (const c of cleanups) await c();
});

describe('a server killed in the middle of an approval', () => {
  it('PGlite: the approval is all or nothing and can be done once after restart', { timeout: 600_000 }, async () => {
    const target = pgliteTarget();
    cleanups.push(target.cleanup);
    await scenario(target);
  });

  const pg = inject('pgTemplates');
  it.skipIf(!pg)('PostgreSQL: the approval is all or nothing and can be done once after restart', { timeout: 600_000 }, async () => {
    const target = await pgTarget(pg!.adminUrl, pg!.seeded);
    cleanups.push(target.cleanup);
    await scenario(target);
  });
});
