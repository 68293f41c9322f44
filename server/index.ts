// Starts Heelwood: configuration, database (migrated, demo seeded on first start), mail,
// sign-in, the HTTP server. Stops cleanly on SIGTERM and SIGINT.
import type { AddressInfo } from 'node:net';
import { createApp } from './app.js';
import { ConfigError, loadConfig } from './config.js';
import { createContext } from './context.js';
import { DataDirBusyError } from './db/data-dir-lock.js';
import { TileSourceError } from './modules/map/tiles.sources.js';

const DEMO_SIGN_INS = [
  ['coordinator@heelwood.test', 'coordinator'],
  ['lead@heelwood.test', 'farm lead'],
  ['hand@heelwood.test', 'farm hand'],
  ['grower@heelwood.test', 'grower (member, no farm)'],
];

async function main() {
  const started = performance.now();
  let config;
  try {
    config = loadConfig();
  } catch (err) {
    if (err instanceof ConfigError) {
      console.error(err.message);
      process.exit(1);
    }
    throw err;
  }
  const ctx = await createContext(config);
  const app = await createApp(ctx);
  const server = app.listen(config.port, config.host);
  await new Promise<void>((resolve, reject) => {
    server.once('listening', resolve);
    server.once('error', reject);
  });
  const port = (server.address() as AddressInfo).port;
  const url = config.publicUrl.replace(/:\d+$/, '') === 'http://localhost' ? `http://localhost:${port}` : config.publicUrl;

  const lines = [
    '',
    `Heelwood is listening on ${url}`,
    `  database: ${ctx.database.kind === 'pglite' ? `embedded PostgreSQL in ${config.dataDir}` : 'PostgreSQL server (DATABASE_URL)'}`,
    `  e-mail:   ${ctx.catcher ? `local catcher on ${ctx.catcher.host}:${ctx.catcher.port} (read it in the Mailbox page)` : `SMTP ${ctx.mailer.describe().smtpHost}`}`,
    ctx.seed.seeded ? `  demo cooperative written in ${ctx.seed.ms} ms` : `  demo seed skipped: ${ctx.seed.reason}`,
  ];
  if (config.seedDemo) {
    lines.push('  demo sign-ins (password heelwood-demo):');
    for (const [email, role] of DEMO_SIGN_INS) lines.push(`    ${email.padEnd(28)} ${role}`);
  }
  lines.push(`  ready in ${Math.round(performance.now() - started)} ms`, '');
  console.log(lines.join('\n'));

  let stopping = false;
  const stop = async (signal: string) => {
    if (stopping) return;
    stopping = true;
    console.log(`Heelwood stopping (${signal})…`);
    server.close();
    server.closeAllConnections();
    await ctx.close();
    process.exit(0);
  };
  process.on('SIGTERM', () => void stop('SIGTERM'));
  process.on('SIGINT', () => void stop('SIGINT'));
}

main().catch((err) => {
  if (err instanceof TileSourceError || err instanceof DataDirBusyError) {
    console.error(`Heelwood cannot start: ${err.message}`);
    process.exit(1);
  }
  console.error('Heelwood failed to start:', err);
  process.exit(1);
});
