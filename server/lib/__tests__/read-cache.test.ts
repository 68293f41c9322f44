// The read cache's snapshot rule, with a stand-in database whose queries finish when the test
// says: a request must never use a snapshot query that was already running when it arrived
// (that query may have run before a commit the caller has already seen).
import { describe, expect, it } from 'vitest';
import type { Db } from '../../db/client.js';
import { readCacheOf } from '../read-cache.js';

function fakeDb() {
  const pending: { resolve: (s: string) => void }[] = [];
  const db = {
    execute: () =>
      new Promise((resolve) => {
        pending.push({ resolve: (s: string) => resolve({ rows: [{ s }] }) });
      }),
  } as unknown as Db;
  return { db, pending };
}

const tick = () => new Promise((r) => setTimeout(r, 0));

describe('snapshot queries', () => {
  it('callers arriving while a query runs wait for the next one, which they share', async () => {
    const { db, pending } = fakeDb();
    const cache = readCacheOf(db);
    const a = cache.snapshot();
    await tick();
    expect(pending).toHaveLength(1);
    const b = cache.snapshot();
    const c = cache.snapshot();
    await tick();
    // b and c did not start a second query while the first runs, and do not take its answer.
    expect(pending).toHaveLength(1);
    pending[0].resolve('10:10:');
    expect(await a).toBe('10:10:');
    await tick();
    expect(pending).toHaveLength(2);
    pending[1].resolve('11:11:');
    expect(await b).toBe('11:11:');
    expect(await c).toBe('11:11:');
    expect(cache.stats().snapshots).toBe(2);
  });

  it('an answer is built once per key and snapshot, and again after the snapshot moves', async () => {
    const { db } = fakeDb();
    const cache = readCacheOf(db);
    let builds = 0;
    const build = async () => ({ n: ++builds });
    const first = await cache.answer('5:5:', 'u1|/x', build);
    const again = await cache.answer('5:5:', 'u1|/x', build);
    expect(again.body.toString()).toBe(first.body.toString());
    expect(builds).toBe(1);
    // Another caller, same address: its own answer.
    await cache.answer('5:5:', 'u2|/x', build);
    expect(builds).toBe(2);
    // The database moved on: built again.
    const moved = await cache.answer('6:6:', 'u1|/x', build);
    expect(JSON.parse(moved.body.toString())).toEqual({ n: 3 });
    // A request that read an older snapshot than the newest seen is answered but keeps nothing.
    await cache.answer('5:5:', 'u1|/x', build);
    await cache.answer('5:5:', 'u1|/x', build);
    expect(builds).toBe(5);
    expect(JSON.parse((await cache.answer('6:6:', 'u1|/x', build)).body.toString())).toEqual({ n: 3 });
  });

  it('a failed build is not kept', async () => {
    const { db } = fakeDb();
    const cache = readCacheOf(db);
    let calls = 0;
    const failing = async () => {
      calls++;
      if (calls === 1) throw new Error('not found');
      return { ok: true };
    };
    await expect(cache.answer('7:7:', 'k', failing)).rejects.toThrow('not found');
    await new Promise((r) => setTimeout(r, 0));
    expect(JSON.parse((await cache.answer('7:7:', 'k', failing)).body.toString())).toEqual({ ok: true });
  });
});
