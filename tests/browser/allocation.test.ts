// An allocation round in a browser, end to end: the coordinator moves a season to Allocating on
// its page, runs a round, reviews and edits it, approves it; the grower reads the pickup slip;
// the farm marks a bundle collected and prints labels; the Mailbox holds the pickup slip.
//
// Browser tests share one server and other files change the demo's open season (they file
// requests, move stages). So this file makes its own season through the API at the start:
// offers from a few farms, pickup windows, and filed requests from two demo growers. It ends
// with that season in Collections, where it no longer competes with the demo's open season.
import type { Page } from 'playwright-core';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import type { PickupSlip, RoundView } from '../../shared/schemas/allocation';
import type { FarmSummary } from '../../shared/schemas/farms';
import type { Species } from '../../shared/schemas/register';
import type { OfferRow, Season } from '../../shared/schemas/seasons';
import { Client } from '../fixtures/http';
import { baseURL, DEMO, DEMO_PASSWORD, foreignRequests, openBrowser, screenshot, settled, signIn, type BrowserSession } from './support/browser';

const open: BrowserSession[] = [];
async function browser(): Promise<BrowserSession> {
  const session = await openBrowser();
  open.push(session);
  return session;
}
afterEach(async () => {
  await Promise.all(open.splice(0).map((s) => s.close()));
});

/** Full-page screenshots at desktop width and at a phone's 390 px. */
async function shootBoth(page: Page, name: string): Promise<void> {
  await settled(page);
  await screenshot(page, `${name}-desktop`);
  await page.setViewportSize({ width: 390, height: 844 });
  await settled(page);
  await screenshot(page, `${name}-phone`);
  await page.setViewportSize({ width: 1280, height: 900 });
}

function ok<T>(reply: { status: number; body: T; text: string }, what: string, status = [200, 201, 202]): T {
  if (!status.includes(reply.status)) throw new Error(`${what}: HTTP ${reply.status} ${reply.text.slice(0, 400)}`);
  return reply.body;
}

const day = 24 * 3600_000;
const ymd = (d: Date) => d.toISOString().slice(0, 10);
const WITHINGTON = { lat: 52.0855, lon: -2.6385 };

type Fixture = { season: Season; grower: string; farmsOffering: string[] };
let fx: Fixture;
let coordinatorApi: Client;

beforeAll(async () => {
  const base = baseURL();
  coordinatorApi = new Client(base);
  await coordinatorApi.signIn(DEMO.coordinator, DEMO_PASSWORD);
  const stamp = Date.now().toString(36);
  const now = Date.now();

  // 1. A season of our own, in Planning.
  const season = ok(
    await coordinatorApi.post('/api/seasons', {
      name: `Round check ${stamp}`,
      kind: 'dormant_hardwood',
      hemisphere: 'north',
      requestDeadline: new Date(now + 2 * day).toISOString(),
      collectionStart: ymd(new Date(now + 4 * day)),
      collectionEnd: ymd(new Date(now + 40 * day)),
      lookbackMonths: 12,
      notes: 'Made by the browser test of allocation rounds.',
    }),
    'create season',
  ) as Season;

  // 2. Offers of blackcurrant and gooseberry from the three farms nearest the grower, with a window each.
  const farms = (ok(await coordinatorApi.get('/api/farms?page=1&pageSize=200'), 'farms') as { items: FarmSummary[] }).items;
  const near = [...farms].sort((a, b) => Math.hypot(a.lat - WITHINGTON.lat, a.lon - WITHINGTON.lon) - Math.hypot(b.lat - WITHINGTON.lat, b.lon - WITHINGTON.lon));
  const farmsOffering: string[] = [];
  for (const farm of near) {
    if (farmsOffering.length >= 3) break;
    const rows = (ok(await coordinatorApi.get(`/api/seasons/${season.id}/farms/${farm.id}/offers`), 'farm offers') as { items: OfferRow[] }).items;
    let offered = 0;
    for (const speciesName of ['Blackcurrant', 'Gooseberry']) {
      for (const row of rows.filter((r) => r.eligible && r.speciesName === speciesName).slice(0, 2)) {
        ok(await coordinatorApi.put(`/api/seasons/${season.id}/offers/${row.plantId}`, { directCount: 60 }), `offer ${row.code}`);
        offered += 1;
      }
    }
    if (!offered) continue;
    ok(await coordinatorApi.post(`/api/seasons/${season.id}/farms/${farm.id}/windows`, { date: ymd(new Date(now + 5 * day)), from: '09:30', to: '12:00', note: 'Park by the barn.' }), 'window');
    farmsOffering.push(farm.id);
  }
  expect(farmsOffering.length, 'some farm near Withington can offer blackcurrant or gooseberry').toBeGreaterThan(0);

  // 3. Requests open; two growers file. Figs are asked for but nobody offers them.
  ok(await coordinatorApi.post(`/api/seasons/${season.id}/stage`, { stage: 'requests_open' }), 'open requests');
  const species = (ok(await coordinatorApi.get('/api/species'), 'species') as { items: Species[] }).items;
  const id = (name: string) => species.find((s) => s.commonName === name)!.id;
  const line = (name: string, cuttings: number) => ({ speciesId: id(name), varietyId: null, cuttings, substitutesAllowed: false, treatment: 'hormone' });
  const file = async (email: string, at: { lat: number; lon: number; label: string }, lines: ReturnType<typeof line>[]) => {
    const who = new Client(base);
    await who.signIn(email, DEMO_PASSWORD);
    ok(
      await who.put(`/api/seasons/${season.id}/my-request`, { destinationLat: at.lat, destinationLon: at.lon, destinationLabel: at.label, maxDistanceKm: 45, notes: '', status: 'filed', lines }),
      `request of ${email}`,
    );
  };
  await file(DEMO.grower, { ...WITHINGTON, label: 'Lane hedge, Withington' }, [line('Blackcurrant', 60), line('Gooseberry', 30), line('Fig', 10)]);
  await file('joan.price@heelwood.test', { lat: 52.0565, lon: -2.6905, label: 'Tupsley allotment' }, [line('Blackcurrant', 150)]);

  fx = { season, grower: DEMO.grower, farmsOffering };
}, 120_000);

afterAll(async () => {
  // Leave the season where it no longer takes part in anyone's "current season".
  if (fx && coordinatorApi) await coordinatorApi.post(`/api/seasons/${fx.season.id}/stage`, { stage: 'collections' });
});

async function roundOf(page: Page, roundId: string): Promise<RoundView> {
  const res = await page.request.get(`/api/rounds/${roundId}`);
  expect(res.ok()).toBe(true);
  return (await res.json()) as RoundView;
}

describe('allocation round', () => {
  let roundId = '';

  it('the coordinator moves the season to Allocating, runs a round, reviews, edits and approves it', async () => {
    const { page, requests, pageErrors } = await browser();
    await signIn(page, DEMO.coordinator);
    const { season } = fx;

    // The season page moves the stage on (the stage buttons ask first).
    await page.goto(`/seasons/${season.id}`);
    await page.getByRole('heading', { name: season.name, level: 1 }).waitFor();
    await page.getByRole('button', { name: 'Close requests and start allocating' }).click();
    await page.getByRole('button', { name: 'Yes, close requests and start allocating' }).click();
    await expect.poll(async () => (await (await page.request.get(`/api/seasons/${season.id}`)).json()).stage).toBe('allocating');

    // To the rounds page: from the season page when it links there, else by its address.
    const link = page.getByRole('link', { name: /allocation rounds?/i }).first();
    if (await link.isVisible().catch(() => false)) await link.click();
    else await page.goto(`/seasons/${season.id}/rounds`);
    await page.getByRole('heading', { name: 'Allocation rounds', level: 1 }).waitFor();
    await settled(page);
    await shootBoth(page, 'allocation-rounds-list');

    await page.getByRole('button', { name: 'Run an allocation round' }).click();
    await page.waitForURL(/\/rounds\/[0-9a-f-]{36}$/);
    roundId = new URL(page.url()).pathname.split('/').pop()!;
    // The progress shows while the server solves (a small round may finish before a screenshot).
    const solving = await page
      .getByTestId('round-stage')
      .waitFor({ timeout: 3_000 })
      .then(() => true)
      .catch(() => false);
    if (solving) await screenshot(page, 'allocation-round-progress');

    await page.getByRole('heading', { name: 'Summary', level: 2 }).waitFor({ timeout: 90_000 });
    await settled(page);
    const view = await roundOf(page, roundId);
    expect(view.status).toBe('proposed');
    expect(view.bundles.length).toBeGreaterThan(0);
    await page.getByText('Lowest fill share').waitFor();
    // The fig line gets nothing, and the page says why in the product's words.
    const fig = page.getByTestId('request-line').filter({ hasText: 'Fig' }).filter({ hasText: 'Sam Okafor' });
    await fig.getByText('Nothing of this species is on offer').waitFor();
    await fig.getByText('0 % filled').waitFor();
    await page.evaluate(() => window.scrollTo(0, 0));
    await shootBoth(page, 'allocation-round-review');

    // Edit a bundle in place: the server checks it and locks it.
    const target = view.bundles.find((b) => b.cuttings > 1)!;
    const box = page.getByRole('spinbutton', { name: `Cuttings from ${target.plantCode} for ${target.growerName}` });
    await box.fill(String(target.cuttings - 1));
    const row = page.getByTestId('bundle-row').filter({ has: box });
    await row.getByRole('button', { name: 'Save' }).click();
    await row.getByText('Locked').waitFor();
    const edited = (await roundOf(page, roundId)).bundles.find((b) => b.id === target.id)!;
    expect(edited).toMatchObject({ cuttings: target.cuttings - 1, locked: true });
    await row.scrollIntoViewIfNeeded();
    await screenshot(page, 'allocation-round-edited');

    // Approve: the dialog says what will happen, in numbers.
    await page.getByRole('button', { name: 'Approve and send pickup slips' }).first().click();
    const dialog = page.getByRole('dialog', { name: 'Approve and send pickup slips?' });
    const growers = new Set(view.bundles.map((b) => b.growerId)).size;
    const farms = new Set(view.bundles.map((b) => b.farmId)).size;
    await dialog.getByText(new RegExp(`e-mail a pickup slip to ${growers} growers?`)).waitFor();
    await dialog.getByText(new RegExp(`e-mail a collection list to ${farms} farms?`)).waitFor();
    await screenshot(page, 'allocation-round-approve-dialog');
    await dialog.getByRole('button', { name: 'Yes, approve and send' }).click();
    await page.getByText('Round approved').waitFor({ timeout: 60_000 });
    const log = page.getByRole('table', { name: 'E-mails sent for this round' });
    await log.waitFor();
    await expect.poll(async () => (await roundOf(page, roundId)).status).toBe('notified');
    const approved = await roundOf(page, roundId);
    expect(approved.emails.filter((e) => e.kind === 'pickup_slip').length).toBe(growers);
    for (const b of approved.bundles) expect(b.code).toMatch(/^B\d\d-\d{4}$/);
    await settled(page);
    await shootBoth(page, 'allocation-round-approved');

    expect(foreignRequests(requests)).toEqual([]);
    expect(pageErrors).toEqual([]);
  });

  it('the grower finds the pickup slip from the home page, farms in visiting order, printable', async () => {
    expect(roundId, 'the round was approved in the test before').not.toBe('');
    const { page, requests, pageErrors } = await browser();
    await signIn(page, fx.grower);
    const { season } = fx;

    const card = page.getByRole('region', { name: 'Wood to collect' });
    await card.waitFor();
    await settled(page);
    await screenshot(page, 'allocation-grower-home');
    await card.getByRole('listitem').filter({ hasText: season.name }).getByRole('link', { name: 'My pickups' }).click();
    await page.waitForURL(`**/seasons/${season.id}/pickups`);
    await page.getByRole('heading', { name: 'Pickup slip', level: 1 }).waitFor();
    await settled(page);

    const { slip } = (await (await page.request.get(`/api/seasons/${season.id}/my-pickups`)).json()) as { slip: PickupSlip };
    expect(slip.stops.length).toBeGreaterThan(0);
    const stops = page.getByRole('list', { name: 'Farms in visiting order' }).getByTestId('slip-stop');
    await expect.poll(() => stops.count()).toBe(slip.stops.length);
    const names = await stops.locator('h2').allTextContents();
    expect(names.map((n) => n.replace(/^\d+Stop \d+: /, ''))).toEqual(slip.stops.map((s) => s.farmName));
    for (const b of slip.stops.flatMap((s) => s.bundles)) await page.getByText(b.code!, { exact: true }).filter({ visible: true }).first().waitFor();
    await page.getByRole('heading', { name: 'Handling and safety' }).waitFor();
    await page.getByText(/Rooting hormone: wear gloves/).waitFor();
    await page.getByRole('button', { name: 'Print the slip' }).waitFor();
    await shootBoth(page, 'allocation-pickup-slip');

    // On paper: no app header or buttons, black on white; one A4 page for this slip.
    await page.emulateMedia({ media: 'print' });
    expect(await page.getByRole('button', { name: 'Print the slip' }).isVisible()).toBe(false);
    await screenshot(page, 'allocation-pickup-slip-print');
    const pdf = await page.pdf({ format: 'A4', printBackground: true });
    const pages = (pdf.toString('latin1').match(/\/Type\s*\/Page[^s]/g) ?? []).length;
    expect(pages).toBeGreaterThan(0);
    expect(pages).toBeLessThanOrEqual(2);
    await page.emulateMedia({ media: 'screen' });

    expect(foreignRequests(requests)).toEqual([]);
    expect(pageErrors).toEqual([]);
  });

  it('the farm marks a bundle collected and prints bundle labels; the Mailbox holds the pickup slip', async () => {
    expect(roundId).not.toBe('');
    const { page, requests, pageErrors } = await browser();
    await signIn(page, DEMO.coordinator);
    const { season } = fx;
    const view = await roundOf(page, roundId);
    const bundle = view.bundles.find((b) => b.growerName === 'Sam Okafor') ?? view.bundles[0];

    await page.goto(`/seasons/${season.id}/collections?farmId=${bundle.farmId}`);
    await page.getByRole('heading', { name: `Collections at ${bundle.farmName}`, level: 1 }).waitFor();
    await settled(page);
    const item = page.getByTestId('collection-bundle').filter({ hasText: bundle.code! });
    await item.getByRole('button', { name: /as collected$/ }).click();
    await item.getByText('Collected', { exact: true }).waitFor();
    await item.getByRole('button', { name: /as not collected$/ }).waitFor();
    const after = await roundOf(page, roundId);
    expect(after.bundles.find((b) => b.id === bundle.id)!.status).toBe('collected');
    await shootBoth(page, 'allocation-farm-collections');

    await page.getByRole('link', { name: 'Print bundle labels' }).click();
    await page.waitForURL(`**/seasons/${season.id}/collections/labels?farmId=${bundle.farmId}`);
    const labels = page.getByTestId('bundle-label');
    const expected = view.bundles.filter((b) => b.farmId === bundle.farmId).length;
    await expect.poll(() => labels.count()).toBe(expected);
    await expect.poll(() => page.locator('img[alt^="QR code"]').count()).toBe(expected);
    // The QR code opens the source plant's page when the plant is known.
    await page.locator(`img[alt="QR code opening the page of plant ${bundle.plantCode}"]`).first().waitFor();
    await page.getByRole('button', { name: 'Print labels' }).waitFor();
    await shootBoth(page, 'allocation-bundle-labels');
    await page.emulateMedia({ media: 'print' });
    await screenshot(page, 'allocation-bundle-labels-print');
    await page.emulateMedia({ media: 'screen' });

    await page.goto('/mailbox');
    await page.getByRole('heading', { name: 'Mailbox' }).first().waitFor();
    // The grower's slip, opened: bundle codes and the handling cautions are in the text.
    const slipMail = page.getByRole('button', { name: new RegExp(`Your Heelwood pickup slip: ${season.name}.*grower@heelwood\\.test`) });
    await slipMail.click();
    await page.getByText(/Bundle B\d\d-\d{4}: \d+ cuttings/).first().waitFor();
    await settled(page);
    await screenshot(page, 'allocation-mailbox');

    expect(foreignRequests(requests)).toEqual([]);
    expect(pageErrors).toEqual([]);
  });
});
