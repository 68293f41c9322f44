// npm run restore -- --from <file> [--force]: puts a backup back into DATA_DIR (embedded
// database) or into the PostgreSQL server named by DATABASE_URL. The whole backup is checked
// first (checksums, migrations); a target that already holds data is only replaced with
// --force, and what it held is kept aside. A backup of the embedded database restored with
// DATABASE_URL set copies everything into that server.
import { parseArgs } from 'node:util';
import { ConfigError, storageConfig } from '../server/config.js';
import { BackupError, restoreBackup } from '../server/db/backup.js';

const USAGE = 'usage: npm run restore -- --from <file> [--force]   (DATA_DIR and DATABASE_URL as for the server)';

async function main() {
  let values: { from?: string; force?: boolean };
  try {
    ({ values } = parseArgs({ options: { from: { type: 'string' }, force: { type: 'boolean' } }, strict: true }));
  } catch (err) {
    console.error(`${(err as Error).message}\n${USAGE}`);
    process.exit(2);
  }
  if (!values.from) {
    console.error(`--from: name the backup file to restore.\n${USAGE}`);
    process.exit(2);
  }
  const started = performance.now();
  const storage = storageConfig();
  const r = await restoreBackup(storage, values.from, { force: values.force });
  const rows = Object.values(r.manifest.database.tables).reduce((s, n) => s + n, 0);
  const lines = [
    `Restored ${values.from} (made ${r.manifest.createdAt}) in ${Math.round(performance.now() - started)} ms`,
    `  into: ${r.into === 'pglite' ? `embedded database in ${storage.dataDir}` : 'PostgreSQL server (DATABASE_URL)'}${r.manifest.database.kind !== r.into ? ' (copied from an embedded-database backup)' : ''}; ${rows} rows checked`,
  ];
  if (r.migrationsBehind) lines.push(`  the backup is ${r.migrationsBehind} migration(s) behind this Heelwood: the server applies them at start`);
  for (const k of r.keptPrevious) lines.push(`  kept the previous data in ${k} (delete it once you are satisfied)`);
  console.log(lines.join('\n'));
}

main().catch((err) => {
  if (err instanceof BackupError || err instanceof ConfigError) {
    console.error(`Restore failed: ${err.message}`);
    process.exit(1);
  }
  console.error('Restore failed:', err);
  process.exit(1);
});
