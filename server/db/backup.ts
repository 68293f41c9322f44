// Backup and restore of everything a cooperative keeps: the database, the photos and the
// sign-in secret in DATA_DIR. One file, a tar archive (made and read by the system's `tar`)
// holding manifest.json, the database and the photos; the manifest lists every file with
// its size and SHA-256, the database's migrations and each table's row count, so a restore
// checks the whole backup before it touches anything.
//
// Embedded database (PGlite): the backup is PGlite's own data-directory dump, taken with the
// server stopped (DATA_DIR/heelwood.pid names a live server: refused). PostgreSQL server
// (DATABASE_URL): pg_dump's custom format from Debian's postgresql-client, taken in one
// snapshot while the server may keep running; restored with pg_restore in one transaction.
// A PGlite backup restored with DATABASE_URL set copies every table into that server: how a
// cooperative moves from the embedded database to a PostgreSQL server.
import { execFile } from 'node:child_process';
import { createHash, randomBytes } from 'node:crypto';
import {
  cpSync,
  createReadStream,
  existsSync,
  lstatSync,
  mkdirSync,
  mkdtempSync,
  readdirSync,
  readFileSync,
  renameSync,
  rmSync,
  statSync,
  writeFileSync,
} from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { promisify } from 'node:util';
import { sql } from 'drizzle-orm';
import { readMigrationFiles } from 'drizzle-orm/migrator';
import pg from 'pg';
import { z } from 'zod';
import { type Database, openDatabase } from './client.js';
import { DataDirBusyError, lockDataDir } from './data-dir-lock.js';

const run = promisify(execFile);

export class BackupError extends Error {}

export type StorageConfig = { dataDir: string; databaseUrl?: string; migrationsFolder: string };

const PGLITE_FILE = 'database.tar.gz';
const PGDUMP_FILE = 'database.pgdump';
const MANIFEST = 'manifest.json';
const PHOTOS = 'photos';
const SECRET = 'auth-secret';

const migrationSchema = z.object({ hash: z.string().min(1), createdAt: z.number().int() });
const manifestSchema = z.object({
  format: z.literal('heelwood-backup', { error: 'not a Heelwood backup' }),
  formatVersion: z.literal(1, { error: 'a backup format this Heelwood cannot read' }),
  createdAt: z.string(),
  database: z.object({
    kind: z.enum(['pglite', 'postgres']),
    file: z.enum([PGLITE_FILE, PGDUMP_FILE]),
    migrations: z.array(migrationSchema),
    tables: z.record(z.string(), z.number().int().min(0)),
  }),
  files: z.array(z.object({ path: z.string().min(1), bytes: z.number().int().min(0), sha256: z.string().regex(/^[0-9a-f]{64}$/) })),
});
export type Manifest = z.infer<typeof manifestSchema>;

// --- helpers ------------------------------------------------------------------------------

async function tool(name: string, args: string[], env?: NodeJS.ProcessEnv, what?: string): Promise<string> {
  try {
    const { stdout } = await run(name, args, { env: env ? { ...process.env, ...env } : process.env, maxBuffer: 64 * 1024 * 1024 });
    return stdout;
  } catch (err) {
    const e = err as NodeJS.ErrnoException & { stderr?: string };
    if (e.code === 'ENOENT') {
      throw new BackupError(
        name.startsWith('pg_')
          ? `${name} was not found. Install PostgreSQL's client tools (Debian: apt-get install postgresql-client), of the server's major version or newer.`
          : `${name} was not found on this machine; it is needed to ${what ?? 'continue'}.`,
      );
    }
    throw new BackupError(`${what ? `${what}: ` : ''}${name} failed: ${(e.stderr || e.message).trim()}`);
  }
}

function sha256(file: string): Promise<string> {
  return new Promise((resolve, reject) => {
    const h = createHash('sha256');
    createReadStream(file)
      .on('data', (d) => h.update(d))
      .on('error', reject)
      .on('end', () => resolve(h.digest('hex')));
  });
}

/** Every regular file under dir, as paths relative to it with '/'; refuses links. */
function walk(dir: string, base = dir): string[] {
  const out: string[] = [];
  for (const name of readdirSync(dir).sort()) {
    const full = path.join(dir, name);
    const st = lstatSync(full);
    if (st.isSymbolicLink()) throw new BackupError(`The backup holds a link (${path.relative(base, full)}); a Heelwood backup never does.`);
    if (st.isDirectory()) out.push(...walk(full, base));
    else if (st.isFile()) out.push(path.relative(base, full).split(path.sep).join('/'));
  }
  return out;
}

const nonEmptyDir = (dir: string) => existsSync(dir) && readdirSync(dir).length > 0;
const stamp = () => new Date().toISOString().replace(/[:.]/g, '-');

/** The code's migrations, oldest first, with their names from the journal. */
function codeMigrations(migrationsFolder: string) {
  const journal = JSON.parse(readFileSync(path.join(migrationsFolder, 'meta', '_journal.json'), 'utf8')) as { entries: { when: number; tag: string }[] };
  const tags = new Map(journal.entries.map((e) => [e.when, e.tag]));
  return readMigrationFiles({ migrationsFolder }).map((m) => ({ hash: m.hash, createdAt: m.folderMillis, tag: tags.get(m.folderMillis) ?? String(m.folderMillis) }));
}

/**
 * A backup may be older than the code (the server applies the missing migrations at start)
 * but never newer or from another line of migrations.
 */
function checkMigrations(backup: Manifest['database']['migrations'], migrationsFolder: string): { behind: number } {
  const code = codeMigrations(migrationsFolder);
  if (backup.length === 0) throw new BackupError('The backup\'s database has no Heelwood migrations applied: it is not a Heelwood database.');
  for (let i = 0; i < backup.length; i++) {
    const mine = code[i];
    if (!mine || mine.createdAt !== backup[i].createdAt || mine.hash !== backup[i].hash) {
      throw new BackupError(
        mine
          ? `The backup's database migration ${i + 1} differs from this Heelwood's (${mine.tag}): it was made by a different version. Restore it with the Heelwood that made it.`
          : `The backup's database is at migration ${backup.length}, newer than this Heelwood's ${code.length}: update Heelwood first.`,
      );
    }
  }
  return { behind: code.length - backup.length };
}

async function execRows<T>(database: Database, query: ReturnType<typeof sql>): Promise<T[]> {
  return ((await database.db.execute(query)) as unknown as { rows: T[] }).rows;
}

async function dbMigrations(database: Database) {
  const [exists] = await execRows<{ ok: boolean }>(database, sql`select to_regclass('drizzle.__drizzle_migrations') is not null as ok`);
  if (!exists.ok) return [];
  const rows = await execRows<{ hash: string; created_at: string | number }>(database, sql`select hash, created_at from drizzle.__drizzle_migrations order by created_at`);
  return rows.map((r) => ({ hash: r.hash, createdAt: Number(r.created_at) }));
}

/** The public schema's tables, by name. */
async function publicTables(q: (text: string) => Promise<{ rows: Record<string, unknown>[] }>): Promise<string[]> {
  const r = await q(`select table_name as name from information_schema.tables where table_schema = 'public' and table_type = 'BASE TABLE' order by table_name`);
  return r.rows.map((x) => String(x.name));
}

const ident = (name: string) => `"${name.replace(/"/g, '""')}"`;

async function rowCounts(q: (text: string) => Promise<{ rows: Record<string, unknown>[] }>): Promise<Record<string, number>> {
  const counts: Record<string, number> = {};
  for (const t of await publicTables(q)) counts[t] = Number((await q(`select count(*)::int as n from public.${ident(t)}`)).rows[0].n);
  return counts;
}

const drizzleQuery = (database: Database) => async (text: string) => execRows<Record<string, unknown>>(database, sql.raw(text)).then((rows) => ({ rows }));

function compareCounts(expected: Record<string, number>, actual: Record<string, number>, where: string) {
  const wrong = Object.entries(expected).filter(([t, n]) => actual[t] !== n);
  if (wrong.length) {
    throw new BackupError(`After restoring, ${where} does not hold what the backup lists: ${wrong.map(([t, n]) => `${t} ${actual[t] ?? 'missing'} rows, expected ${n}`).join('; ')}.`);
  }
}

/** Connection settings for the pg_* tools, with the password kept off the command line. */
function pgToolEnv(databaseUrl: string): { dbname: string; env: NodeJS.ProcessEnv } {
  const u = new URL(databaseUrl);
  const password = decodeURIComponent(u.password);
  u.password = '';
  return { dbname: u.toString(), env: password ? { PGPASSWORD: password } : {} };
}

function takeLock(dataDir: string, holder: string) {
  try {
    return lockDataDir(dataDir, holder);
  } catch (err) {
    if (err instanceof DataDirBusyError) {
      throw new BackupError(`${err.message} The embedded database can only be backed up or restored while the server is stopped.`);
    }
    throw err;
  }
}

// --- backup -------------------------------------------------------------------------------

export type BackupOutcome = { file: string; manifest: Manifest; bytes: number };

export async function createBackup(storage: StorageConfig, out: string): Promise<BackupOutcome> {
  const target = path.resolve(out);
  if (!existsSync(path.dirname(target))) throw new BackupError(`--out: the folder ${path.dirname(target)} does not exist.`);
  if (existsSync(target) && statSync(target).isDirectory()) throw new BackupError(`--out: ${target} is a folder; give a file name.`);
  const staging = mkdtempSync(path.join(tmpdir(), 'heelwood-backup-'));
  try {
    let database: Manifest['database'];
    if (storage.databaseUrl) {
      database = await dumpPostgres(storage.databaseUrl, path.join(staging, PGDUMP_FILE));
      copyFiles(storage.dataDir, staging);
    } else {
      const dir = path.join(storage.dataDir, 'pglite');
      if (!nonEmptyDir(dir)) throw new BackupError(`There is no embedded database in ${dir} (DATA_DIR is ${storage.dataDir}).`);
      const lock = takeLock(storage.dataDir, 'npm run backup');
      try {
        database = await dumpPglite(dir, path.join(staging, PGLITE_FILE));
        copyFiles(storage.dataDir, staging);
      } finally {
        lock.release();
      }
    }
    const files = [];
    for (const rel of walk(staging)) {
      const full = path.join(staging, rel);
      files.push({ path: rel, bytes: statSync(full).size, sha256: await sha256(full) });
    }
    const manifest: Manifest = { format: 'heelwood-backup', formatVersion: 1, createdAt: new Date().toISOString(), database, files };
    writeFileSync(path.join(staging, MANIFEST), `${JSON.stringify(manifest, null, 2)}\n`);
    // Written beside the target and renamed, so a failed backup never leaves a partial file
    // under the name asked for.
    const partial = `${target}.partial-${randomBytes(4).toString('hex')}`;
    try {
      await tool('tar', ['-cf', partial, '-C', staging, MANIFEST, ...readdirSync(staging).filter((n) => n !== MANIFEST).sort()], undefined, 'write the backup file');
      renameSync(partial, target);
    } finally {
      rmSync(partial, { force: true });
    }
    return { file: target, manifest, bytes: statSync(target).size };
  } finally {
    rmSync(staging, { recursive: true, force: true });
  }
}

function copyFiles(dataDir: string, staging: string) {
  const photos = path.join(dataDir, PHOTOS);
  if (existsSync(photos)) cpSync(photos, path.join(staging, PHOTOS), { recursive: true });
  const secret = path.join(dataDir, SECRET);
  if (existsSync(secret)) cpSync(secret, path.join(staging, SECRET));
}

async function dumpPglite(dir: string, file: string): Promise<Manifest['database']> {
  const database = await openDatabase({ dataDir: dir, migrationsFolder: '' });
  try {
    const migrations = await dbMigrations(database);
    const tables = await rowCounts(drizzleQuery(database));
    const blob = await database.dump!();
    writeFileSync(file, Buffer.from(await blob.arrayBuffer()));
    return { kind: 'pglite', file: PGLITE_FILE, migrations, tables };
  } finally {
    await database.close();
  }
}

async function dumpPostgres(databaseUrl: string, file: string): Promise<Manifest['database']> {
  await tool('pg_dump', ['--version']);
  // Counts, migrations and pg_dump all read one exported snapshot: the server may keep
  // working while the backup runs, and the manifest matches the dump exactly.
  const client = new pg.Client({ connectionString: databaseUrl });
  await client.connect();
  try {
    await client.query('begin isolation level repeatable read read only');
    const snapshot = (await client.query('select pg_export_snapshot() as s')).rows[0].s as string;
    const q = (text: string) => client.query(text) as Promise<{ rows: Record<string, unknown>[] }>;
    const hasTable = (await q(`select to_regclass('drizzle.__drizzle_migrations') is not null as ok`)).rows[0].ok;
    const migrations = hasTable
      ? (await q('select hash, created_at from drizzle.__drizzle_migrations order by created_at')).rows.map((r) => ({ hash: String(r.hash), createdAt: Number(r.created_at) }))
      : [];
    const tables = await rowCounts(q);
    const { dbname, env } = pgToolEnv(databaseUrl);
    await tool('pg_dump', ['--format=custom', '--no-owner', '--no-privileges', `--snapshot=${snapshot}`, `--file=${file}`, `--dbname=${dbname}`], env, 'dump the database');
    await client.query('commit');
    return { kind: 'postgres', file: PGDUMP_FILE, migrations, tables };
  } finally {
    await client.end();
  }
}

// --- restore ------------------------------------------------------------------------------

export type RestoreOutcome = { manifest: Manifest; into: 'pglite' | 'postgres'; keptPrevious: string[]; migrationsBehind: number };

/** Unpacks and checks a backup completely; throws BackupError naming what is wrong. */
export async function readBackup(file: string, staging: string, migrationsFolder: string): Promise<{ manifest: Manifest; behind: number }> {
  const from = path.resolve(file);
  if (!existsSync(from)) throw new BackupError(`--from: ${from} does not exist.`);
  if (!statSync(from).isFile()) throw new BackupError(`--from: ${from} is not a file.`);
  await tool('tar', ['-xf', from, '-C', staging, '--no-same-owner', '--no-same-permissions'], undefined, `The backup file ${from} is damaged or incomplete`);
  const manifestFile = path.join(staging, MANIFEST);
  if (!existsSync(manifestFile)) throw new BackupError(`The backup file ${from} is damaged or not a Heelwood backup: it has no ${MANIFEST}.`);
  let raw: unknown;
  try {
    raw = JSON.parse(readFileSync(manifestFile, 'utf8'));
  } catch (err) {
    throw new BackupError(`The backup file's ${MANIFEST} is damaged: ${(err as Error).message}.`);
  }
  const parsed = manifestSchema.safeParse(raw);
  if (!parsed.success) {
    throw new BackupError(`The backup file's ${MANIFEST} is not valid: ${parsed.error.issues.map((i) => `${i.path.join('.') || '(top)'}: ${i.message}`).join('; ')}.`);
  }
  const manifest = parsed.data;
  const present = new Set(walk(staging));
  for (const f of manifest.files) {
    const full = path.join(staging, f.path);
    if (!present.has(f.path)) throw new BackupError(`The backup file is incomplete: ${f.path} is missing.`);
    if (statSync(full).size !== f.bytes) throw new BackupError(`The backup file is damaged: ${f.path} has ${statSync(full).size} bytes, the manifest says ${f.bytes}.`);
    if ((await sha256(full)) !== f.sha256) throw new BackupError(`The backup file is damaged: ${f.path} does not match its checksum.`);
  }
  if (!manifest.files.some((f) => f.path === manifest.database.file)) throw new BackupError(`The backup file is incomplete: it has no ${manifest.database.file}.`);
  const { behind } = checkMigrations(manifest.database.migrations, migrationsFolder);
  return { manifest, behind };
}

export async function restoreBackup(storage: StorageConfig, file: string, opts: { force?: boolean } = {}): Promise<RestoreOutcome> {
  const staging = mkdtempSync(path.join(tmpdir(), 'heelwood-restore-'));
  try {
    // 1. Everything is checked before anything in the target changes.
    const { manifest, behind } = await readBackup(file, staging, storage.migrationsFolder);
    const dbFile = path.join(staging, manifest.database.file);
    if (manifest.database.kind === 'postgres' && !storage.databaseUrl) {
      throw new BackupError('This backup is of a PostgreSQL server (pg_dump). Restore it into a PostgreSQL server: set DATABASE_URL.');
    }
    const keptPrevious: string[] = [];
    if (storage.databaseUrl) {
      if (nonEmptyDir(path.join(storage.dataDir, PHOTOS)) && !opts.force) {
        throw new BackupError(`${path.join(storage.dataDir, PHOTOS)} already holds photos: add --force to replace them (they are kept aside).`);
      }
      if (manifest.database.kind === 'postgres') await restorePostgresDump(storage.databaseUrl, dbFile, manifest, !!opts.force);
      else await copyPgliteIntoPostgres(storage, dbFile, !!opts.force);
      keptPrevious.push(...swapFiles(storage.dataDir, staging));
      return { manifest, into: 'postgres', keptPrevious, migrationsBehind: behind };
    }
    const lock = takeLock(storage.dataDir, 'npm run restore');
    try {
      const dir = path.join(storage.dataDir, 'pglite');
      if ((nonEmptyDir(dir) || nonEmptyDir(path.join(storage.dataDir, PHOTOS))) && !opts.force) {
        throw new BackupError(`${storage.dataDir} already holds a Heelwood database or photos: add --force to replace them (the current ones are kept aside).`);
      }
      // 2. The new database is built beside the old one and checked; then the two swap.
      const fresh = path.join(storage.dataDir, `pglite.restoring-${randomBytes(4).toString('hex')}`);
      try {
        const database = await openDatabase({ dataDir: fresh, loadDataDir: new Blob([readFileSync(dbFile)]), migrationsFolder: storage.migrationsFolder });
        try {
          const migrations = await dbMigrations(database);
          if (JSON.stringify(migrations) !== JSON.stringify(manifest.database.migrations)) {
            throw new BackupError('The backup\'s database does not match its manifest (migrations differ): the file was altered.');
          }
          compareCounts(manifest.database.tables, await rowCounts(drizzleQuery(database)), 'the restored database');
        } finally {
          await database.close();
        }
      } catch (err) {
        rmSync(fresh, { recursive: true, force: true });
        if (err instanceof BackupError) throw err;
        throw new BackupError(`The backup's database could not be opened (${(err as Error).message}). Nothing was changed.`);
      }
      if (existsSync(dir)) {
        const aside = `${dir}.before-restore-${stamp()}`;
        renameSync(dir, aside);
        keptPrevious.push(aside);
      }
      renameSync(fresh, dir);
      keptPrevious.push(...swapFiles(storage.dataDir, staging));
      return { manifest, into: 'pglite', keptPrevious, migrationsBehind: behind };
    } finally {
      lock.release();
    }
  } finally {
    rmSync(staging, { recursive: true, force: true });
  }
}

/** Photos and the sign-in secret from the backup into DATA_DIR; the old ones kept aside. */
function swapFiles(dataDir: string, staging: string): string[] {
  const kept: string[] = [];
  mkdirSync(dataDir, { recursive: true });
  const photos = path.join(dataDir, PHOTOS);
  const incoming = path.join(staging, PHOTOS);
  if (existsSync(photos) && (existsSync(incoming) || nonEmptyDir(photos))) {
    const aside = `${photos}.before-restore-${stamp()}`;
    renameSync(photos, aside);
    kept.push(aside);
  }
  if (existsSync(incoming)) cpSync(incoming, photos, { recursive: true });
  const secret = path.join(staging, SECRET);
  if (existsSync(secret)) {
    const mine = path.join(dataDir, SECRET);
    if (existsSync(mine) && readFileSync(mine, 'utf8') !== readFileSync(secret, 'utf8')) {
      const aside = `${mine}.before-restore-${stamp()}`;
      renameSync(mine, aside);
      kept.push(aside);
    }
    writeFileSync(mine, readFileSync(secret), { mode: 0o600 });
  }
  return kept;
}

async function withPg<T>(databaseUrl: string, fn: (c: pg.Client) => Promise<T>): Promise<T> {
  const client = new pg.Client({ connectionString: databaseUrl });
  await client.connect();
  try {
    return await fn(client);
  } finally {
    await client.end();
  }
}

/** Rows in the target's public tables: a target "has data" when any table has a row. */
async function targetHasData(c: pg.Client): Promise<boolean> {
  const counts = await rowCounts((t) => c.query(t) as Promise<{ rows: Record<string, unknown>[] }>);
  return Object.values(counts).some((n) => n > 0);
}

async function restorePostgresDump(databaseUrl: string, dump: string, manifest: Manifest, force: boolean) {
  await tool('pg_restore', ['--version']);
  // The whole archive is read once (to nowhere) so a damaged one fails before the target is touched.
  await tool('pg_restore', ['--file=/dev/null', dump], undefined, 'The backup\'s database dump could not be read');
  const { dbname, env } = pgToolEnv(databaseUrl);
  const hasSchema = await withPg(databaseUrl, async (c) => {
    if ((await targetHasData(c)) && !force) throw new BackupError('The PostgreSQL database in DATABASE_URL already holds data: add --force to replace it.');
    return (await c.query(`select to_regclass('drizzle.__drizzle_migrations') is not null or exists (select 1 from information_schema.tables where table_schema = 'public') as any`)).rows[0].any as boolean;
  });
  // One transaction: if anything fails, the target stays as it was.
  await tool(
    'pg_restore',
    ['--single-transaction', '--exit-on-error', '--no-owner', '--no-privileges', ...(hasSchema ? ['--clean', '--if-exists'] : []), `--dbname=${dbname}`, dump],
    env,
    'Restoring into the PostgreSQL server failed and was rolled back',
  );
  await withPg(databaseUrl, async (c) => compareCounts(manifest.database.tables, await rowCounts((t) => c.query(t) as Promise<{ rows: Record<string, unknown>[] }>), 'the PostgreSQL database'));
}

const COPY_BATCH = 2000;

/**
 * Embedded database → PostgreSQL server: the backup is opened in memory and brought to this
 * Heelwood's migration, the server is migrated to the same, and every table's rows are copied
 * in one transaction (foreign keys dropped for the copy and put back, which checks them all;
 * the tables' own triggers off meanwhile).
 */
async function copyPgliteIntoPostgres(storage: StorageConfig, dump: string, force: boolean) {
  const source = await openDatabase({ loadDataDir: new Blob([readFileSync(dump)]), migrationsFolder: storage.migrationsFolder });
  try {
    await source.migrate();
    const read = drizzleQuery(source);
    const tables = await publicTables(read);
    const expected = await rowCounts(read);
    await withPg(storage.databaseUrl!, async (c) => {
      if ((await targetHasData(c)) && !force) throw new BackupError('The PostgreSQL database in DATABASE_URL already holds data: add --force to replace it.');
    });
    const target = await openDatabase({ databaseUrl: storage.databaseUrl, migrationsFolder: storage.migrationsFolder });
    try {
      await target.migrate();
    } finally {
      await target.close();
    }
    await withPg(storage.databaseUrl!, async (c) => {
      const targetTables = new Set(await publicTables((t) => c.query(t) as Promise<{ rows: Record<string, unknown>[] }>));
      const missing = tables.filter((t) => !targetTables.has(t));
      if (missing.length) throw new BackupError(`The PostgreSQL database lacks tables the backup has: ${missing.join(', ')}.`);
      await c.query('begin');
      try {
        const fks = (
          await c.query(
            `select conrelid::regclass::text as tbl, conname, pg_get_constraintdef(oid) as def from pg_constraint where contype = 'f' and connamespace = 'public'::regnamespace`,
          )
        ).rows as { tbl: string; conname: string; def: string }[];
        for (const fk of fks) await c.query(`alter table ${fk.tbl} drop constraint ${ident(fk.conname)}`);
        // Our own triggers (e.g. the register's version counter) would count the copy as
        // changes: the rows arrive exactly as they were.
        for (const t of targetTables) await c.query(`alter table public.${ident(t)} disable trigger user`);
        await c.query(`truncate ${[...targetTables].map((t) => `public.${ident(t)}`).join(', ')}`);
        for (const t of tables) {
          const { rows } = await read(`select coalesce(json_agg(x), '[]'::json)::text as rows from public.${ident(t)} x`);
          const all = JSON.parse(String(rows[0].rows)) as unknown[];
          for (let i = 0; i < all.length; i += COPY_BATCH) {
            await c.query(`insert into public.${ident(t)} select * from json_populate_recordset(null::public.${ident(t)}, $1::json)`, [JSON.stringify(all.slice(i, i + COPY_BATCH))]);
          }
        }
        for (const t of targetTables) await c.query(`alter table public.${ident(t)} enable trigger user`);
        for (const fk of fks) await c.query(`alter table ${fk.tbl} add constraint ${ident(fk.conname)} ${fk.def}`);
        await c.query('commit');
      } catch (err) {
        await c.query('rollback').catch(() => undefined);
        if (err instanceof BackupError) throw err;
        throw new BackupError(`Copying into the PostgreSQL server failed and was rolled back: ${(err as Error).message}`);
      }
      compareCounts(expected, await rowCounts((t) => c.query(t) as Promise<{ rows: Record<string, unknown>[] }>), 'the PostgreSQL database');
    });
  } finally {
    await source.close();
  }
}
