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

describe('mother-plant register', () => {
  it('a farm lead adds a blackcurrant, records big bud mite, and sees the plant go on hold', async () => {
    const { page, requests, pageErrors } = await browser();
    const bed = `Trial bed ${Date.now().toString(36)}`;

    await signIn(page, DEMO.lead);

    // The register, from the main navigation.
    await page.getByRole('link', { name: 'Plants', exact: true }).first().click();
    await page.waitForURL('**/plants');
    await page.getByRole('heading', { name: 'Plants', level: 1 }).waitFor();
    await settled(page);

    // Add a plant in the form.
    await page.getByRole('link', { name: 'Add a plant' }).click();
    await page.waitForURL('**/plants/new');
    await page.getByRole('heading', { name: 'Add a plant' }).waitFor();
    // The lead works on one farm, which the form has already chosen.
    await expect.poll(() => page.getByLabel('Farm', { exact: true }).inputValue()).not.toBe('');
    await page.getByLabel('Species', { exact: true }).selectOption({ label: 'Blackcurrant (Ribes nigrum)' });
    await page.getByLabel('Variety', { exact: false }).selectOption({ index: 1 });
    await page.getByLabel('Planting year', { exact: true }).fill('2021');
    await page.getByLabel('Role', { exact: true }).selectOption({ label: 'Stock bed' });
    await page.getByLabel('Provenance', { exact: true }).selectOption({ label: 'Bought' });
    await page.getByLabel('Latitude', { exact: false }).fill('52.0712');
    await page.getByLabel('Longitude', { exact: false }).fill('-2.5487');
    await page.getByLabel('Bed / row', { exact: false }).fill(bed);
    await page.getByRole('button', { name: 'Add the plant' }).click();

    // The new plant's page: a code of the lead's farm, clean to start with.
    await page.waitForURL(/\/plants\/[0-9a-f-]{36}$/);
    const code = page.getByRole('heading', { level: 1 });
    await expect.poll(async () => (await code.textContent()) ?? '').toMatch(/^WTH-\d{4}$/);
    const plantCode = (await code.textContent()) ?? '';
    await page.getByText(bed).waitFor();
    await settled(page);

    // Record an inspection with a finding that travels in cutting wood.
    await page.getByRole('button', { name: 'Add a finding' }).click();
    await page.getByLabel('Pest or disease', { exact: true }).selectOption({ label: 'Big bud mite (travels in cutting wood)' });
    await page.getByLabel('Severity', { exact: true }).selectOption({ label: 'Moderate' });
    await page.getByLabel('Notes on this finding', { exact: false }).fill('Swollen round buds on two shoots.');
    await page.getByRole('button', { name: 'Save the inspection' }).click();

    // The outcome is said plainly, and the plant's status is now Hold, in words and a shape.
    await page.getByText('Put on hold: a finding that travels in cutting wood').waitFor();
    const headerBadge = page.locator('header').filter({ has: page.getByRole('heading', { level: 1 }) }).getByText('Hold', { exact: true });
    await headerBadge.waitFor();
    const shape = await headerBadge.locator('xpath=..').locator('svg').getAttribute('data-shape');
    expect(shape).toBe('octagon');
    // The history shows the finding, marked as travelling in wood.
    await page.getByText('Big bud mite', { exact: true }).first().waitFor();
    expect(await page.getByText('Travels in cutting wood').count()).toBeGreaterThan(0);
    await settled(page);
    await screenshot(page, 'register-plant-on-hold');

    // The same page on a phone.
    await page.setViewportSize({ width: 390, height: 844 });
    await settled(page);
    await screenshot(page, 'register-plant-on-hold-phone');

    // Back on the list, filtered to plants on hold, the plant is there.
    await page.goto('/plants?status=hold&mine=true');
    await page.getByRole('link', { name: plantCode, exact: true }).first().waitFor();
    await settled(page);

    expect(foreignRequests(requests)).toEqual([]);
    expect(pageErrors).toEqual([]);
  });
});
