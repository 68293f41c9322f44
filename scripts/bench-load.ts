// bench:load — the main read routes under load, with 10,000 mother plants.
//
// Builds a database on disk (demo seed topped up to BENCH_PLANTS plants, as bench:register
// does), then starts the real server entry point (server/index.ts, as `npm start` does) in a
// child process with NODE_ENV=production on loopback: PUBLIC_URL http://localhost:<port> is
// allowed without https or SMTP (config.ts), e-mail goes to the local catcher, better-auth's
// rate limiting is ON as in production. The load routes never pass through /api/auth (the
// client asks /api/me, not better-auth's get-session), so the limiter cannot refuse them; the
// few sign-ins stay under the sign-in limit.
//
// 1. Each route alone: server CPU time per request (/proc), BENCH_COST_RUNS in a row.
// 2. autocannon (programmatic API), once: BENCH_CONNECTIONS connections for BENCH_SECONDS s,
//    every connection cycling through the routes below in order, one request at a time (no
//    pipelining), so the routes share the load the whole time. GET /api/health is one entry
//    of that cycle: the baseline under the same load (it does no work, so its latency is what
//    the busy process and machine add to any request).
//
// Sessions: each request carries the cookies a browser holds — the session token and
// better-auth's signed session cache (60 s, renewed on responses); BENCH_SESSION=lookup sends
// the token alone, so every request looks the session up in the database.
//
// 3. The same run again while the farm lead saves a plant every BENCH_WRITE_EVERY_MS ms (250;
//    0 skips it): each save is a commit, after which every answer the read cache kept
//    (server/lib/read-cache.ts) is built again. Printed as one line before the last.
//
// BENCH_SERVER_NODE_ARGS passes flags to the server's node (e.g. `--cpu-prof`).
//
// Prints a line per route (count, non-2xx, p50/p95/p99 ms under load, response size, CPU ms
// alone), then one JSON line: {"requests","errors","p50Ms","p95Ms","p99Ms"} over the app
// routes (baseline left out); errors = non-2xx + socket errors + timeouts of the whole run.
import * as hdr from 'hdr-histogram-js';
import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { loadavg, tmpdir } from 'node:os';
import path from 'node:path';
import autocannon, { type Options, type Request, type Result } from 'autocannon';
import { and, asc, eq } from 'drizzle-orm';
import { loadConfig } from '../server/config.js';
import { createContext } from '../server/context.js';
import { farms, motherPlants, seasons, species } from '../server/db/schema/index.js';
import { freePort } from '../tests/fixtures/free-port.js';
import { topUpPlants } from './lib/top-up-plants.js';

const PLANTS = Number(process.env.BENCH_PLANTS ?? 10_000);
const CONNECTIONS = Number(process.env.BENCH_CONNECTIONS ?? 50);
const SECONDS = Number(process.env.BENCH_SECONDS ?? 20);
const LOOKUP = process.env.BENCH_SESSION === 'lookup';
const ROOT = path.resolve(import.meta.dirname, '..');
const PASSWORD = 'heelwood-demo';
const COST_RUNS = Number(process.env.BENCH_COST_RUNS ?? 40);
/** The second run: the farm lead saves a plant this often (0 skips it). */
const WRITE_EVERY_MS = Number(process.env.BENCH_WRITE_EVERY_MS ?? 250);
// USER_HZ: 100 on Linux for every architecture Node runs on (`getconf CLK_TCK`).
const CLOCK_TICKS = 100;

/** User + system CPU time of a process so far, in ms (Linux /proc; fields 14 and 15 in clock ticks). */
function serverCpuMs(pid: number): number {
  const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
  const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
  return ((Number(fields[11]) + Number(fields[12])) * 1000) / CLOCK_TICKS;
}

/** Percentiles in ms from HdrHistogram (the library autocannon itself uses), recorded in microseconds. */
function percentiles(ms: number[]): (p: number) => number {
  const h = hdr.build({ lowestDiscernibleValue: 1, highestTrackableValue: 600_000_000, numberOfSignificantValueDigits: 3 });
  for (const x of ms) h.recordValue(Math.max(1, Math.round(x * 1000)));
  return (p) => (ms.length ? h.getValueAtPercentile(p) / 1000 : NaN);
}

async function buildDatabase(env: NodeJS.ProcessEnv) {
  const ctx = await createContext(loadConfig(env));
  const db = ctx.db;
  try {
    // Top up the demo register to PLANTS plants (scripts/lib/top-up-plants.ts).
    await topUpPlants(db, PLANTS);
    const [ribes] = await db.select({ id: species.id }).from(species).where(eq(species.scientificName, 'Ribes nigrum'));
    const [open] = await db.select({ id: seasons.id }).from(seasons).where(eq(seasons.stage, 'requests_open'));
    const [wth] = await db.select({ id: farms.id }).from(farms).where(eq(farms.code, 'WTH'));
    const [plant] = await db
      .select({ id: motherPlants.id })
      .from(motherPlants)
      .where(and(eq(motherPlants.farmId, wth.id), eq(motherPlants.healthStatus, 'clean')))
      .orderBy(asc(motherPlants.code))
      .limit(1);
    const [{ n }] = ((await db.execute('select count(*)::int as n from mother_plants')) as unknown as { rows: { n: number }[] }).rows;
    return { plants: n, ribesId: ribes.id, seasonId: open.id, plantId: plant.id };
  } finally {
    await ctx.close();
  }
}

function startServer(env: NodeJS.ProcessEnv): { child: ChildProcess; tail: string[]; exited: () => string | null } {
  const child = spawn(process.execPath, [...(process.env.BENCH_SERVER_NODE_ARGS ?? '').split(' ').filter(Boolean), '--import', 'tsx', 'server/index.ts'], { cwd: ROOT, env, detached: true, stdio: ['ignore', 'pipe', 'pipe'] });
  const tail: string[] = [];
  let exited: string | null = null;
  const keep = (chunk: Buffer) => {
    tail.push(...chunk.toString().split('\n'));
    if (tail.length > 40) tail.splice(0, tail.length - 40);
  };
  child.stdout!.on('data', keep);
  child.stderr!.on('data', keep);
  child.on('exit', (code, signal) => (exited = `exit code ${code}, signal ${signal}`));
  return { child, tail, exited: () => exited };
}

async function waitHealthy(base: string, exited: () => string | null, tail: string[]) {
  const until = Date.now() + 120_000;
  for (;;) {
    if (exited()) throw new Error(`the server stopped (${exited()}):\n${tail.join('\n')}`);
    if (Date.now() > until) throw new Error(`the server did not answer /api/health in 120 s:\n${tail.join('\n')}`);
    try {
      const r = await fetch(`${base}/api/health`);
      if (r.ok) return;
    } catch {
      /* not listening yet */
    }
    await new Promise((r) => setTimeout(r, 200));
  }
}

/** Signs in through better-auth's HTTP endpoint; returns the Cookie header to send. */
async function signIn(base: string, email: string): Promise<string> {
  const res = await fetch(`${base}/api/auth/sign-in/email`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', origin: base },
    body: JSON.stringify({ email, password: PASSWORD }),
  });
  if (res.status !== 200) throw new Error(`sign-in as ${email} answered ${res.status}: ${await res.text()}`);
  const pairs = res.headers
    .getSetCookie()
    .map((c) => c.split(';')[0])
    .filter((pair) => !LOOKUP || !/session_data=/.test(pair));
  return pairs.join('; ');
}

function run(opts: Options, onResponse: (index: number, status: number, ms: number, bytes: number) => void): Promise<Result> {
  return new Promise((resolve, reject) => {
    const instance = autocannon(opts, (err, result) => (err ? reject(err) : resolve(result)));
    instance.on('response', (client, status, bytes, ms) => onResponse(client.requestIterator.currentRequestIndex, status, ms, bytes));
  });
}

async function main() {
  const dataDir = mkdtempSync(path.join(tmpdir(), 'heelwood-bench-load-'));
  const port = await freePort();
  const base = `http://localhost:${port}`;
  const env = {
    ...process.env,
    NODE_ENV: 'production',
    HOST: '127.0.0.1',
    PORT: String(port),
    PUBLIC_URL: base,
    DATA_DIR: dataDir,
    SEED_DEMO: 'true',
    LOG_REQUESTS: 'false',
    SMTP_URL: '',
    DATABASE_URL: '',
  };
  let server: ReturnType<typeof startServer> | undefined;
  try {
    let t = performance.now();
    const ids = await buildDatabase(env);
    console.log(`database: ${ids.plants} mother plants on disk in ${dataDir}, built in ${((performance.now() - t) / 1000).toFixed(1)} s`);

    t = performance.now();
    server = startServer(env);
    await waitHealthy(base, server.exited, server.tail);
    console.log(`server: node server/index.ts, NODE_ENV=production on ${base} (rate limiting on), ready in ${((performance.now() - t) / 1000).toFixed(1)} s`);

    const routesFor = (member: string, coordinator: string): { name: string; request: Request }[] => [
      { name: 'baseline GET /api/health', request: { path: '/api/health' } },
      { name: 'home: /api/me (member)', request: { path: '/api/me', headers: { cookie: member } } },
      { name: 'seasons list (member)', request: { path: '/api/seasons', headers: { cookie: member } } },
      { name: 'pending count (coordinator home)', request: { path: '/api/members?status=pending&page=1&pageSize=1', headers: { cookie: coordinator } } },
      {
        name: 'plant list, filtered (coordinator)',
        request: { path: `/api/mother-plants?speciesId=${ids.ribesId}&status=clean,watch&sort=variety&dir=asc&page=1&pageSize=25`, headers: { cookie: coordinator } },
      },
      { name: 'plant list, first page (member)', request: { path: '/api/mother-plants?page=1&pageSize=25', headers: { cookie: member } } },
      { name: 'plant page API (member)', request: { path: `/api/mother-plants/${ids.plantId}`, headers: { cookie: member } } },
      { name: 'map features (member)', request: { path: '/api/map/features', headers: { cookie: member } } },
      { name: 'season (member)', request: { path: `/api/seasons/${ids.seasonId}`, headers: { cookie: member } } },
      { name: 'wood board (member)', request: { path: `/api/seasons/${ids.seasonId}/board`, headers: { cookie: member } } },
      { name: 'health overview (coordinator)', request: { path: '/api/health/overview', headers: { cookie: coordinator } } },
    ];
    // The signed session cookie lasts 60 s: sign in again before a phase when it is older than 40 s.
    let signedInAt = -Infinity;
    let routes = routesFor('', '');
    const signedInRoutes = async () => {
      if (performance.now() - signedInAt > 40_000) {
        routes = routesFor(await signIn(base, 'lead@heelwood.test'), await signIn(base, 'coordinator@heelwood.test'));
        signedInAt = performance.now();
      }
      return routes;
    };

    // Every route must answer 200 before the run; a few rounds warm the server up.
    for (let round = 0; round < 5; round++) {
      for (const r of await signedInRoutes()) {
        const res = await fetch(base + r.request.path, { headers: r.request.headers });
        if (res.status !== 200) throw new Error(`${r.name} answered ${res.status}: ${await res.text()}`);
        await res.arrayBuffer();
      }
    }

    // What each route costs the server alone: its CPU time (from /proc, user + system) over
    // COST_RUNS requests one after another. CPU time is far less disturbed by other work on a
    // shared machine than latency is. (Before the run: after it the server may still be
    // answering requests that autocannon gave up on.)
    const cpuMs = new Map<number, number>();
    if (existsSync(`/proc/${server.child.pid}/stat`)) {
      for (let i = 0; i < routes.length; i++) {
        const r = (await signedInRoutes())[i];
        const before = serverCpuMs(server.child.pid!);
        for (let k = 0; k < COST_RUNS; k++) await (await fetch(base + r.request.path, { headers: r.request.headers })).arrayBuffer();
        cpuMs.set(i, (serverCpuMs(server.child.pid!) - before) / COST_RUNS);
      }
    }

    // One autocannon run over the routes; with `writeEveryMs`, the farm lead also saves a
    // plant's notes that often through the API (every save is a commit, so every kept answer
    // is rebuilt: the read cache at its worst).
    const lead = await signIn(base, 'lead@heelwood.test');
    const measure = async (writeEveryMs?: number) => {
      signedInAt = -Infinity;
      const loaded = await signedInRoutes();
      const latencies = loaded.map(() => [] as number[]);
      const non2xx = loaded.map(() => 0);
      const bytes = loaded.map(() => 0);
      const load = loadavg()[0];
      let writes = 0;
      let writeErrors = 0;
      const writer = writeEveryMs
        ? setInterval(() => {
            fetch(`${base}/api/mother-plants/${ids.plantId}`, {
              method: 'PATCH',
              headers: { cookie: lead, origin: base, 'content-type': 'application/json' },
              body: JSON.stringify({ notes: `bench write ${++writes}` }),
            }).then(
              (r) => {
                if (r.status !== 200) writeErrors++;
                return r.arrayBuffer();
              },
              () => writeErrors++,
            );
          }, writeEveryMs)
        : undefined;
      let result: Result;
      try {
        result = await run(
          { url: base, connections: CONNECTIONS, duration: SECONDS, timeout: 10, requests: loaded.map((r) => r.request) },
          (i, status, ms, b) => {
            latencies[i].push(ms);
            bytes[i] += b;
            if (status < 200 || status > 299) non2xx[i]++;
          },
        );
      } finally {
        clearInterval(writer);
      }
      return { loaded, latencies, non2xx, bytes, load, result, writes, writeErrors };
    };

    const { loaded, latencies, non2xx, bytes, load, result } = await measure();
    console.log(
      `autocannon: ${CONNECTIONS} connections, ${SECONDS} s, one run cycling ${loaded.length} routes per connection; ` +
        `sessions ${LOOKUP ? 'looked up per request (token cookie only)' : 'from the signed cookie cache'}; load average before ${load.toFixed(2)} (2 cores)`,
    );
    console.log(`latency in ms under load; cpuMs = server CPU per request alone (${COST_RUNS} in a row, before the run)`);
    console.log('route'.padEnd(38), 'n'.padStart(6), 'non2xx'.padStart(7), 'p50'.padStart(7), 'p95'.padStart(7), 'p99'.padStart(7), 'KB'.padStart(7), 'cpuMs'.padStart(7));
    loaded.forEach((r, i) => {
      const s = latencies[i];
      const pct = percentiles(s);
      const f = (x: number | undefined) => (x === undefined ? '-' : x.toFixed(1)).padStart(7);
      const kb = s.length ? (bytes[i] / s.length / 1024).toFixed(1) : '-';
      console.log(r.name.padEnd(38), String(s.length).padStart(6), String(non2xx[i]).padStart(7), f(pct(50)), f(pct(95)), f(pct(99)), kb.padStart(7), f(cpuMs.get(i)));
    });
    const app = latencies.slice(1).flat();
    const appPct = percentiles(app);
    console.log(`throughput ${(result.requests.total / result.duration).toFixed(0)} requests/s; socket errors ${result.errors - result.timeouts}, timeouts ${result.timeouts}`);

    // The same run while the data keeps changing.
    if (WRITE_EVERY_MS > 0) {
      const w = await measure(WRITE_EVERY_MS);
      const wApp = w.latencies.slice(1).flat();
      const wPct = percentiles(wApp);
      console.log(
        `with a plant saved every ${WRITE_EVERY_MS} ms (${w.writes} saves, ${w.writeErrors} failed; load before ${w.load.toFixed(2)}): ` +
          JSON.stringify({ requests: wApp.length, errors: w.result.non2xx + w.result.errors, p50Ms: +wPct(50).toFixed(1), p95Ms: +wPct(95).toFixed(1), p99Ms: +wPct(99).toFixed(1) }) +
          `; throughput ${(w.result.requests.total / w.result.duration).toFixed(0)} requests/s`,
      );
    }
    console.log(
      JSON.stringify({
        requests: app.length,
        errors: result.non2xx + result.errors,
        p50Ms: +appPct(50).toFixed(1),
        p95Ms: +appPct(95).toFixed(1),
        p99Ms: +appPct(99).toFixed(1),
      }),
    );
  } finally {
    if (server && !server.exited()) {
      process.kill(-server.child.pid!, 'SIGTERM');
      for (let i = 0; i < 100 && !server.exited(); i++) await new Promise((r) => setTimeout(r, 100));
      if (!server.exited()) process.kill(-server.child.pid!, 'SIGKILL');
    }
    rmSync(dataDir, { recursive: true, force: true });
  }
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
