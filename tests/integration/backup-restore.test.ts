// `npm run backup` and `npm run restore` end to end: a changed demo cooperative backed up and
// restored into a fresh place holds the same rows (count and checksum of every table), the
// same photos and sign-in secret; refusals (running server, non-empty target) and damaged
// backups (truncated, altered, from a newer Heelwood) change nothing in the target. With
// TEST_DATABASE_URL: pg_dump/pg_restore round trip, and moving an embedded database into a
// PostgreSQL server.
import { execFile } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, truncateSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { sql } from 'drizzle-orm';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { BackupError, createBackup, restoreBackup, type StorageConfig } from '../../server/db/backup.js';
import { openDatabase } from '../../server/db/client.js';
import { lockDataDir } from '../../server/db/data-dir-lock.js';
import { seedIfEmpty } from '../../server/db/first-start.js';
import { databaseUrl, dropDatabase, freshName, recreateDatabase } from '../fixtures/pg.js';
import { ROOT } from '../fixtures/server-process.js';

const migrationsFolder = path.join(ROOT, 'drizzle');
const work = mkdtempSync(path.join(tmpdir(), 'heelwood-backup-test-'));
const srcDir = path.join(work, 'source');
const PHOTO = 'ab/cd/plant-photo.jpg';
const PHOTO_BYTES = Buffer.from('not really a jpeg, but bytes to compare');
const SECRET = 'a-sign-in-secret-of-this-cooperative-0123456789abcdef';

type Sums = Record<string, { n: number; h: string }>;
type Query = (text: string) => Promise<Record<string, unknown>[]>;

/** Row count and an md5 of every row's text, in a fixed order, for each public table. */
async function checksums(q: Query): Promise<Sums> {
  // The same text for timestamps on both engines.
  await q(`set timezone = 'UTC'`);
  await q(`set datestyle = 'ISO, YMD'`);
  const tables = (await q(`select table_name as t from information_schema.tables where table_schema = 'public' and table_type = 'BASE TABLE' order by 1`)).map((r) => String(r.t));
  const out: Sums = {};
  for (const t of tables) {
    const [r] = await q(`select count(*)::int as n, coalesce(md5(string_agg(x::text, E'\\n' order by x::text)), '') as h from public."${t}" x`);
    out[t] = { n: Number(r.n), h: String(r.h) };
  }
  return out;
}

async function pgliteSums(dataDir: string): Promise<Sums> {
  const database = await openDatabase({ dataDir: path.join(dataDir, 'pglite'), migrationsFolder });
  try {
    return await checksums(async (text) => ((await database.db.execute(sql.raw(text))) as unknown as { rows: Record<string, unknown>[] }).rows);
  } finally {
    await database.close();
  }
}

async function pgSums(url: string): Promise<Sums> {
  const c = new pg.Client({ connectionString: url });
  await c.connect();
  try {
    return await checksums(async (text) => (await c.query(text)).rows);
  } finally {
    await c.end();
  }
}

function npmRun(script: string, args: string[], env: Record<string, string>) {
  return new Promise<{ code: number; stdout: string; stderr: string }>((resolve) => {
    execFile('npm', ['run', '--silent', script, '--', ...args], { cwd: ROOT, env: { ...process.env, DATABASE_URL: '', ...env } }, (err, stdout, stderr) => {
      resolve({ code: err ? Number((err as { code?: number }).code ?? 1) : 0, stdout, stderr });
    });
  });
}

const storage = (dataDir: string, url?: string): StorageConfig => ({ dataDir, databaseUrl: url, migrationsFolder });

let sourceSums: Sums;
const backupFile = path.join(work, 'heelwood.backup');

beforeAll(async () => {
  // The demo cooperative on disk (from the run's template when there is one), then changed.
  mkdirSync(srcDir, { recursive: true });
  const template = inject('templates').seeded;
  const database = await openDatabase({
    dataDir: path.join(srcDir, 'pglite'),
    loadDataDir: template ? new Blob([readFileSync(template)]) : undefined,
    migrationsFolder,
  });
  try {
    if (!template) {
      await database.migrate();
      await seedIfEmpty(database.db);
    }
    await database.db.execute(sql`update farms set name = name || ' (renamed before the backup)' where code = (select min(code) from farms)`);
    await database.db.execute(sql`delete from audit_log where id in (select id from audit_log order by at, id limit 1)`);
  } finally {
    await database.close();
  }
  mkdirSync(path.join(srcDir, 'photos', path.dirname(PHOTO)), { recursive: true });
  writeFileSync(path.join(srcDir, 'photos', PHOTO), PHOTO_BYTES);
  writeFileSync(path.join(srcDir, 'auth-secret'), `${SECRET}\n`);
  sourceSums = await pgliteSums(srcDir);
}, 240_000);

afterAll(() => rmSync(work, { recursive: true, force: true }));

describe('embedded database (PGlite)', () => {
  const dst = path.join(work, 'restored');

  it('refuses to back up while a server holds the data directory', { timeout: 120_000 }, async () => {
    const lock = lockDataDir(srcDir, 'the Heelwood server');
    try {
      const r = await npmRun('backup', ['--out', backupFile], { DATA_DIR: srcDir });
      expect(r.code).toBe(1);
      expect(r.stderr).toMatch(/in use by the Heelwood server .*stopped/s);
      expect(existsSync(backupFile)).toBe(false);
    } finally {
      lock.release();
    }
  });

  it('backs up and restores into a fresh data directory: every table, photos and secret the same', { timeout: 240_000 }, async () => {
    const b = await npmRun('backup', ['--out', backupFile], { DATA_DIR: srcDir });
    expect(b.stderr).toBe('');
    expect(b.code).toBe(0);
    expect(b.stdout).toMatch(/Backup written to/);
    const r = await npmRun('restore', ['--from', backupFile], { DATA_DIR: dst });
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);

    const restored = await pgliteSums(dst);
    expect(Object.keys(restored).length).toBeGreaterThan(10);
    expect(restored).toEqual(sourceSums);
    // The change made before the backup is there.
    expect(sourceSums.farms.n).toBeGreaterThan(0);
    expect(readFileSync(path.join(dst, 'photos', PHOTO))).toEqual(PHOTO_BYTES);
    expect(readFileSync(path.join(dst, 'auth-secret'), 'utf8').trim()).toBe(SECRET);
    expect(existsSync(path.join(dst, 'heelwood.pid'))).toBe(false);
  });

  it('refuses to overwrite a restored target without --force; with --force keeps the old data aside', { timeout: 240_000 }, async () => {
    const before = await pgliteSums(dst);
    const refused = await npmRun('restore', ['--from', backupFile], { DATA_DIR: dst });
    expect(refused.code).toBe(1);
    expect(refused.stderr).toMatch(/already holds .*--force/);
    expect(await pgliteSums(dst)).toEqual(before);

    const forced = await restoreBackup(storage(dst), backupFile, { force: true });
    expect(forced.keptPrevious.some((k) => path.basename(k).startsWith('pglite.before-restore-'))).toBe(true);
    expect(await pgliteSums(dst)).toEqual(sourceSums);
  });

  it('refuses a truncated backup with a clear error and leaves the target untouched', { timeout: 240_000 }, async () => {
    const cut = path.join(work, 'truncated.backup');
    writeFileSync(cut, readFileSync(backupFile));
    truncateSync(cut, Math.floor(readFileSync(cut).length * 0.6));
    const listing = readdirSync(dst).sort();
    const before = await pgliteSums(dst);
    await expect(restoreBackup(storage(dst), cut, { force: true })).rejects.toThrow(/damaged or incomplete|incomplete|damaged/);
    await expect(restoreBackup(storage(dst), cut, { force: true })).rejects.toBeInstanceOf(BackupError);
    expect(readdirSync(dst).sort()).toEqual(listing);
    expect(await pgliteSums(dst)).toEqual(before);
    // Into an empty place: nothing is created.
    const empty = path.join(work, 'empty-target');
    await expect(restoreBackup(storage(empty), cut)).rejects.toThrow(BackupError);
    expect(existsSync(path.join(empty, 'pglite'))).toBe(false);
  });

  it('refuses a backup whose bytes were altered (checksum), and one from a newer Heelwood', { timeout: 240_000 }, async () => {
    const listing = readdirSync(dst).sort();
    const altered = path.join(work, 'altered.backup');
    const bytes = readFileSync(backupFile);
    const mid = Math.floor(bytes.length / 2);
    for (let i = 0; i < 16; i++) bytes[mid + i] ^= 0xff;
    writeFileSync(altered, bytes);
    await expect(restoreBackup(storage(dst), altered, { force: true })).rejects.toThrow(/does not match its checksum/);

    // A manifest that lists a migration this code does not have.
    const unpacked = mkdtempSync(path.join(work, 'unpacked-'));
    await new Promise((res, rej) => execFile('tar', ['-xf', backupFile, '-C', unpacked], (e) => (e ? rej(e) : res(null))));
    const manifest = JSON.parse(readFileSync(path.join(unpacked, 'manifest.json'), 'utf8'));
    manifest.database.migrations.push({ hash: 'f'.repeat(64), createdAt: 4102444800000 });
    writeFileSync(path.join(unpacked, 'manifest.json'), JSON.stringify(manifest));
    const newer = path.join(work, 'newer.backup');
    await new Promise((res, rej) => execFile('tar', ['-cf', newer, '-C', unpacked, ...readdirSync(unpacked)], (e) => (e ? rej(e) : res(null))));
    await expect(restoreBackup(storage(dst), newer, { force: true })).rejects.toThrow(/newer than this Heelwood/);

    // Not a backup at all.
    const junk = path.join(work, 'junk.backup');
    writeFileSync(junk, 'hello');
    await expect(restoreBackup(storage(dst), junk, { force: true })).rejects.toThrow(/damaged or incomplete/);
    expect(readdirSync(dst).sort()).toEqual(listing);
    expect(await pgliteSums(dst)).toEqual(sourceSums);
  });
});

const pgt = inject('pgTemplates');
describe.skipIf(!pgt)('PostgreSQL server (TEST_DATABASE_URL)', () => {
  const names: string[] = [];
  const fresh = async (template?: string) => {
    const name = freshName();
    names.push(name);
    await recreateDatabase(pgt!.adminUrl, name, template);
    return databaseUrl(pgt!.adminUrl, name);
  };
  afterAll(async () => {
    for (const n of names) await dropDatabase(pgt!.adminUrl, n);
  });

  it('backs up with pg_dump and restores with pg_restore: every table the same', { timeout: 240_000 }, async () => {
    const source = await fresh(pgt!.seeded);
    const c = new pg.Client({ connectionString: source });
    await c.connect();
    await c.query(`update farms set name = name || ' (renamed)' where code = (select min(code) from farms)`);
    await c.end();
    const dataDir = mkdtempSync(path.join(work, 'pg-src-'));
    const file = path.join(work, 'pg.backup');
    const made = await createBackup(storage(dataDir, source), file);
    expect(made.manifest.database.kind).toBe('postgres');

    const target = await fresh();
    const targetDir = mkdtempSync(path.join(work, 'pg-dst-'));
    await restoreBackup(storage(targetDir, target), file);
    expect(await pgSums(target)).toEqual(await pgSums(source));

    // The target now has data: refused without --force, and unchanged.
    await expect(restoreBackup(storage(targetDir, target), file)).rejects.toThrow(/already holds data: add --force/);
    // A damaged dump is refused before the target is touched.
    const cut = path.join(work, 'pg-truncated.backup');
    writeFileSync(cut, readFileSync(file).subarray(0, Math.floor(readFileSync(file).length * 0.7)));
    const before = await pgSums(target);
    await expect(restoreBackup(storage(targetDir, target), cut, { force: true })).rejects.toThrow(BackupError);
    expect(await pgSums(target)).toEqual(before);
  });

  it('moves an embedded database into a PostgreSQL server: every table the same', { timeout: 240_000 }, async () => {
    expect(existsSync(backupFile), 'made by the PGlite round trip above').toBe(true);
    const target = await fresh();
    const targetDir = mkdtempSync(path.join(work, 'move-'));
    const r = await npmRun('restore', ['--from', backupFile], { DATA_DIR: targetDir, DATABASE_URL: target });
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/copied from an embedded-database backup/);
    expect(await pgSums(target)).toEqual(sourceSums);
    expect(readFileSync(path.join(targetDir, 'photos', PHOTO))).toEqual(PHOTO_BYTES);
  });
});
