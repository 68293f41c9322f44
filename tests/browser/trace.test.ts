// Trace, exposure notices and season figures in a browser. The coordinator traces a plant of
// the demo's four-generation lineage from its page; opens the demo's plant on hold whose wood
// went out after its last clean inspection, traces it, reads what may carry the finding, sends
// the growers a plant-health notice (once: a second send e-mails nobody) and reads it in the
// Mailbox. Then the season figures: charts drawn, tables beside them, the CSV downloads; a
// member sees their own figures.
//
// Expected values come from plain record reads (plant pages' parent and children, bundles via
// the API), not from the trace endpoint the page draws.
import AxeBuilder from '@axe-core/playwright';
import { readFileSync } from 'node:fs';
import type { Page } from 'playwright-core';
import { afterEach, beforeAll, describe, expect, it } from 'vitest';
import { LINEAGE_ROOT_CODE } from '../../server/db/seed/demo-data';
import type { Page as ListPage } from '../../shared/schemas/common';
import type { SeasonFigures } from '../../shared/schemas/figures';
import type { MailMessage } from '../../shared/schemas/mail';
import type { PlantDetail, PlantListItem } from '../../shared/schemas/register';
import type { Season } from '../../shared/schemas/seasons';
import type { Exposure } from '../../shared/schemas/trace';
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
  // Wide tables scroll inside their own frame; the page itself never scrolls sideways.
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
  await screenshot(page, `${name}-phone`);
  await page.setViewportSize({ width: 1280, height: 900 });
}

/** Serious and critical axe-core findings on the page as it stands, one line each. */
async function axeBlocking(page: Page): Promise<string[]> {
  const result = await new AxeBuilder({ page }).analyze();
  return result.violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map((v) => `${v.id}: ${v.help} (${v.nodes.map((n) => n.target.join(' ')).join(', ')})`);
}

function ok<T>(reply: { status: number; body: T; text: string }, what: string): T {
  if (reply.status !== 200) throw new Error(`${what}: HTTP ${reply.status} ${reply.text.slice(0, 400)}`);
  return reply.body;
}

let api: Client;

async function plantByCode(code: string): Promise<PlantListItem> {
  const list = ok(await api.get<ListPage<PlantListItem>>(`/api/mother-plants?q=${encodeURIComponent(code)}&pageSize=20`), `find ${code}`);
  const plant = list.items.find((p) => p.code === code);
  if (!plant) throw new Error(`no plant ${code} in the demo`);
  return plant;
}

async function plantDetail(id: string): Promise<PlantDetail> {
  return ok(await api.get<PlantDetail>(`/api/mother-plants/${id}`), `plant ${id}`);
}

/** Ancestors by the parent links, nearest first, read plant by plant. */
async function ancestorsOf(id: string): Promise<PlantDetail[]> {
  const out: PlantDetail[] = [];
  for (let at = await plantDetail(id); at.parent; ) {
    at = await plantDetail(at.parent.id);
    out.push(at);
  }
  return out;
}

/** Descendants by the children lists, with their generation. */
async function descendantsOf(id: string): Promise<Map<string, { code: string; generation: number }>> {
  const seen = new Map<string, { code: string; generation: number }>();
  let frontier = (await plantDetail(id)).children;
  for (let generation = 1; frontier.length; generation++) {
    const next: PlantDetail['children'] = [];
    for (const child of frontier) {
      if (seen.has(child.id) || child.id === id) continue;
      seen.set(child.id, { code: child.code, generation });
      next.push(...(await plantDetail(child.id)).children);
    }
    frontier = next;
  }
  return seen;
}

async function mailTotal(): Promise<number> {
  return ok(await api.get<ListPage<MailMessage>>('/api/mail?page=1&pageSize=1'), 'mail').total;
}

beforeAll(async () => {
  api = new Client(baseURL());
  await api.signIn(DEMO.coordinator, DEMO_PASSWORD);
});

describe('trace', () => {
  it('the coordinator traces a plant of the lineage from its page: ancestors, descendants and the bundles between them', async () => {
    // A plant in the middle of the lineage: two generations above it and at least one below.
    const root = await plantByCode(LINEAGE_ROOT_CODE);
    const all = await descendantsOf(root.id);
    const [middleId] = [...all.entries()].find(([, d]) => d.generation === 2) ?? [];
    expect(middleId, 'the demo lineage has a second generation').toBeDefined();
    const middle = await plantDetail(middleId!);
    const up = await ancestorsOf(middle.id);
    const down = await descendantsOf(middle.id);
    expect(up.map((p) => p.code).at(-1)).toBe(LINEAGE_ROOT_CODE);
    expect(down.size).toBeGreaterThan(0);

    const { page, requests, pageErrors } = await browser();
    await signIn(page, DEMO.coordinator);
    await page.goto(`/plants/${middle.id}`);
    await page.getByRole('heading', { name: middle.code, level: 1 }).waitFor();
    await page.getByRole('link', { name: 'Trace', exact: true }).click();
    await page.waitForURL(`**/plants/${middle.id}/trace`);
    await page.getByRole('heading', { name: `Trace of ${middle.code}`, level: 1 }).waitFor();
    await settled(page);

    // The tree: every ancestor and descendant, each a link to its page, with its generation in words.
    const tree = page.getByRole('list', { name: `Lineage of ${middle.code}` });
    const words = ['Parent', 'Grandparent', 'Great-grandparent'];
    for (const [i, a] of up.entries()) {
      const card = tree.getByTestId('trace-node').filter({ has: page.getByRole('link', { name: a.code, exact: true }) });
      await expect.poll(() => card.getAttribute('data-generation')).toBe(String(-(i + 1)));
      await card.getByText(words[i], { exact: true }).waitFor();
    }
    for (const [id, d] of down) {
      expect(await tree.getByRole('link', { name: d.code, exact: true }).getAttribute('href')).toBe(`/plants/${id}`);
      const card = tree.getByTestId('trace-node').filter({ has: page.getByRole('link', { name: d.code, exact: true }) });
      expect(await card.getAttribute('data-generation')).toBe(String(d.generation));
      // The bundle that connects it to its parent, by its code.
      const source = (await plantDetail(id)).sourceBundle;
      if (source?.code) await card.getByText(source.code, { exact: true }).waitFor();
    }
    await tree.getByTestId('trace-node').filter({ hasText: 'This plant' }).getByText(middle.code, { exact: true }).waitFor();
    // Nothing else is in the tree.
    expect(await tree.getByTestId('trace-node').count()).toBe(up.length + 1 + down.size);

    // The table: one row per plant, oldest generation first.
    const table = page.getByRole('table', { name: `Plants in the trace of ${middle.code}` });
    const rows = table.getByTestId('trace-row');
    expect(await rows.count()).toBe(up.length + 1 + down.size);
    expect((await rows.first().locator('td').nth(1).textContent())?.trim()).toBe(up.at(-1)!.code);

    // Bundles: every bundle a descendant came as is listed.
    const bundleTable = page.getByRole('table', { name: `Bundles from ${middle.code} and its descendants` });
    for (const id of down.keys()) {
      const code = (await plantDetail(id)).sourceBundle?.code;
      if (code) await bundleTable.getByRole('cell', { name: code, exact: true }).waitFor();
    }
    await shootBoth(page, 'trace-lineage');
    expect(await axeBlocking(page)).toEqual([]);

    // A descendant's link opens its page.
    const [firstId, first] = [...down.entries()][0];
    await tree.getByRole('link', { name: first.code, exact: true }).click();
    await page.waitForURL(`**/plants/${firstId}`);
    await page.getByRole('heading', { name: first.code, level: 1 }).waitFor();

    expect(foreignRequests(requests)).toEqual([]);
    expect(pageErrors).toEqual([]);
  });

  it('the coordinator opens the exposure of a plant on hold, e-mails its growers once, and reads the notice in the Mailbox', async () => {
    // The demo's plant on hold whose wood went out after its last clean inspection and was raised on.
    const held = ok(await api.get<ListPage<PlantListItem>>('/api/mother-plants?status=hold&pageSize=100'), 'plants on hold').items;
    let target: { plant: PlantListItem; exposure: Exposure } | undefined;
    for (const plant of held) {
      const exposure = ok(await api.get<Exposure>(`/api/mother-plants/${plant.id}/exposure`), `exposure of ${plant.code}`);
      if (exposure.growers.length > 0 && exposure.plants.length > 0) {
        target = { plant, exposure };
        break;
      }
    }
    expect(target, 'the demo has a plant on hold whose wood was raised on').toBeDefined();
    const { plant, exposure } = target!;
    const due = exposure.growers.filter((g) => !g.notified);
    expect(due.length, 'nobody has had this notice yet on a fresh demo').toBe(exposure.growers.length);
    const down = await descendantsOf(plant.id);
    const up = await ancestorsOf(plant.id);
    const pest = exposure.finding!.pest.name;

    const { page, requests, pageErrors } = await browser();
    await signIn(page, DEMO.coordinator);

    // The health view leads to the exposure of each plant on hold.
    await page.goto('/health');
    const attention = page.getByRole('table', { name: 'Plants that need attention' });
    const exposureLink = attention.getByRole('link', { name: `Exposure and notices of ${plant.code}` });
    expect(await exposureLink.getAttribute('href')).toBe(`/plants/${plant.id}/exposure`);

    // From the plant page: trace it first.
    await page.goto(`/plants/${plant.id}`);
    await page.getByRole('heading', { name: plant.code, level: 1 }).waitFor();
    await page.getByRole('link', { name: 'Trace', exact: true }).click();
    await page.getByRole('heading', { name: `Trace of ${plant.code}`, level: 1 }).waitFor();
    const tree = page.getByRole('list', { name: `Lineage of ${plant.code}` });
    for (const a of up) await tree.getByRole('link', { name: a.code, exact: true }).waitFor();
    for (const d of down.values()) await tree.getByRole('link', { name: d.code, exact: true }).waitFor();
    expect(await tree.getByTestId('trace-node').count()).toBe(up.length + 1 + down.size);
    await page.getByText('This plant is on hold').waitFor();
    await settled(page);
    await screenshot(page, 'trace-held-plant');

    // The exposure: the finding, the wood since the last clean inspection, who got it.
    await page.getByRole('link', { name: 'Exposure and notices' }).click();
    await page.waitForURL(`**/plants/${plant.id}/exposure`);
    await page.getByRole('heading', { name: `What may carry ${pest}`, level: 1 }).waitFor();
    const bundles = page.getByRole('table', { name: 'Bundles collected since the last clean inspection' }).getByTestId('exposed-bundle');
    await expect.poll(() => bundles.count()).toBe(exposure.bundles.length);
    for (const b of exposure.bundles) await bundles.filter({ hasText: b.code! }).filter({ hasText: b.growerName }).waitFor();
    for (const p of exposure.plants) await page.getByTestId('exposed-plant').getByRole('link', { name: p.code, exact: true }).waitFor();
    const growers = page.getByTestId('exposed-grower');
    await expect.poll(() => growers.count()).toBe(exposure.growers.length);
    for (const g of exposure.growers) await growers.filter({ hasText: g.email }).getByText('Not notified yet').waitFor();
    await shootBoth(page, 'trace-exposure');
    expect(await axeBlocking(page)).toEqual([]);

    // The notice: prefilled, edited, confirmed, sent.
    const stamp = `Browser check ${Date.now().toString(36)}`;
    const note = page.getByLabel(/Note from the coordinator/);
    expect(await note.inputValue()).toMatch(/local plant-health authority/);
    await note.fill(`${await note.inputValue()}\n${stamp}`);
    const mailBefore = await mailTotal();
    await page.getByRole('button', { name: 'Review and send the notice' }).click();
    const dialog = page.getByRole('dialog', { name: 'Send the plant-health notice?' });
    for (const g of due) await dialog.getByText(g.email, { exact: false }).waitFor();
    await screenshot(page, 'trace-notice-confirm');
    await dialog.getByRole('button', { name: 'Yes, send the notice' }).click();
    await page.getByText(`Notice sent to ${due.length} grower${due.length === 1 ? '' : 's'}`).waitFor({ timeout: 30_000 });
    expect(await page.getByTestId('notice-outcome').textContent()).toMatch(new RegExp(`^Sent now: ${due.length}\\.`));
    for (const g of exposure.growers) await growers.filter({ hasText: g.email }).getByText('Notice sent').waitFor();
    await expect.poll(mailTotal, { timeout: 15_000 }).toBe(mailBefore + due.length);
    await settled(page);
    await screenshot(page, 'trace-notice-sent');

    // The Mailbox holds each grower's notice, with the note and the advice.
    await page.goto('/mailbox');
    await page.getByRole('heading', { name: 'Mailbox' }).first().waitFor();
    const subject = `Plant-health notice: ${pest} on a plant your wood came from`;
    for (const g of due) await page.getByRole('button', { name: new RegExp(`${subject}.*${g.email.replace(/[.]/g, '\\.')}`) }).waitFor();
    await page.getByRole('button', { name: new RegExp(`${subject}.*${due[0].email.replace(/[.]/g, '\\.')}`) }).click();
    await page.getByText(stamp).first().waitFor();
    await page.getByText(/Contact your local plant-health authority/).first().waitFor();
    await page.getByText(/What to look for:/).first().waitFor();
    await settled(page);
    await screenshot(page, 'trace-notice-mailbox');

    // Sending again e-mails nobody, and the page says so with the server's numbers.
    await page.goto(`/plants/${plant.id}/exposure`);
    await page.getByText(`Every one of the ${exposure.growers.length} growers has had this notice`).waitFor();
    await page.getByRole('button', { name: 'Review and send the notice' }).click();
    await dialog.getByText(/nobody will be e-mailed again/).waitFor();
    await dialog.getByRole('button', { name: 'Yes, send the notice' }).click();
    await page.getByText('Nothing new was sent').waitFor({ timeout: 30_000 });
    expect(await page.getByTestId('notice-outcome').textContent()).toMatch(/already had this notice for this finding/);
    await new Promise((r) => setTimeout(r, 1_000));
    expect(await mailTotal()).toBe(mailBefore + due.length);
    await settled(page);
    await screenshot(page, 'trace-notice-again');

    expect(foreignRequests(requests)).toEqual([]);
    expect(pageErrors).toEqual([]);
  });
});

describe('season figures', () => {
  it('the coordinator opens a season’s figures from its page: charts with tables, and a CSV download', async () => {
    const seasons = ok(await api.get<{ items: Season[] }>('/api/seasons'), 'seasons').items;
    const season = [...seasons].filter((s) => s.stage === 'closed').sort((a, b) => b.collectionStart.localeCompare(a.collectionStart))[0];
    expect(season, 'the demo has a closed season').toBeDefined();

    const { page, requests, pageErrors } = await browser();
    await signIn(page, DEMO.coordinator);
    await settled(page);
    // The chart library is not part of the first load.
    expect(requests.filter((u) => /season-figures-route|recharts/.test(u))).toEqual([]);

    await page.goto(`/seasons/${season.id}`);
    await page.getByRole('heading', { name: season.name, level: 1 }).waitFor();
    await page.getByRole('link', { name: /Season figures/ }).click();
    await page.waitForURL(`**/figures/${season.id}`);
    await page.getByRole('heading', { name: `Cooperative figures: ${season.name}`, level: 1 }).waitFor();
    await page.getByText(/The whole cooperative's figures/).waitFor();
    expect(requests.some((u) => /season-figures-route/.test(u))).toBe(true);

    // Four charts, each drawn (an SVG with bars) inside a captioned figure.
    const charts = page.getByTestId('chart');
    await expect.poll(() => charts.count()).toBe(4);
    for (let i = 0; i < 4; i++) {
      const chart = charts.nth(i);
      expect((await chart.locator('figcaption').textContent())!.length).toBeGreaterThan(20);
      await expect.poll(() => chart.locator('.recharts-bar-rectangle').count()).toBeGreaterThan(0);
    }
    // The table beside the wood chart agrees with the server's totals.
    const figures = ok(await api.get<SeasonFigures>(`/api/seasons/${season.id}/figures`), 'figures');
    const allRow = page.getByRole('table', { name: 'Cuttings by species' }).getByRole('row').filter({ hasText: 'All species' });
    expect(await allRow.getByRole('cell').first().textContent()).toBe(figures.totals.offered.toLocaleString('en'));
    await shootBoth(page, 'figures-season');
    expect(await axeBlocking(page)).toEqual([]);

    // The CSV: a link the browser downloads, served as text/csv.
    const link = page.getByRole('link', { name: 'Download the figures (CSV)' });
    const href = await link.getAttribute('href');
    expect(href).toBe(`/api/seasons/${season.id}/figures.csv`);
    const [download] = await Promise.all([page.waitForEvent('download'), link.click()]);
    expect(download.suggestedFilename()).toMatch(/\.csv$/);
    // A byte-order mark first, so spreadsheet programs read the en dashes in season names.
    const text = readFileSync((await download.path())!, 'utf8').replace(/^\uFEFF/, '');
    expect(text.split('\n')[0]).toMatch(/^section,species,variety/);
    expect(text).toContain(`variety,${figures.byVariety[0].speciesName},`);
    const res = await page.request.get(href!);
    expect(res.headers()['content-type']).toMatch(/^text\/csv/);

    expect(foreignRequests(requests)).toEqual([]);
    expect(pageErrors).toEqual([]);
  });

  it('a member reaches Figures from the navigation and is told these are their own figures', async () => {
    const { page, pageErrors } = await browser();
    await signIn(page, DEMO.grower);
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Figures', exact: true }).click();
    await page.waitForURL(/\/figures\/[0-9a-f-]{36}$/);
    await page.getByRole('heading', { name: /^Your figures: / , level: 1 }).waitFor();
    await page.getByText(/^Your own figures: your own wood requests/).waitFor();
    await settled(page);
    await screenshot(page, 'figures-member');
    expect(pageErrors).toEqual([]);
  });
});
