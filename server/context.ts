// Everything a request handler may need, built once at start: configuration, database,
// sign-in, mail. Tests build the same context on a temporary database.
import path from 'node:path';
import type { Config } from './config.js';
import { type Database, type Db, openDatabase } from './db/client.js';
import { lockDataDir } from './db/data-dir-lock.js';
import { startReadCache } from './lib/read-cache.js';
import { seedIfEmpty, type SeedOutcome } from './db/first-start.js';
import { type Auth, createAuth } from './auth/auth.js';
import { type MailCatcher, startMailCatcher } from './modules/mail/mail-catcher.js';
import { createMailer, type Mailer } from './modules/mail/mailer.js';
import { createTileSource, type TileSource } from './modules/map/tiles.sources.js';
import { startReminderJob } from './modules/reminders/reminders.js';

export type AppContext = {
  config: Config;
  database: Database;
  db: Db;
  auth: Auth;
  mailer: Mailer;
  catcher?: MailCatcher;
  tiles: TileSource;
  seed: SeedOutcome;
  close(): Promise<void>;
};

export type ContextOptions = {
  /** Start PGlite from this dump instead of the data directory (tests). */
  loadDataDir?: Blob;
  /** Keep PGlite in memory (tests). */
  inMemory?: boolean;
  /** Port for the local SMTP catcher; 0 picks a free one. */
  catcherPort?: number;
};

export async function createContext(config: Config, opts: ContextOptions = {}): Promise<AppContext> {
  const onDisk = !config.databaseUrl && !opts.inMemory && !opts.loadDataDir;
  // PGlite has no lock of its own: one process at a time on DATA_DIR/pglite (data-dir-lock.ts).
  const lock = onDisk ? lockDataDir(config.dataDir, 'the Heelwood server') : null;
  if (lock?.tookOverFrom) {
    console.warn(`[heelwood] ${lock.tookOverFrom.holder} (process ${lock.tookOverFrom.pid}) stopped without closing the database; it is recovered on opening.`);
  }
  let database: Database;
  try {
    database = await openDatabase({
      databaseUrl: config.databaseUrl,
      dataDir: onDisk ? path.join(config.dataDir, 'pglite') : undefined,
      loadDataDir: opts.loadDataDir,
      migrationsFolder: config.migrationsFolder,
    });
  } catch (err) {
    lock?.release();
    throw err;
  }
  const closers: Array<() => Promise<void> | void> = [() => database.close(), () => lock?.release()];
  try {
    await database.migrate();
    await startReadCache(database);
    const seed = config.seedDemo ? await seedIfEmpty(database.db) : ({ seeded: false, reason: 'SEED_DEMO is off' } as const);
    let catcher: MailCatcher | undefined;
    if (!config.smtpUrl) {
      catcher = await startMailCatcher(database.db, opts.catcherPort ?? 0);
      closers.unshift(() => catcher!.close());
    }
    const mailer = createMailer(database.db, { smtpUrl: config.smtpUrl, catcher, from: config.mailFrom });
    closers.unshift(() => mailer.close());
    const tiles = await createTileSource(config.tilesSource, config.tilesDir);
    closers.unshift(() => tiles.close());
    const auth = createAuth(config, database.db, mailer);
    const ctx: AppContext = {
      config,
      database,
      db: database.db,
      auth,
      mailer,
      catcher,
      tiles,
      seed,
      async close() {
        for (const c of closers) await c();
      },
    };
    // Stopped first on close, before the mailer and the database it uses.
    closers.unshift(startReminderJob(ctx));
    return ctx;
  } catch (err) {
    for (const c of closers) await c();
    throw err;
  }
}
