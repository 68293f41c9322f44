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

type Features = { farms: { id: string; name: string }[]; plants: { speciesName: string }[] };

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
});
