/**
 * Browser helpers for the Heelwood browser suite: Debian's chromium driven by playwright-core.
 * Never downloads a browser: the binary comes from CHROMIUM_PATH, `command -v chromium`,
 * or /usr/bin/chromium.
 */
import { execFileSync } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { inject } from 'vitest';

const repoRoot = resolve(dirname(fileURLToPath(import.meta.url)), '../../..');
export const resultsDir = join(repoRoot, 'test-results');

export const DEMO_PASSWORD = 'heelwood-demo';
export const DEMO = {
  coordinator: 'coordinator@heelwood.test',
  lead: 'lead@heelwood.test',
  hand: 'hand@heelwood.test',
  grower: 'grower@heelwood.test',
} as const;

/** Flags that keep Chromium off the network and quiet in a container (see STACK-NOTES). */
export const CHROMIUM_ARGS = [
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];

/** The app's base URL, e.g. http://localhost:41234 (provided by global-setup.ts). */
export function baseURL(): string {
  return inject('baseURL');
}

export function chromiumPath(): string {
  const fromEnv = process.env.CHROMIUM_PATH;
  if (fromEnv) return fromEnv;
  try {
    const found = execFileSync('sh', ['-c', 'command -v chromium'], { encoding: 'utf8' }).trim();
    if (found) return found;
  } catch {
    /* not on PATH */
  }
  if (existsSync('/usr/bin/chromium')) return '/usr/bin/chromium';
  throw new Error(
    "Debian's chromium is not installed: run `apt-get update && apt-get install -y chromium` " +
      '(or set CHROMIUM_PATH). Never use a browser download.',
  );
}

export interface BrowserSession {
  context: BrowserContext;
  page: Page;
  /** Every request URL made by any page in this context, in order. */
  requests: string[];
  /** Uncaught page errors (exceptions thrown in the page). */
  pageErrors: string[];
  /** console.error messages from the page. */
  consoleErrors: string[];
  close(): Promise<void>;
}

/**
 * Launches chromium with a fresh throw-away profile, with baseURL set so that
 * `page.goto('/sign-in')` works, and starts recording requests and errors.
 */
export async function openBrowser(): Promise<BrowserSession> {
  const profileDir = mkdtempSync(join(tmpdir(), 'heelwood-chromium-'));
  const context = await chromium.launchPersistentContext(profileDir, {
    executablePath: chromiumPath(),
    headless: true,
    args: CHROMIUM_ARGS,
    baseURL: baseURL(),
    viewport: { width: 1280, height: 900 },
    locale: 'en-GB',
    timezoneId: 'Europe/Amsterdam',
  });
  context.setDefaultTimeout(15_000);
  context.setDefaultNavigationTimeout(30_000);
  const requests = recordRequests(context);
  const pageErrors: string[] = [];
  const consoleErrors: string[] = [];
  const watch = (p: Page) => {
    p.on('pageerror', (err) => pageErrors.push(`${err.name}: ${err.message}`));
    p.on('console', (msg) => {
      if (msg.type() === 'error') consoleErrors.push(msg.text());
    });
  };
  context.pages().forEach(watch);
  context.on('page', watch);
  const page = context.pages()[0] ?? (await context.newPage());
  return {
    context,
    page,
    requests,
    pageErrors,
    consoleErrors,
    async close() {
      await context.close().catch(() => undefined);
      rmSync(profileDir, { recursive: true, force: true });
    },
  };
}

/** Collects the URL of every request any page of the context makes (returns the live array). */
export function recordRequests(context: BrowserContext): string[] {
  const urls: string[] = [];
  context.on('request', (req) => urls.push(req.url()));
  return urls;
}

/**
 * The recorded URLs that did not go to `origin` (default: the app's own origin).
 * data:, blob: and about: URLs never leave the browser and are not counted.
 */
export function foreignRequests(urls: string[], origin = new URL(baseURL()).origin): string[] {
  return urls.filter((u) => {
    if (/^(data|blob|about):/.test(u)) return false;
    try {
      return new URL(u).origin !== origin;
    } catch {
      return true;
    }
  });
}

/** Signs in through the /sign-in form and waits until the app has left the sign-in page. */
export async function signIn(page: Page, email: string, password = DEMO_PASSWORD): Promise<void> {
  await page.goto('/sign-in');
  // Let the app finish asking who is signed in: if someone is, /sign-in redirects away and a
  // form filled too early would be thrown away.
  await page.waitForLoadState('networkidle');
  if (!new URL(page.url()).pathname.startsWith('/sign-in')) {
    throw new Error(`signIn(${email}): /sign-in redirected to ${page.url()}: someone is already signed in in this browser`);
  }
  await page.getByLabel('E-mail', { exact: true }).fill(email);
  await page.getByLabel('Password', { exact: true }).fill(password);
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
  await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
  await page.getByRole('button', { name: 'Sign out' }).waitFor({ state: 'visible' });
}

/** Signs out with the header's "Sign out" button. */
export async function signOut(page: Page): Promise<void> {
  await page.getByRole('button', { name: 'Sign out' }).click();
  await page.waitForURL((url) => url.pathname.startsWith('/sign-in') || url.pathname === '/');
}

/**
 * Waits until the page has settled: no network for 500 ms, no "Loading…" status shown and
 * nothing marked aria-busy. Call before a screenshot or before asserting that something is absent.
 */
export async function settled(page: Page, timeout = 30_000): Promise<void> {
  await page.waitForLoadState('networkidle', { timeout });
  await page.waitForFunction(
    () =>
      !document.querySelector('[aria-busy="true"]') &&
      ![...document.querySelectorAll('[role="status"]')].some((el) => /loading/i.test(el.textContent ?? '')),
    undefined,
    { timeout },
  );
}

/** Saves a full-page screenshot to test-results/<name>.png and returns its path. */
export async function screenshot(page: Page, name: string): Promise<string> {
  mkdirSync(resultsDir, { recursive: true });
  const path = join(resultsDir, name.endsWith('.png') ? name : `${name}.png`);
  await page.screenshot({ path, fullPage: true });
  return path;
}
