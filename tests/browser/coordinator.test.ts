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

describe('coordinator', () => {
  it('signs in, opens the Mailbox, and the page talks only to its own origin', async () => {
    const { page, requests, pageErrors } = await browser();

    await signIn(page, DEMO.coordinator);
    expect(new URL(page.url()).pathname).toBe('/');
    await page.getByRole('link', { name: 'Members', exact: true }).first().waitFor({ state: 'visible' });

    await page.getByRole('link', { name: 'Mailbox', exact: true }).first().click();
    await page.waitForURL('**/mailbox');
    await page.getByRole('heading', { name: 'Mailbox' }).first().waitFor({ state: 'visible' });
    await settled(page);
    await screenshot(page, 'coordinator-mailbox');

    expect(requests.length).toBeGreaterThan(0);
    expect(foreignRequests(requests)).toEqual([]);
    expect(pageErrors).toEqual([]);
  });

  it('admits an applicant, who can then sign in without an "awaiting" notice', async () => {
    const stamp = `${Date.now().toString(36)}${Math.floor(Math.random() * 1e4)}`;
    const applicant = {
      name: `Ada Applicant ${stamp}`,
      email: `applicant-${stamp}@heelwood.test`,
      password: `graft-${stamp}-scion`,
    };

    // 1. The applicant applies on /sign-up.
    const visitor = await browser();
    await visitor.page.goto('/sign-up');
    await visitor.page.getByLabel('Name', { exact: true }).fill(applicant.name);
    await visitor.page.getByLabel('E-mail', { exact: true }).fill(applicant.email);
    await visitor.page.getByLabel('Password', { exact: true }).fill(applicant.password);
    await visitor.page.getByRole('button', { name: 'Apply to join' }).click();
    await visitor.page.waitForURL((url) => url.pathname !== '/sign-up'); // to /sign-up/received
    await screenshot(visitor.page, 'applicant-applied');

    // The applicant comes back later in a fresh browser session (applying may or may not have
    // signed them in: better-auth signs a new account in unless autoSignIn is off).
    await visitor.context.clearCookies();

    // While pending, signing in shows the "awaiting" notice (so its absence later means something).
    await signIn(visitor.page, applicant.email, applicant.password);
    await visitor.page.getByText(/awaiting/i).first().waitFor({ state: 'visible' });

    // 2. The coordinator admits them on /members.
    const coordinator = await browser();
    await signIn(coordinator.page, DEMO.coordinator);
    // Filter by the applicant's e-mail so pagination cannot hide the row.
    await coordinator.page.goto(`/members?q=${encodeURIComponent(applicant.email)}`);
    const admit = coordinator.page
      .locator('tr, li, article, [role="row"], [role="listitem"]')
      .filter({ hasText: applicant.email })
      .getByRole('button', { name: 'Admit' })
      .last();
    await admit.click();
    await admit.waitFor({ state: 'detached' });
    await settled(coordinator.page);
    await screenshot(coordinator.page, 'coordinator-admitted');

    // 3. The applicant signs in (fresh cookies) and lands on the home page as a member.
    await visitor.context.clearCookies();
    await signIn(visitor.page, applicant.email, applicant.password);
    expect(new URL(visitor.page.url()).pathname).toBe('/');
    // An admitted member has the main navigation; a pending applicant has none.
    await visitor.page.getByRole('link', { name: 'Home', exact: true }).first().waitFor({ state: 'visible' });
    await settled(visitor.page);
    expect(await visitor.page.getByText(/awaiting/i).count()).toBe(0);
    await screenshot(visitor.page, 'applicant-home');

    expect(foreignRequests(visitor.requests)).toEqual([]);
    expect(foreignRequests(coordinator.requests)).toEqual([]);
  });
});
