// npm run backup -- --out <file>: one file with the database, photos and sign-in secret.
// Embedded database: the server must be stopped (refused while it runs). PostgreSQL
// (DATABASE_URL): pg_dump in one snapshot; the server may keep running.
import { parseArgs } from 'node:util';
import { ConfigError, storageConfig } from '../server/config.js';
import { BackupError, createBackup } from '../server/db/backup.js';

const USAGE = 'usage: npm run backup -- --out <file>   (DATA_DIR and DATABASE_URL as for the server)';

async function main() {
  let out: string | undefined;
  try {
    ({ values: { out } } = parseArgs({ options: { out: { type: 'string' } }, strict: true }));
  } catch (err) {
    console.error(`${(err as Error).message}\n${USAGE}`);
    process.exit(2);
  }
  if (!out) {
    console.error(`--out: name the backup file to write.\n${USAGE}`);
    process.exit(2);
  }
  const started = performance.now();
  const storage = storageConfig();
  const r = await createBackup(storage, out);
  const rows = Object.values(r.manifest.database.tables).reduce((s, n) => s + n, 0);
  const photos = r.manifest.files.filter((f) => f.path.startsWith('photos/')).length;
  console.log(
    [
      `Backup written to ${r.file} (${(r.bytes / 1024 / 1024).toFixed(1)} MB in ${Math.round(performance.now() - started)} ms)`,
      `  database: ${r.manifest.database.kind === 'pglite' ? `embedded, ${storage.dataDir}` : 'PostgreSQL server (DATABASE_URL)'}; ${Object.keys(r.manifest.database.tables).length} tables, ${rows} rows; migration ${r.manifest.database.migrations.length}`,
      `  photos: ${photos} files`,
      'Restore with: npm run restore -- --from <file>',
    ].join('\n'),
  );
}

main().catch((err) => {
  if (err instanceof BackupError || err instanceof ConfigError) {
    console.error(`Backup failed: ${err.message}`);
    process.exit(1);
  }
  console.error('Backup failed:', err);
  process.exit(1);
});
