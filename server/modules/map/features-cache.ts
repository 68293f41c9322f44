// The map's features, kept serialized between requests. With 10,000 plants they are about
// 1.6 MB of JSON and the costliest read of the app to build, and everyone opening the map asks
// for one of a few variants. An entry is keyed by the filters and by what the caller may see
// (coordinator, or their farms and roles: mapFeatures' only inputs besides the data), and the
// whole cache by the database's 'register' counter, which triggers move on every change to
// mother plants, farms, species and varieties (migration 0002): a change made anywhere (any
// route, a job, a script) is seen by the next request.
import { eq } from 'drizzle-orm';
import type { Actor } from '../../auth/guards.js';
import type { Db } from '../../db/client.js';
import { dataVersions } from '../../db/schema/index.js';
import { type CachedBody, serializeJson } from '../../lib/read-cache.js';
import { isCoordinator } from '../mother-plants/plant-access.js';

/** Variants kept at once: a few filter combinations times a few farms' viewpoints. */
const MAX_ENTRIES = 24;

/** What decides the caller's view of the map: everything for a coordinator, else their farms. */
function viewerKey(a: Actor): string {
  if (isCoordinator(a)) return 'coordinator';
  return a.farms
    .map((f) => `${f.farmId}:${f.farmRole}`)
    .sort()
    .join(',');
}

export type FeaturesCache = {
  /** `state`: the request's database state (read-cache.ts); while it stays the same, so does the counter. */
  get(db: Db, a: Actor, filters: object, build: () => Promise<unknown>, state?: string): Promise<CachedBody>;
};

/** One cache per app (tests run several apps, on different databases, in one process). */
export function createFeaturesCache(): FeaturesCache {
  let version = -1;
  /** The request state at which `version` was last read. */
  let counterState: string | undefined;
  // Promises, so that requests arriving while a variant is being built wait for that build.
  const entries = new Map<string, Promise<CachedBody>>();
  return {
    async get(db, a, filters, build, state) {
      // Read the counter before the data: whatever is built next is at least this new. The
      // same database state has the same counter: read it once per state.
      let current: number | undefined;
      if (state !== undefined && state === counterState) current = version;
      else {
        const [row] = await db.select({ version: dataVersions.version }).from(dataVersions).where(eq(dataVersions.name, 'register'));
        current = row?.version;
        if (state !== undefined && current !== undefined && current >= version) counterState = state;
      }
      // No counter row, or a request that read the counter before a newer one was seen: build without the cache.
      if (current === undefined || current < version) return serializeJson(await build());
      if (current > version) {
        entries.clear();
        version = current;
      }
      const key = `${viewerKey(a)}|${JSON.stringify(filters)}`;
      let entry = entries.get(key);
      if (!entry) {
        const made = build().then(serializeJson);
        entry = made;
        entries.set(key, made);
        made.catch(() => {
          if (entries.get(key) === made) entries.delete(key);
        });
        // Map keeps insertion order: drop the oldest variant.
        if (entries.size > MAX_ENTRIES) entries.delete(entries.keys().next().value!);
      }
      return entry;
    },
  };
}
