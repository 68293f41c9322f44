// Migrations apply once and again without harm; the demo seed is written once only.
import { count, sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seedIfEmpty } from '../../server/db/first-start.js';
import { motherPlants, user } from '../../server/db/schema/index.js';
import { Client } from '../fixtures/http.js';
import { startTestApp, type TestApp } from '../fixtures/test-app.js';

let app: TestApp;
beforeAll(async () => {
  app = await startTestApp({ seeded: true });
});
afterAll(() => app?.close());

describe('start-up', () => {
  it('runs the migrations again without change', async () => {
    const tables = async () =>
      (await app.ctx.db.execute(sql`select count(*)::int as n from information_schema.tables where table_schema = 'public'`)) as unknown as {
        rows: { n: number }[];
      };
    const before = (await tables()).rows[0].n;
    await app.ctx.database.migrate();
    await app.ctx.database.migrate();
    expect((await tables()).rows[0].n).toBe(before);
  });

  it('does not seed over existing data', async () => {
    const [u1] = await app.ctx.db.select({ n: count() }).from(user);
    const [p1] = await app.ctx.db.select({ n: count() }).from(motherPlants);
    const outcome = await seedIfEmpty(app.ctx.db);
    expect(outcome.seeded).toBe(false);
    const [u2] = await app.ctx.db.select({ n: count() }).from(user);
    const [p2] = await app.ctx.db.select({ n: count() }).from(motherPlants);
    expect(u2.n).toBe(u1.n);
    expect(p2.n).toBe(p1.n);
  });

  it('signs in every demo person with the demo password', async () => {
    for (const email of ['coordinator@heelwood.test', 'lead@heelwood.test', 'hand@heelwood.test', 'grower@heelwood.test']) {
      const c = new Client(app.url);
      await c.signIn(email, 'heelwood-demo');
      const me = await c.get('/api/me');
      expect(me.status).toBe(200);
      expect(me.body.user.status).toBe('active');
    }
    const lead = new Client(app.url);
    await lead.signIn('lead@heelwood.test', 'heelwood-demo');
    expect((await lead.get('/api/me')).body.farms[0].farmRole).toBe('lead');
  });

  it('serves the public cooperative name', async () => {
    const r = await new Client(app.url).get('/api/cooperative');
    expect(r.status).toBe(200);
    expect(r.body.name.length).toBeGreaterThan(3);
    expect(r.body.hemisphere).toBe('north');
  });
});
