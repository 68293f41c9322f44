// Answers to reads, kept while the database has not changed.
//
// A request first reads the database's state, a text that changes whenever anything commits:
//  - embedded PGlite (one process owns it, data-dir-lock.ts): a count of the commits heard on
//    'heelwood_changed', which a trigger on every table notifies (migration 0003). PostgreSQL
//    delivers a notification only on commit, and PGlite hands it to the listener before the
//    committing call returns, so the count has moved before any caller can know of the write;
//  - a PostgreSQL server (other processes may write): `pg_current_snapshot()`, whose text
//    (`xmin:xmax:in-progress ids`) names exactly which transactions have committed.
// Any commit, from any route, job, script or test, gives the next request a new state, so an
// entry kept under an old one is never served again. Then:
//  - the caller (findActor: user, memberships, farms) is kept per state and user;
//  - a cacheable route's JSON is kept per state, caller, address and a 10-second clock
//    bucket (a few answers depend on today's date: look-back windows, open dates).
// The state is read before the data, so an answer is at least as new as its key; an answer
// built while another commit landed may be newer than its key, never older.
import { createHash } from 'node:crypto';
import { sql } from 'drizzle-orm';
import type { Database, Db } from '../db/client.js';

export type CachedBody = { body: Buffer; etag: string };

/** Upper bounds per database: entries, and bytes of kept answers. */
const MAX_ANSWERS = 2_000;
const MAX_BYTES = 64 * 1024 * 1024;
const MAX_ACTORS = 2_000;
/** Answers that depend on the date are at most this old. */
export const CLOCK_BUCKET_MS = 10_000;

export function serializeJson(value: unknown): CachedBody {
  const body = Buffer.from(JSON.stringify(value));
  return { body, etag: `W/"${body.length.toString(16)}-${createHash('sha1').update(body).digest('base64url')}"` };
}

export type ReadCache = {
  /** The database's current state (see above); how it is read is the cache's `mode`. */
  snapshot(): Promise<string>;
  mode: 'notify' | 'snapshot';
  /** A value kept under the snapshot (`state`): built once, shared by concurrent callers. */
  actor<T>(state: string, userId: string, build: () => Promise<T>): Promise<T>;
  answer(state: string, key: string, build: () => Promise<unknown>): Promise<CachedBody>;
  /** Figures for tests and benchmarks. */
  stats(): { snapshots: number; actorHits: number; actorMisses: number; answerHits: number; answerMisses: number; bytes: number };
};

/** Promises kept by key in insertion order, at most `max` of them and `maxBytes` of answers. */
class Kept<T> {
  private entries = new Map<string, Promise<T>>();
  private sizes = new Map<string, number>();
  bytes = 0;
  constructor(
    private readonly max: number,
    private readonly size?: (v: T) => number,
    private readonly maxBytes = Infinity,
  ) {}

  get(key: string, build: () => Promise<T>, counts: { hit(): void; miss(): void }): Promise<T> {
    const found = this.entries.get(key);
    if (found) {
      counts.hit();
      return found;
    }
    counts.miss();
    const made = build();
    this.entries.set(key, made);
    made.then(
      (value) => {
        if (!this.size || this.entries.get(key) !== made) return;
        const n = this.size(value);
        this.sizes.set(key, n);
        this.bytes += n;
        this.trim(key);
      },
      () => {
        if (this.entries.get(key) === made) this.drop(key);
      },
    );
    this.trim(key);
    return made;
  }

  private drop(key: string) {
    this.entries.delete(key);
    this.bytes -= this.sizes.get(key) ?? 0;
    this.sizes.delete(key);
  }

  /** Drops the oldest entries (never `keep`) while over either bound. */
  private trim(keep: string) {
    for (const k of this.entries.keys()) {
      if (this.entries.size <= this.max && this.bytes <= this.maxBytes) break;
      if (k !== keep) this.drop(k);
    }
  }
}

type StateSource = {
  mode: ReadCache['mode'];
  current(): Promise<string>;
  /** Whether state `a` is later than `b` (b may be '' for none yet). */
  newer(a: string, b: string): boolean;
};

/** A PostgreSQL server: one snapshot query at a time, shared by the requests waiting for it. */
function snapshotSource(db: Db, counts: { snapshots: number }): StateSource {
  // A request that arrives while a query runs must not use it (that query may have run before
  // a commit this caller has already seen): it waits for the next one, which all such share.
  let running: Promise<string> | null = null;
  let queued: Promise<string> | null = null;
  const query = async () => {
    counts.snapshots++;
    const result = (await db.execute(sql`select pg_current_snapshot()::text as s`)) as unknown as { rows: { s: string }[] };
    return result.rows[0].s;
  };
  const current = (): Promise<string> => {
    if (!running) {
      running = query().finally(() => (running = null));
      return running;
    }
    queued ??= running
      .catch(() => undefined)
      .then(() => {
        queued = null;
        return current();
      });
    return queued;
  };
  return { mode: 'snapshot', current, newer };
}

/** Embedded PGlite: the count of commits heard; `heard()` is the listener. */
function notifySource(): StateSource & { heard(): void } {
  let commits = 0;
  return {
    mode: 'notify',
    heard: () => void commits++,
    current: () => Promise.resolve(String(commits)),
    newer: (a, b) => b === '' || Number(a) > Number(b),
  };
}

function createReadCache(source: StateSource, stats: Stats): ReadCache {
  let state = '';
  let actors = new Kept<unknown>(MAX_ACTORS);
  let answers = new Kept<CachedBody>(MAX_ANSWERS, (v) => v.body.length, MAX_BYTES);
  const actorCounts = { hit: () => stats.actorHits++, miss: () => stats.actorMisses++ };
  const answerCounts = { hit: () => stats.answerHits++, miss: () => stats.answerMisses++ };

  /** Moves the cache to `s`; false when `s` is not the newest snapshot seen (keep nothing). */
  const at = (s: string): boolean => {
    if (s === state) return true;
    if (!source.newer(s, state)) return false;
    state = s;
    actors = new Kept<unknown>(MAX_ACTORS);
    answers = new Kept<CachedBody>(MAX_ANSWERS, (v) => v.body.length, MAX_BYTES);
    return true;
  };

  return {
    snapshot: source.current,
    mode: source.mode,
    actor<T>(s: string, userId: string, build: () => Promise<T>): Promise<T> {
      if (!at(s)) return build();
      return (actors as Kept<T>).get(userId, build, actorCounts);
    },
    answer(s, key, build) {
      if (!at(s)) return build().then(serializeJson);
      const bucket = Math.floor(Date.now() / CLOCK_BUCKET_MS);
      return answers.get(`${bucket}|${key}`, () => build().then(serializeJson), answerCounts);
    },
    stats: () => ({ ...stats, bytes: answers.bytes }),
  };
}

/**
 * Whether snapshot `a` is later than `b` (`xmin:xmax:xip,...`, ids as text). Snapshots only
 * move forward: a later one has a larger xmax, or the same xmax with fewer transactions in
 * progress. Unparsable text is treated as newer, so the cache starts over rather than serve
 * something old.
 */
export function newer(a: string, b: string): boolean {
  if (!b) return true;
  const pa = a.split(':');
  const pb = b.split(':');
  if (pa.length !== 3 || pb.length !== 3) return true;
  const xa = BigInt(pa[1]);
  const xb = BigInt(pb[1]);
  if (xa !== xb) return xa > xb;
  const inProgress = (x: string) => (x ? x.split(',').length : 0);
  return inProgress(pa[2]) < inProgress(pb[2]) || BigInt(pa[0]) > BigInt(pb[0]);
}

type Stats = { snapshots: number; actorHits: number; actorMisses: number; answerHits: number; answerMisses: number };
const newStats = (): Stats => ({ snapshots: 0, actorHits: 0, actorMisses: 0, answerHits: 0, answerMisses: 0 });

const caches = new WeakMap<Db, ReadCache>();

/**
 * The read cache of one database (tests run several apps, on different databases, in one
 * process). Until `startReadCache` has run for it, it reads snapshots.
 */
export function readCacheOf(db: Db): ReadCache {
  let c = caches.get(db);
  if (!c) {
    const stats = newStats();
    caches.set(db, (c = createReadCache(snapshotSource(db, stats), stats)));
  }
  return c;
}

/** At start, after the migrations: an embedded database is followed by its notifications. */
export async function startReadCache(database: Database): Promise<void> {
  if (!database.listen) {
    readCacheOf(database.db);
    return;
  }
  const stats = newStats();
  const source = notifySource();
  await database.listen('heelwood_changed', source.heard);
  caches.set(database.db, createReadCache(source, stats));
}
