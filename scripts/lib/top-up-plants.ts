// The benchmarks' register: the demo cooperative topped up to `total` mother plants, spread
// over the demo farms, varieties, roles and health statuses (invented data, for benchmarks only).
import { asc } from 'drizzle-orm';
import type { Db } from '../../server/db/client.js';
import { farms, motherPlants, varieties } from '../../server/db/schema/index.js';

export async function topUpPlants(db: Db, total: number): Promise<number> {
  const fs = await db.select().from(farms).orderBy(asc(farms.code));
  const vs = await db.select({ id: varieties.id, speciesId: varieties.speciesId }).from(varieties).orderBy(asc(varieties.id));
  const existing = (await db.select({ id: motherPlants.id }).from(motherPlants)).length;
  const statuses = ['clean', 'clean', 'clean', 'clean', 'watch', 'hold'] as const;
  const rows: (typeof motherPlants.$inferInsert)[] = [];
  for (let i = existing; i < total; i++) {
    const f = fs[i % fs.length];
    const v = vs[(i * 7) % vs.length];
    rows.push({
      code: `${f.code}-B${String(i).padStart(6, '0')}`,
      farmId: f.id,
      speciesId: v.speciesId,
      varietyId: v.id,
      plantingYear: 2008 + (i % 17),
      role: i % 3 ? 'stock_bed' : 'fruiting_bush',
      provenance: 'bought',
      healthStatus: statuses[i % statuses.length],
      lastInspectedOn: `2026-${String(1 + (i % 11)).padStart(2, '0')}-15`,
      lat: f.lat + ((i % 100) - 50) * 1e-5,
      lon: f.lon + ((i % 77) - 38) * 1e-5,
      bedRow: `Bed ${1 + (i % 12)}`,
    });
  }
  for (let i = 0; i < rows.length; i += 1000) await db.insert(motherPlants).values(rows.slice(i, i + 1000));
  return Math.max(existing, total);
}
