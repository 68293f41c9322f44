// One database handle for the whole server: embedded PGlite on disk by default, a
// PostgreSQL server when DATABASE_URL is set. Both speak the same SQL and share one schema
// and one set of migrations.
import type { PgDatabase, PgQueryResultHKT } from 'drizzle-orm/pg-core';
import * as schema from './schema/index.js';

export type Schema = typeof schema;
export type Db = PgDatabase<PgQueryResultHKT, Schema>;
/** A transaction handle; repos accept either a Db or a Tx. */
export type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];
export type DbOrTx = Db | Tx;

export type Database = {
  db: Db;
  kind: 'pglite' | 'postgres';
  /** Run the committed migrations in ./drizzle; safe to run again. */
  migrate(): Promise<void>;
  close(): Promise<void>;
  /** A consistent copy of an embedded database (PGlite only): backups and test templates. */
  dump?(): Promise<Blob>;
  /** Notifications of this database, delivered on commit (PGlite only: read-cache.ts). */
  listen?(channel: string, onNotify: () => void): Promise<unknown>;
};

export type DatabaseOptions = {
  /** postgres://… for a server; otherwise PGlite. */
  databaseUrl?: string;
  /** PGlite data directory; undefined keeps it in memory (tests). */
  dataDir?: string;
  /** A PGlite data dump to start from (tests copy a migrated template). */
  loadDataDir?: Blob | File;
  migrationsFolder: string;
};

export async function openDatabase(opts: DatabaseOptions): Promise<Database> {
  if (opts.databaseUrl) {
    const { default: pg } = await import('pg');
    const { drizzle } = await import('drizzle-orm/node-postgres');
    const { migrate } = await import('drizzle-orm/node-postgres/migrator');
    const pool = new pg.Pool({ connectionString: opts.databaseUrl, max: 10 });
    const db = drizzle(pool, { schema, casing: 'snake_case' });
    return {
      db: db as unknown as Db,
      kind: 'postgres',
      migrate: () => migrate(db, { migrationsFolder: opts.migrationsFolder }),
      close: () => pool.end(),
    };
  }
  const { PGlite } = await import('@electric-sql/pglite');
  const { drizzle } = await import('drizzle-orm/pglite');
  const { migrate } = await import('drizzle-orm/pglite/migrator');
  const client = await PGlite.create({ dataDir: opts.dataDir, loadDataDir: opts.loadDataDir });
  const db = drizzle(client, { schema, casing: 'snake_case' });
  return {
    db: db as unknown as Db,
    kind: 'pglite',
    migrate: () => migrate(db, { migrationsFolder: opts.migrationsFolder }),
    close: () => client.close(),
    dump: () => client.dumpDataDir('gzip'),
    listen: (channel, onNotify) => client.listen(channel, onNotify),
  };
}
