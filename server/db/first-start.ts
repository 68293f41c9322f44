// The demo cooperative is written on the first start only, never over existing data.
import { hashPassword } from 'better-auth/crypto';
import { count, sql } from 'drizzle-orm';
import type { Db } from './client.js';
import { farms, user } from './schema/index.js';

export type SeedOutcome = { seeded: true; ms: number; counts: Record<string, unknown> } | { seeded: false; reason: string };

export async function hasData(db: Db): Promise<boolean> {
  const [[u], [f]] = await Promise.all([
    db.select({ n: count() }).from(user),
    db.select({ n: count() }).from(farms),
  ]);
  return u.n > 0 || f.n > 0;
}

export async function seedIfEmpty(db: Db): Promise<SeedOutcome> {
  if (await hasData(db)) return { seeded: false, reason: 'the database already has data' };
  const started = performance.now();
  const { seedDemo } = await import('./seed/seed-demo.js');
  const counts = await seedDemo(db, { hashPassword });
  // Fresh statistics, so the planner picks indexes for the register's filters at once.
  await db.execute(sql`analyze`);
  return { seeded: true, ms: Math.round(performance.now() - started), counts };
}
