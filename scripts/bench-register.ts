// bench:register — 10,000 mother plants in a temporary database; times the plant list
// endpoint (first page, sorted and filtered, through HTTP, sign-in and JSON) against the bare
// database query for the same page, in the same run. Last line: one JSON object.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { eq } from 'drizzle-orm';
import { createApp } from '../server/app.js';
import { loadConfig } from '../server/config.js';
import { createContext } from '../server/context.js';
import { species } from '../server/db/schema/index.js';
import { listPlants } from '../server/modules/mother-plants/mother-plants.repo.js';
import { lookbackStart } from '../shared/health-rules.js';
import { plantListQuerySchema } from '../shared/schemas/register.js';
import { freePort } from '../tests/fixtures/free-port.js';
import { Client } from '../tests/fixtures/http.js';
import { topUpPlants } from './lib/top-up-plants.js';

const PLANTS = Number(process.env.BENCH_PLANTS ?? 10_000);
const RUNS = Number(process.env.BENCH_RUNS ?? 60);
const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length % 2 ? s[(s.length - 1) / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
};

async function main() {
  const dataDir = mkdtempSync(path.join(tmpdir(), 'heelwood-bench-'));
  const port = await freePort();
  const config = loadConfig({ NODE_ENV: 'test', PORT: String(port), DATA_DIR: dataDir, SEED_DEMO: 'true' });
  const ctx = await createContext(config, { inMemory: true });
  const db = ctx.db;
  try {
    // Top up the demo register to PLANTS plants (scripts/lib/top-up-plants.ts).
    await topUpPlants(db, PLANTS);
    const [ribes] = await db.select({ id: species.id }).from(species).where(eq(species.scientificName, 'Ribes nigrum'));

    const app = await createApp(ctx);
    const server = app.listen(port, '127.0.0.1');
    await new Promise((r) => server.once('listening', r));
    const client = new Client(`http://localhost:${port}`);
    await client.signIn('coordinator@heelwood.test', 'heelwood-demo');

    const qs = `speciesId=${ribes.id}&status=clean,watch&sort=variety&dir=asc&page=1&pageSize=25`;
    const filters = plantListQuerySchema.parse(Object.fromEntries(new URLSearchParams(qs)));
    const since = lookbackStart(12, new Date());

    // Warm both paths, then alternate them so machine noise hits both alike.
    for (let i = 0; i < 5; i++) {
      await client.get(`/api/mother-plants?${qs}`);
      await listPlants(db, filters, { all: true }, since);
    }
    const endpoint: number[] = [];
    const query: number[] = [];
    let total = 0;
    for (let i = 0; i < RUNS; i++) {
      let t = performance.now();
      const r = await client.get(`/api/mother-plants?${qs}`);
      endpoint.push(performance.now() - t);
      if (r.status !== 200) throw new Error(`endpoint answered ${r.status}`);
      total = r.body.total;
      t = performance.now();
      await listPlants(db, filters, { all: true }, since);
      query.push(performance.now() - t);
    }
    server.closeAllConnections();
    server.close();
    const [{ n }] = ((await db.execute('select count(*)::int as n from mother_plants')) as unknown as { rows: { n: number }[] }).rows;
    const e = median(endpoint);
    const q = median(query);
    console.log(`matching plants: ${total} of ${n}; ${RUNS} runs each`);
    console.log(JSON.stringify({ plants: n, endpointMedianMs: +e.toFixed(2), queryMedianMs: +q.toFixed(2), ratio: +(e / q).toFixed(2) }));
  } finally {
    await ctx.close();
    rmSync(dataDir, { recursive: true, force: true });
  }
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
