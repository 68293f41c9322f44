// Change counters kept by the database itself: a trigger bumps a row whenever a statement
// changes one of the tables it watches (migration 0002), whoever wrote — any route, a job,
// a script, another server process. A cache keyed by the counter is never stale.
import { bigint, pgTable, text } from 'drizzle-orm/pg-core';

export const dataVersions = pgTable('data_versions', {
  /** 'register': mother_plants, farms, species, varieties (what the map draws). */
  name: text().primaryKey(),
  version: bigint({ mode: 'number' }).notNull().default(0),
});
