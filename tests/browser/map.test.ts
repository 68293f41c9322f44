// The offline map in a browser, as the demo grower: the demo farms, a species filter, farm zoom
// with its honest note and grid, a hedgerow drawn with the mouse and its geodesic length, and
// not one request to any host but Heelwood's own.
import { afterEach, describe, expect, it } from 'vitest';
import { DEMO, foreignRequests, openBrowser, screenshot, settled, signIn, type BrowserSession } from './support/browser';

const open: BrowserSession[] = [];
async function browser(): Promise<BrowserSession> {
  const session = await openBrowser();
  open.push(session);
  return session;
}
afterEach(async () => {
  await Promise.all(open.splice(0).map((s) => s.close()));
});

type Features = { farms: { id: string; name: string }[]; plants: { speciesName: string; code: string }[] };

describe('offline map', () => {
  it('a grower sees the farms, filters a species, draws a hedgerow and reads its length, all offline', async () => {
    const { page, requests, pageErrors } = await browser();
    await signIn(page, DEMO.grower);

    // From the main navigation.
    await page.getByRole('link', { name: 'Map', exact: true }).first().click();
    await page.waitForURL('**/map');
    await page.locator('[data-testid="map-frame"][data-plants-drawn]').waitFor();
    await settled(page);

    // The seven demo farms, in the list and as tags on the map.
    await expect.poll(() => page.getByTestId('map-farms').getByRole('listitem').count()).toBe(7);
    await expect.poll(() => page.locator('.hw-farm-icon').count()).toBe(7);
    // The basemap comes from this application.
    expect(requests.some((u) => /\/tiles\/\d+\/\d+\/\d+\.png$/.test(new URL(u).pathname))).toBe(true);
    // The legend says every status in words with its shape.
    for (const word of ['Clean', 'Watch', 'Hold', 'Retired']) {
      await page.getByTestId('map-legend').getByText(word, { exact: true }).waitFor();
    }

    // Filter to one species: the count on the page is what the server holds for that species.
    const all = (await (await page.request.get('/api/map/features')).json()) as Features;
    const speciesSelect = page.getByLabel('Species', { exact: true });
    const options = await speciesSelect.locator('option').allTextContents();
    const speciesName = options.find((o) => all.plants.some((p) => p.speciesName === o))!;
    expect(speciesName).toBeTruthy();
    await speciesSelect.selectOption({ label: speciesName });
    await page.waitForURL(/speciesId=/);
    const speciesId = new URL(page.url()).searchParams.get('speciesId')!;
    const filtered = (await (await page.request.get(`/api/map/features?speciesId=${speciesId}`)).json()) as Features;
    expect(filtered.plants.length).toBeGreaterThan(0);
    expect(filtered.plants.length).toBeLessThan(all.plants.length);
    await expect.poll(() => page.getByTestId('map-count').textContent()).toContain(`${filtered.plants.length} plant`);
    await page.locator(`[data-testid="map-frame"][data-plants-drawn="${filtered.plants.length}"]`).waitFor();

    // Farm zoom: the basemap has no detail there, and the page says so.
    await page.getByTestId('map-farms').getByRole('button', { name: /Wetherstone Farm/ }).click();
    await page.getByText('No detailed map is loaded for this area: farm outlines, beds and the grid carry the detail').waitFor();

    // Draw a hedgerow with the mouse: three points, then finish.
    await page.getByRole('button', { name: 'Plan a hedgerow' }).click();
    await page.getByText(/Tap the map where the hedgerow starts/).waitFor();
    const box = (await page.locator('.leaflet-container').boundingBox())!;
    const at = (fx: number, fy: number) => [box.x + box.width * fx, box.y + box.height * fy] as const;
    for (const [fx, fy] of [
      [0.3, 0.6],
      [0.5, 0.45],
      [0.72, 0.55],
    ]) {
      const [x, y] = at(fx, fy);
      await page.mouse.move(x, y, { steps: 4 });
      await page.mouse.click(x, y);
      await page.waitForTimeout(120);
    }
    await expect.poll(() => page.getByText('3 points, measured on the WGS84 ellipsoid.').count()).toBe(1);
    await page.getByRole('button', { name: 'Finish line' }).click();

    const shown = (await page.getByTestId('hedgerow-length').textContent()) ?? '';
    const lengthM = Number(shown.replace(/[^\d.]/g, ''));
    expect(shown).toMatch(/^[\d,]+\.\d m$/);
    expect(lengthM).toBeGreaterThan(0);
    const plan = page.getByRole('link', { name: 'Plan this hedgerow' });
    await expect.poll(() => plan.getAttribute('href')).toBe(`/planner?lengthM=${lengthM}`);

    await settled(page);
    await screenshot(page, 'map-grower');

    expect(foreignRequests(requests), 'requests to other hosts').toEqual([]);
    expect(pageErrors).toEqual([]);
  });

  it('the coordinator sees every plant once in the clusters, zooms in through them and opens a plant', async () => {
    const { page, pageErrors } = await browser();
    await signIn(page, DEMO.coordinator);
    await page.goto('/map');
    const frame = page.locator('[data-testid="map-frame"][data-plants-drawn]');
    await frame.waitFor();
    await settled(page);
    const drawn = Number(await frame.getAttribute('data-plants-drawn'));
    const all = (await (await page.request.get('/api/map/features')).json()) as Features;
    expect(drawn).toBe(all.plants.length);

    // What the map shows now: each cluster's number (from its label, "N plants, …") and each single plant.
    const shownNow = async () => {
      const labels = await page.locator('.hw-cluster').evaluateAll((els) => els.map((e) => e.getAttribute('aria-label') ?? ''));
      const counts = labels.map((l) => Number(/^(\d+) plants/.exec(l)?.[1]));
      const singles = await page.locator('.hw-plant').count();
      return { counts, singles };
    };
    // The first view fits every plant: the clusters' numbers and the single plants add up to all of them.
    const first = await shownNow();
    expect(first.counts.length).toBeGreaterThan(0);
    expect(first.counts.every((n) => Number.isInteger(n) && n >= 2)).toBe(true);
    expect(first.counts.reduce((a, b) => a + b, 0) + first.singles).toBe(all.plants.length);

    // Tapping the largest cluster zooms in until it comes apart: no cluster that large is left.
    const largest = Math.max(...first.counts);
    await page.locator('.hw-cluster-icon').nth(first.counts.indexOf(largest)).click();
    await expect.poll(async () => (await shownNow()).counts.filter((n) => n >= largest).length).toBeLessThan(first.counts.filter((n) => n >= largest).length);

    // Keep tapping a cluster until single plants show, then open one: its details name it.
    for (let i = 0; i < 12 && (await page.locator('.hw-plant').count()) === 0; i++) {
      await page.locator('.hw-cluster-icon').first().click();
      await page.waitForTimeout(400);
    }
    const plant = page.locator('.hw-plant').first();
    const label = (await plant.getAttribute('aria-label'))!;
    const code = label.split(',')[0];
    expect(all.plants.some((p) => p.code === code)).toBe(true);
    await page.locator('.leaflet-marker-icon', { has: plant }).click();
    await page.getByRole('complementary', { name: 'Map details' }).getByText(code, { exact: false }).first().waitFor();

    // The names of beds never print over each other: where they would, only one shows.
    const overlaps = await page.locator('.hw-bed-label').evaluateAll((els) => {
      const rects = els.filter((e) => getComputedStyle(e).visibility !== 'hidden').map((e) => e.getBoundingClientRect());
      let n = 0;
      rects.forEach((a, i) => rects.slice(i + 1).forEach((b) => (n += a.left < b.right && b.left < a.right && a.top < b.bottom && b.top < a.bottom ? 1 : 0)));
      return { shown: rects.length, n };
    });
    expect(overlaps.shown).toBeGreaterThan(0);
    expect(overlaps.n).toBe(0);

    await screenshot(page, 'map-clusters-coordinator');
    expect(pageErrors).toEqual([]);
  });
});
