// bench:map — the offline map in headless Chromium with 10,000 mother plants, and with 100 in
// the same run (a farm of exactly 100 plants, asked for with the map's farm filter: the same
// page and code path). Starts the app on a temporary in-memory database with the demo seed,
// tops the register up with Drizzle, and times, in the browser:
//   drawMs / drawMs100  navigation start to the plants drawn (the page's performance mark
//                       'heelwood:map-plants-drawn'), median of BENCH_RUNS loads after a warm-up;
//   panFrameMs          median frame time (requestAnimationFrame) while dragging the map at the
//                       first view; panFrameMsFarm the same at farm zoom among the bushes.
// Last line: one JSON object.
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { asc } from 'drizzle-orm';
import { chromium, type Page } from 'playwright-core';
import { createApp } from '../server/app.js';
import { loadConfig } from '../server/config.js';
import { createContext } from '../server/context.js';
import { farms, motherPlants, varieties } from '../server/db/schema/index.js';
import { freePort } from '../tests/fixtures/free-port.js';

const PLANTS = Number(process.env.BENCH_PLANTS ?? 10_000);
const SMALL = 100;
const RUNS = Number(process.env.BENCH_RUNS ?? 3);
const CHROMIUM = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
// STACK-NOTES: flags that keep Chromium off the network and quiet in a container.
const CHROMIUM_ARGS = ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'];
const ROOT = path.resolve(import.meta.dirname, '..');
const MARK = 'heelwood:map-plants-drawn';

const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length % 2 ? s[(s.length - 1) / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
};

function ensureClientBuilt() {
  const assets = path.join(ROOT, 'dist', 'assets');
  const built = existsSync(assets) && readdirSync(assets).some((f) => /^map-route-.*\.js$/.test(f));
  if (built) return;
  console.log('dist/ has no map page: running `npx vite build`');
  const r = spawnSync('npx', ['vite', 'build'], { cwd: ROOT, stdio: 'inherit' });
  if (r.status !== 0) throw new Error('the client build failed');
}

/** Loads the map and returns ms from navigation start to the plants drawn. */
async function timeLoad(page: Page, url: string, expected: number): Promise<number> {
  await page.goto('about:blank');
  await page.goto(url);
  await page.locator(`[data-testid="map-frame"][data-plants-drawn="${expected}"]`).waitFor({ timeout: 60_000 });
  const t = await page.evaluate(`(() => {
    const entries = performance.getEntriesByName(${JSON.stringify(MARK)});
    const res = performance.getEntriesByType('resource');
    const end = (part) => Math.round(Math.max(0, ...res.filter((r) => r.name.includes(part)).map((r) => r.responseEnd)));
    const start = (part) => Math.round(Math.min(1e9, ...res.filter((r) => r.name.includes(part)).map((r) => r.startTime)));
    const nav = performance.getEntriesByType('navigation')[0];
    return {
      drawn: entries[entries.length - 1].startTime,
      domReady: Math.round(nav.domContentLoadedEventEnd),
      routeRendered: Math.round(performance.getEntriesByName('heelwood:map-route').at(-1)?.startTime ?? -1),
      mapMounted: Math.round(performance.getEntriesByName('heelwood:map-mounted').at(-1)?.startTime ?? -1),
      meDone: end('/api/me'),
      featuresAsked: start('/api/map/features'),
      featuresDone: end('/api/map/features'),
      mapCodeDone: end('/assets/map-route-'),
    };
  })()`) as { drawn: number } & Record<string, number>;
  timelines.push(t);
  return t.drawn;
}
/** Where each timed load spent its time (ms from navigation start), for the breakdown line. */
const timelines: Record<string, number>[] = [];

/** Drags the map back and forth while recording frame times with requestAnimationFrame. */
async function panFrames(page: Page): Promise<number> {
  const box = (await page.locator('.leaflet-container').boundingBox())!;
  // A string, not a function: tsx's name-keeping helper does not exist inside the page.
  await page.evaluate(`(() => {
    window.__frames = [];
    window.__recording = true;
    let last = performance.now();
    const tick = (t) => {
      window.__frames.push(t - last);
      last = t;
      if (window.__recording) requestAnimationFrame(tick);
    };
    requestAnimationFrame((t) => { last = t; requestAnimationFrame(tick); });
  })()`);
  const cx = box.x + box.width / 2;
  const cy = box.y + box.height / 2;
  for (let i = 0; i < 4; i++) {
    const dx = (i % 2 ? -1 : 1) * box.width * 0.3;
    const dy = (i % 2 ? -1 : 1) * box.height * 0.15;
    await page.mouse.move(cx, cy);
    await page.mouse.down();
    await page.mouse.move(cx + dx, cy + dy, { steps: 40 });
    await page.mouse.up();
    await page.waitForTimeout(150);
  }
  const frames = (await page.evaluate('(() => { window.__recording = false; return window.__frames; })()')) as number[];
  return median(frames.slice(2));
}

async function main() {
  ensureClientBuilt();
  const dataDir = mkdtempSync(path.join(tmpdir(), 'heelwood-bench-map-'));
  const profile = mkdtempSync(path.join(tmpdir(), 'heelwood-bench-chromium-'));
  const port = await freePort();
  const config = loadConfig({ NODE_ENV: 'test', PORT: String(port), DATA_DIR: dataDir, SEED_DEMO: 'true' });
  const ctx = await createContext(config, { inMemory: true });
  const db = ctx.db;
  let server: ReturnType<Awaited<ReturnType<typeof createApp>>['listen']> | undefined;
  let browser: Awaited<ReturnType<typeof chromium.launchPersistentContext>> | undefined;
  try {
    // A farm of exactly SMALL plants, and the demo farms topped up so the register holds PLANTS.
    const vs = await db.select({ id: varieties.id, speciesId: varieties.speciesId }).from(varieties).orderBy(asc(varieties.id));
    const [bench] = await db.insert(farms).values({ code: 'BNCH', name: 'Bench Hundred', lat: 52.06, lon: -2.75 }).returning();
    const demoFarms = (await db.select().from(farms).orderBy(asc(farms.code))).filter((f) => f.id !== bench.id);
    const existing = (await db.select({ id: motherPlants.id }).from(motherPlants)).length;
    const statuses = ['clean', 'clean', 'clean', 'clean', 'watch', 'hold'] as const;
    const row = (i: number, f: { id: string; code: string; lat: number; lon: number }, code: string, lat: number, lon: number) => {
      const v = vs[(i * 7) % vs.length];
      return {
        code,
        farmId: f.id,
        speciesId: v.speciesId,
        varietyId: v.id,
        plantingYear: 2008 + (i % 17),
        role: i % 3 ? ('stock_bed' as const) : ('fruiting_bush' as const),
        provenance: 'bought' as const,
        healthStatus: statuses[i % statuses.length],
        lat,
        lon,
        bedRow: `Bed ${1 + (i % 12)}`,
      };
    };
    const rows: (typeof motherPlants.$inferInsert)[] = [];
    // 2 m apart in a 10 x 10 block.
    for (let i = 0; i < SMALL; i++) rows.push(row(i, bench, `BNCH-${String(i + 1).padStart(4, '0')}`, bench.lat + Math.floor(i / 10) * 1.8e-5, bench.lon + (i % 10) * 2.9e-5));
    for (let i = existing + SMALL; i < PLANTS; i++) {
      const f = demoFarms[i % demoFarms.length];
      rows.push(row(i, f, `${f.code}-M${String(i).padStart(6, '0')}`, f.lat + ((i % 100) - 50) * 1e-5, f.lon + ((i % 77) - 38) * 1.6e-5));
    }
    for (let i = 0; i < rows.length; i += 1000) await db.insert(motherPlants).values(rows.slice(i, i + 1000));
    const total = existing + rows.length;

    const app = await createApp(ctx);
    server = app.listen(port, '127.0.0.1');
    await new Promise((r) => server!.once('listening', r));
    const base = `http://localhost:${port}`;

    browser = await chromium.launchPersistentContext(profile, {
      executablePath: CHROMIUM,
      headless: true,
      args: CHROMIUM_ARGS,
      baseURL: base,
      viewport: { width: 1280, height: 900 },
    });
    const page = browser.pages()[0] ?? (await browser.newPage());
    const foreign: string[] = [];
    page.on('request', (r) => {
      if (!/^(data|blob|about):/.test(r.url()) && new URL(r.url()).origin !== base) foreign.push(r.url());
    });
    const signIn = await browser.request.post('/api/auth/sign-in/email', {
      data: { email: 'coordinator@heelwood.test', password: 'heelwood-demo' },
      headers: { origin: base },
    });
    if (!signIn.ok()) throw new Error(`sign-in failed: ${signIn.status()}`);
    const features = (await (await browser.request.get('/api/map/features')).json()) as { plants: unknown[] };
    if (features.plants.length !== total) throw new Error(`the map endpoint answered ${features.plants.length} plants, expected ${total}`);

    // Warm the browser's cache of the page's code once; then alternate the two sizes.
    await timeLoad(page, '/map', total);
    const big: number[] = [];
    const small: number[] = [];
    for (let i = 0; i < RUNS; i++) {
      big.push(await timeLoad(page, '/map', total));
      small.push(await timeLoad(page, `/map?farmId=${bench.id}`, SMALL));
    }

    await timeLoad(page, '/map', total);
    await page.waitForTimeout(500);
    const panFrameMs = await panFrames(page);
    await page.getByTestId('map-farms').getByRole('button', { name: new RegExp(demoFarms[0].name) }).click();
    await page.waitForTimeout(1200);
    const visible = await page.locator('.hw-plant-icon, .hw-cluster-icon').count();
    const panFrameMsFarm = await panFrames(page);

    const api: number[] = [];
    for (let i = 0; i < 5; i++) {
      const t = performance.now();
      await browser.request.get('/api/map/features');
      api.push(performance.now() - t);
    }

    console.log(`plants: ${total} in the register; ${SMALL} on the bench farm; ${RUNS} timed loads each after a warm-up`);
    console.log(`drawMs runs ${big.map((x) => x.toFixed(0)).join(', ')}; drawMs100 runs ${small.map((x) => x.toFixed(0)).join(', ')}`);
    // Timed loads alternate 10,000 / 100 after the warm-up (index 0).
    const keys = Object.keys(timelines[0]);
    const line = (ts: Record<string, number>[]) => keys.map((k) => `${k} ${median(ts.map((t) => t[k])).toFixed(0)}`).join(', ');
    console.log(`timeline medians, ${total} plants (ms from navigation): ${line(timelines.slice(1).filter((_, i) => i % 2 === 0))}`);
    console.log(`timeline medians, ${SMALL} plants (ms from navigation): ${line(timelines.slice(1).filter((_, i) => i % 2 === 1))}`);
    console.log(`GET /api/map/features (${total} plants): median ${median(api).toFixed(0)} ms; markers and clusters in the DOM at farm zoom: ${visible}`);
    if (foreign.length) console.log(`requests to other hosts: ${foreign.join(', ')}`);
    console.log(
      JSON.stringify({
        plants: total,
        drawMs: Math.round(median(big)),
        drawMs100: Math.round(median(small)),
        panFrameMs: +panFrameMs.toFixed(1),
        panFrameMsFarm: +panFrameMsFarm.toFixed(1),
        featuresApiMs: Math.round(median(api)),
        foreignRequests: foreign.length,
      }),
    );
  } finally {
    await browser?.close().catch(() => undefined);
    server?.closeAllConnections();
    server?.close();
    await ctx.close();
    rmSync(dataDir, { recursive: true, force: true });
    rmSync(profile, { recursive: true, force: true });
  }
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
