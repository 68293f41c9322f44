// Allocation rounds end to end on the demo cooperative: run, review, edit, approve, reserve,
// e-mail pickup slips over SMTP with calendar files, and no over-allocation under concurrency.
import ICAL from 'ical.js';
import { and, count, eq, inArray, ne, sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { allocationRounds, bundles, mailbox, seasons, woodOffers } from '../../server/db/schema/index.js';
import { Client } from '../fixtures/http.js';
import { startTestApp, type TestApp } from '../fixtures/test-app.js';

let app: TestApp;
const as: Record<'coordinator' | 'lead' | 'grower', Client> = {} as never;
let seasonId: string;
let roundId: string;

async function mailCount() {
  const [{ n }] = await app.ctx.db.select({ n: count() }).from(mailbox);
  return n;
}

/** Every offer: reserved never above offered, and equal to what approved bundles hold. */
async function assertReservations() {
  const rows = await app.ctx.db
    .select({
      id: woodOffers.id,
      offered: woodOffers.offered,
      reserved: woodOffers.reserved,
      held: sql<number>`coalesce((select sum(b.cuttings) from bundles b join allocation_rounds r on r.id = b.round_id where b.offer_id = wood_offers.id and r.status in ('approved','notified') and b.status <> 'cancelled'), 0)::int`,
    })
    .from(woodOffers)
    .where(eq(woodOffers.seasonId, seasonId));
  for (const r of rows) {
    expect(r.reserved).toBeLessThanOrEqual(r.offered);
    expect(r.reserved).toBe(r.held);
  }
}

beforeAll(async () => {
  app = await startTestApp({ seeded: true });
  for (const who of ['coordinator', 'lead', 'grower'] as const) {
    as[who] = new Client(app.url);
    await as[who].signIn(`${who}@heelwood.test`, 'heelwood-demo');
  }
  const list = (await as.coordinator.get('/api/seasons')).body.items as { id: string; stage: string }[];
  seasonId = list.find((s) => s.stage === 'requests_open')!.id;
});
afterAll(() => app?.close());

describe('an allocation round', () => {
  it('runs only while the season is allocating', async () => {
    const early = await as.coordinator.post(`/api/seasons/${seasonId}/rounds?wait=true`);
    expect(early.status).toBe(409);
    expect((await as.lead.post(`/api/seasons/${seasonId}/rounds?wait=true`)).status).toBe(403);
    const moved = await as.coordinator.post(`/api/seasons/${seasonId}/stage`, { stage: 'allocating' });
    expect(moved.body.stage).toBe('allocating');
  });

  it('proposes bundles within capacity, distance and compatibility, and explains every line', async () => {
    const r = await as.coordinator.post(`/api/seasons/${seasonId}/rounds?wait=true`);
    expect(r.status).toBe(202);
    roundId = r.body.id;
    const view = (await as.coordinator.get(`/api/rounds/${roundId}`)).body;
    expect(view.status).toBe('proposed');
    expect(view.bundles.length).toBeGreaterThan(0);
    expect(view.stats.optimal).toBe(true);
    for (const line of view.lines) {
      expect(line.allocated).toBeLessThanOrEqual(line.asked);
      for (const b of view.bundles.filter((x: { lineId: string }) => x.lineId === line.lineId)) {
        expect(b.distanceKm).toBeLessThanOrEqual(line.maxDistanceKm + 0.05);
        expect(b.plantStatus).toBe('clean');
      }
      expect(typeof line.reason).toBe('string');
    }
    const offered = new Map(
      (await app.ctx.db.select().from(woodOffers).where(eq(woodOffers.seasonId, seasonId))).map((o) => [o.id, o.offered - o.reserved]),
    );
    const used = new Map<string, number>();
    for (const b of view.bundles) used.set(b.offerId, (used.get(b.offerId) ?? 0) + b.cuttings);
    for (const [offerId, n] of used) expect(n).toBeLessThanOrEqual(offered.get(offerId)!);
    // Nothing is reserved before approval.
    await assertReservations();
  });

  it('checks hand edits live and keeps locked bundles on a re-run', async () => {
    const view = (await as.coordinator.get(`/api/rounds/${roundId}`)).body;
    const b = view.bundles[0];
    const tooMany = await as.coordinator.patch(`/api/rounds/${roundId}/bundles/${b.id}`, { cuttings: 100000 });
    expect(tooMany.status).toBe(400);
    expect(tooMany.body.error.fields.cuttings).toBeDefined();
    const smaller = Math.max(1, b.cuttings - 1);
    const ok = await as.coordinator.patch(`/api/rounds/${roundId}/bundles/${b.id}`, { cuttings: smaller });
    expect(ok.status).toBe(200);
    const rerun = await as.coordinator.post(`/api/rounds/${roundId}/rerun?wait=true`);
    expect(rerun.status).toBe(202);
    const kept = rerun.body.bundles.find((x: { id: string }) => x.id === b.id);
    expect(kept.cuttings).toBe(smaller);
    expect(kept.locked).toBe(true);
  });

  it('approves: reserves the wood, codes the bundles, e-mails every grower and farm once, with calendar files', async () => {
    const before = await mailCount();
    const view = (await as.coordinator.get(`/api/rounds/${roundId}`)).body;
    const growers = new Set(view.bundles.map((b: { growerId: string }) => b.growerId));
    const farms = new Set(view.bundles.map((b: { farmId: string }) => b.farmId));
    const r = await as.coordinator.post(`/api/rounds/${roundId}/approve`);
    expect(r.status).toBe(200);
    expect(r.body.mail.failed).toBe(0);
    expect(r.body.mail.sent).toBe(growers.size + farms.size);
    expect(r.body.round.status).toBe('notified');
    for (const b of r.body.round.bundles) expect(b.code).toMatch(/^B\d\d-\d{4}$/);
    await assertReservations();

    // The catcher received exactly those messages over SMTP.
    const until = Date.now() + 10_000;
    while ((await mailCount()) < before + growers.size + farms.size && Date.now() < until) await new Promise((res) => setTimeout(res, 100));
    const mails = await app.ctx.db.select().from(mailbox).where(sql`${mailbox.receivedAt} >= now() - interval '5 minutes'`);
    const slips = mails.filter((m) => m.subject.startsWith('Your Heelwood pickup slip'));
    expect(slips.length).toBe(growers.size);
    expect(mails.filter((m) => m.subject.startsWith('Heelwood collections at')).length).toBe(farms.size);
    expect(await mailCount()).toBe(before + growers.size + farms.size);

    // Each calendar file parses (ical.js) and has what RFC 5545 requires.
    let calendars = 0;
    for (const m of slips) {
      expect(m.textBody).toMatch(/Bundle B\d\d-\d{4}/);
      expect(m.textBody).toMatch(/phytosanitary|plant-health/i);
      for (const att of m.attachments.filter((a) => a.filename.endsWith('.ics'))) {
        calendars += 1;
        const text = Buffer.from(att.contentBase64, 'base64').toString('utf8');
        // RFC 5545 3.1: lines of at most 75 octets, folded with CRLF + space.
        for (const line of text.split('\r\n')) expect(Buffer.byteLength(line, 'utf8')).toBeLessThanOrEqual(75);
        const cal = new ICAL.Component(ICAL.parse(text));
        expect(cal.getFirstPropertyValue('version')).toBe('2.0');
        expect(cal.getFirstPropertyValue('prodid')).toBeTruthy();
        const events = cal.getAllSubcomponents('vevent');
        expect(events.length).toBeGreaterThan(0);
        for (const ev of events) {
          expect(ev.getFirstPropertyValue('uid')).toBeTruthy();
          expect(ev.getFirstPropertyValue('dtstamp')).toBeTruthy();
          expect(ev.getFirstPropertyValue('dtstart')).toBeTruthy();
          // DTEND or DURATION, not both (RFC 5545 3.6.1).
          expect(Number(ev.hasProperty('dtend')) + Number(ev.hasProperty('duration'))).toBe(1);
        }
      }
    }
    expect(calendars).toBeGreaterThan(0);
  });

  it('approving again sends nothing new', async () => {
    const before = await mailCount();
    const again = await as.coordinator.post(`/api/rounds/${roundId}/approve`);
    expect(again.status).toBe(409);
    const resend = await as.coordinator.post(`/api/rounds/${roundId}/resend`);
    expect(resend.body.mail.sent).toBe(0);
    await new Promise((res) => setTimeout(res, 300));
    expect(await mailCount()).toBe(before);
    await assertReservations();
  });

  it('shows the grower the slip and lets the farm mark collections', async () => {
    const [someBundle] = await app.ctx.db.select().from(bundles).where(eq(bundles.roundId, roundId)).limit(1);
    const growerClient = new Client(app.url);
    const [{ email }] = ((await app.ctx.db.execute(sql`select email from "user" where id = ${someBundle.growerId}`)) as unknown as { rows: { email: string }[] }).rows;
    await growerClient.signIn(email, 'heelwood-demo');
    const slip = (await growerClient.get(`/api/seasons/${seasonId}/my-pickups`)).body.slip;
    expect(slip.stops.length).toBeGreaterThan(0);
    expect(slip.visitingOrder.length).toBe(slip.stops.length);

    const leadClient = new Client(app.url);
    const [{ email: leadEmail }] = ((await app.ctx.db.execute(sql`select u.email from farm_memberships m join "user" u on u.id = m.user_id where m.farm_id = ${someBundle.farmId} and m.farm_role = 'lead' limit 1`)) as unknown as { rows: { email: string }[] }).rows;
    await leadClient.signIn(leadEmail, 'heelwood-demo');
    const list = (await leadClient.get(`/api/seasons/${seasonId}/farms/${someBundle.farmId}/collections`)).body.items;
    expect(list.map((x: { bundleId: string }) => x.bundleId)).toContain(someBundle.id);
    const mark = await leadClient.post(`/api/bundles/${someBundle.id}/collection`, { collected: true });
    expect(mark.status).toBe(200);
    expect(mark.body.status).toBe('collected');
    expect((await as.grower.post(`/api/bundles/${someBundle.id}/collection`, { collected: false })).status).toBe(403);
  });
});

describe('concurrency', () => {
  it('20 parallel approvals and edits on the same offers never exceed capacity', async () => {
    // A second round over what is left, then a burst of approvals, bundle edits and offer
    // changes at the same moment.
    await app.ctx.db.update(seasons).set({ stage: 'allocating' }).where(eq(seasons.id, seasonId));
    const started = await as.coordinator.post(`/api/seasons/${seasonId}/rounds?wait=true`);
    const second = started.body;
    if (second.bundles.length === 0) return; // nothing left to share: capacity trivially kept
    const targets = second.bundles.slice(0, 5);
    const calls: Promise<{ status: number }>[] = [];
    for (let i = 0; i < 10; i++) calls.push(as.coordinator.post(`/api/rounds/${second.id}/approve`));
    for (let i = 0; i < 10; i++) {
      const b = targets[i % targets.length];
      calls.push(as.coordinator.patch(`/api/rounds/${second.id}/bundles/${b.id}`, { cuttings: b.cuttings + 1 + i }));
    }
    const results = await Promise.all(calls);
    for (const r of results) expect([200, 400, 409]).toContain(r.status);
    expect(results.slice(0, 10).filter((r) => r.status === 200).length).toBe(1);
    await assertReservations();
    const approved = await app.ctx.db
      .select({ n: count() })
      .from(allocationRounds)
      .where(and(eq(allocationRounds.seasonId, seasonId), inArray(allocationRounds.status, ['approved', 'notified']), ne(allocationRounds.id, roundId)));
    expect(approved[0].n).toBe(1);
  });
});
