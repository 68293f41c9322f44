// The wood exchange in a browser: a farm lead offers wood from shoot counts and sees the
// estimate and cap the server will hold; a grower plans a hedgerow and files a request.
// The expected numbers come from the same shared functions the pages and the server use.
import type { Page } from 'playwright-core';
import { afterEach, describe, expect, it } from 'vitest';
import { plantingPositions } from '../../shared/planner';
import type { OfferRow, Season } from '../../shared/schemas/seasons';
import type { Species } from '../../shared/schemas/register';
import { offerCap, plantYield } from '../../shared/yield';
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

async function getJson<T>(page: Page, path: string): Promise<T> {
  const res = await page.request.get(path);
  expect(res.ok(), `${path} answered ${res.status()}`).toBe(true);
  return (await res.json()) as T;
}

async function openSeason(page: Page): Promise<Season> {
  const { items } = await getJson<{ items: Season[] }>(page, '/api/seasons');
  // The season taking requests with the soonest deadline: the one the pages offer first.
  const season = items
    .filter((s) => s.stage === 'requests_open' && new Date(s.requestDeadline) > new Date())
    .sort((a, b) => a.requestDeadline.localeCompare(b.requestDeadline))[0];
  expect(season, 'the demo cooperative has a season taking requests').toBeTruthy();
  return season!;
}

/** Full-page screenshots at desktop width and at a phone's 390 px. */
async function shootBoth(page: Page, name: string): Promise<void> {
  await settled(page);
  await screenshot(page, `${name}-desktop`);
  await page.setViewportSize({ width: 390, height: 844 });
  await settled(page);
  await screenshot(page, `${name}-phone`);
  await page.setViewportSize({ width: 1280, height: 900 });
}

describe('wood exchange', () => {
  it('a farm lead offers wood from shoot counts and sees the estimate and the cap', async () => {
    const { page, requests, pageErrors } = await browser();
    await signIn(page, DEMO.lead);

    // From the home page's season card to the farm's offers.
    const season = await openSeason(page);
    await page.getByRole('link', { name: 'Offer wood' }).click();
    await page.waitForURL(`**/seasons/${season.id}/offers?farmId=*`);
    await page.getByRole('heading', { name: /Wood offers of/ }).waitFor();
    await settled(page);
    const farmId = new URL(page.url()).searchParams.get('farmId')!;

    // The first plant that may give wood.
    const row = page.locator('form').filter({ has: page.getByRole('button', { name: /^(Offer this wood|Save offer)$/ }) }).first();
    const code = ((await row.locator('h4').textContent()) ?? '').trim().split(/\s+/)[0];
    const { items } = await getJson<{ items: OfferRow[] }>(page, `/api/seasons/${season.id}/farms/${farmId}/offers`);
    const plant = items.find((p) => p.code === code)!;
    expect(plant?.eligible).toBe(true);

    await row.getByLabel('Measured by').selectOption('shoots');
    await row.getByLabel('New shoots').fill('14');
    await row.getByLabel('Mean length (cm)').fill('85');
    await row.getByLabel('Cuttings offered').fill('');

    const estimate = plantYield({ shootCount: 14, meanShootLengthCm: 85, softTipCm: plant.softTipCm, cuttingLengthCm: plant.cuttingLengthCm });
    const cap = offerCap(estimate, plant.capFraction);
    await expect
      .poll(async () => (await row.getByTestId('offer-estimate').textContent())?.replace(/\s+/g, ' '))
      .toContain(`Estimate ${estimate} cuttings · may offer up to ${cap}`);

    await row.getByRole('button', { name: /^(Offer this wood|Save offer)$/ }).click();
    await row.getByText(`Saved: ${cap} cuttings offered (estimate ${estimate}, at most ${cap}).`).waitFor();

    // The server holds the same numbers.
    const after = await getJson<{ items: OfferRow[] }>(page, `/api/seasons/${season.id}/farms/${farmId}/offers`);
    const saved = after.items.find((p) => p.code === code)!.offer!;
    expect(saved).toMatchObject({ shootCount: 14, meanShootLengthCm: 85, estimatedYield: estimate, offered: cap });

    await row.scrollIntoViewIfNeeded();
    await shootBoth(page, 'exchange-lead-offers');

    // The pickup windows of the farm, shown in the farm's time.
    await page.getByRole('heading', { name: /Pickup windows at/ }).scrollIntoViewIfNeeded();
    await page.getByRole('button', { name: 'Add window' }).waitFor();

    expect(foreignRequests(requests)).toEqual([]);
    expect(pageErrors).toEqual([]);
  });

  it('a grower plans a 30 m hedgerow and files a request with its cuttings', async () => {
    const { page, requests, pageErrors } = await browser();
    await signIn(page, DEMO.grower);
    const season = await openSeason(page);
    const { items: species } = await getJson<{ items: Species[] }>(page, '/api/species');
    const blackcurrant = species.find((s) => s.commonName === 'Blackcurrant')!;

    // Until the map draws hedgerows, the planner is opened with the length in the address.
    await page.goto('/planner?lengthM=30');
    await page.getByRole('heading', { name: 'Planner', level: 1 }).waitFor();
    await expect.poll(() => page.getByLabel('Length (m)').inputValue()).toBe('30');
    await page.getByLabel('Species', { exact: true }).selectOption(blackcurrant.id);
    await page.getByLabel('Treatment before sticking').selectOption('willow');
    await page.getByText('Checked by the Heelwood server.').waitFor();

    const spacing = Number(await page.getByLabel('Spacing (m)').inputValue());
    const positions = plantingPositions({ lengthM: 30, spacingM: spacing, rows: 1 });
    const cuttings = positions * 2;
    expect(await page.getByTestId('plan-positions').textContent()).toBe(String(positions));
    expect(await page.getByTestId('plan-ask').textContent()).toBe(String(cuttings));
    await expect.poll(() => page.getByText(/from the reference rate|Learned from/i).count()).toBeGreaterThan(0);
    await shootBoth(page, 'exchange-grower-planner');

    await page.getByRole('button', { name: 'Add to my request' }).click();
    await page.waitForURL(`**/seasons/${season.id}/request?*`);
    await page.getByRole('heading', { name: 'My wood request' }).waitFor();
    await settled(page);

    // The planner's line arrived; the grower says where the wood goes and files.
    const line = page.getByRole('group', { name: /^Line \d+$/ }).last();
    await expect.poll(() => line.getByLabel('Cuttings', { exact: true }).inputValue()).toBe(String(cuttings));
    expect(await line.getByLabel('Species', { exact: true }).inputValue()).toBe(blackcurrant.id);
    await line.getByText(/Caution:/).waitFor();
    await page.getByLabel('Latitude').fill('52.0855');
    await page.getByLabel('Longitude').fill('-2.6385');
    await page.getByLabel('Name of the place').fill('Lane hedge, Withington');
    await page.getByRole('button', { name: 'File the request' }).click();

    await page.getByText('Your request is filed').waitFor();
    const filedLine = page.getByRole('list', { name: 'Lines of your request' }).getByRole('listitem').filter({ hasText: 'Blackcurrant' }).filter({ hasText: 'Willow soak' });
    await filedLine.waitFor();
    expect(await filedLine.getByTestId('line-cuttings').textContent()).toBe(String(cuttings));
    await filedLine.getByText('30 m hedgerow').waitFor();
    await expect.poll(() => page.getByText('Filed', { exact: true }).count()).toBeGreaterThan(0);

    const { request } = await getJson<{ request: { status: string; lines: { speciesId: string; cuttings: number; treatment: string }[] } }>(
      page,
      `/api/seasons/${season.id}/my-request`,
    );
    expect(request.status).toBe('filed');
    expect(request.lines).toContainEqual(expect.objectContaining({ speciesId: blackcurrant.id, cuttings, treatment: 'willow' }));

    await page.evaluate(() => window.scrollTo(0, 0));
    await shootBoth(page, 'exchange-grower-request');

    expect(foreignRequests(requests)).toEqual([]);
    expect(pageErrors).toEqual([]);
  });
});
