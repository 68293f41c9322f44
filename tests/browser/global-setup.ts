/**
 * Global setup for the browser suite: starts ONE Heelwood server for the whole run.
 *
 * - expects the client already built in dist/ (.ci/run runs `npm run build`); builds it
 *   with `npx vite build` only when dist/index.html is missing;
 * - starts `node --import tsx server/index.ts` with NODE_ENV=test, a random free PORT and a
 *   fresh temporary DATA_DIR, in its own process group;
 * - polls GET /api/health until it answers { "ok": true };
 * - provides the base URL to the tests (`inject('baseURL')`);
 * - on teardown sends SIGTERM to the process group and removes the data dir.
 *
 * Set HEELWOOD_BASE_URL to run the suite against a server you started yourself.
 * Set HEELWOOD_KEEP_DATA=1 to keep the temporary data dir after the run.
 * The server's output goes to test-results/browser-server.log.
 */
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { createWriteStream, existsSync, mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { TestProject } from 'vitest/node';

declare module 'vitest' {
  export interface ProvidedContext {
    baseURL: string;
  }
}

const repoRoot = resolve(dirname(fileURLToPath(import.meta.url)), '../..');
const resultsDir = join(repoRoot, 'test-results');
const STARTUP_TIMEOUT_MS = Number(process.env.HEELWOOD_STARTUP_TIMEOUT_MS ?? 170_000);

function freePort(): Promise<number> {
  return new Promise((resolvePort, reject) => {
    const srv = createServer();
    srv.unref();
    srv.on('error', reject);
    srv.listen(0, '127.0.0.1', () => {
      const address = srv.address();
      const port = typeof address === 'object' && address ? address.port : 0;
      srv.close(() => (port ? resolvePort(port) : reject(new Error('no free port'))));
    });
  });
}

function ensureClientBuilt(): void {
  if (existsSync(join(repoRoot, 'dist', 'index.html'))) return;
  console.log('[browser setup] dist/index.html missing: running `npx vite build`');
  const result = spawnSync('npx', ['vite', 'build'], { cwd: repoRoot, stdio: 'inherit' });
  if (result.status !== 0 || !existsSync(join(repoRoot, 'dist', 'index.html'))) {
    throw new Error(`client build failed (exit ${result.status ?? result.signal})`);
  }
}

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

function killGroup(child: ChildProcess, signal: NodeJS.Signals): void {
  if (child.pid === undefined || child.exitCode !== null || child.signalCode !== null) return;
  try {
    process.kill(-child.pid, signal);
  } catch {
    try {
      child.kill(signal);
    } catch {
      /* already gone */
    }
  }
}

export default async function setup(project: TestProject) {
  const external = process.env.HEELWOOD_BASE_URL;
  if (external) {
    project.provide('baseURL', external.replace(/\/$/, ''));
    return;
  }

  ensureClientBuilt();
  mkdirSync(resultsDir, { recursive: true });

  const port = await freePort();
  const dataDir = mkdtempSync(join(tmpdir(), 'heelwood-browser-'));
  const baseURL = `http://localhost:${port}`;
  const logPath = join(resultsDir, 'browser-server.log');
  const log = createWriteStream(logPath);
  const tail: string[] = [];
  const remember = (chunk: Buffer) => {
    log.write(chunk);
    tail.push(...chunk.toString().split('\n'));
    if (tail.length > 60) tail.splice(0, tail.length - 60);
  };

  const started = Date.now();
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    cwd: repoRoot,
    env: { ...process.env, PORT: String(port), DATA_DIR: dataDir, NODE_ENV: 'test' },
    detached: true,
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  child.stdout!.on('data', remember);
  child.stderr!.on('data', remember);
  let exited: string | null = null;
  child.on('exit', (code, signal) => {
    exited = `exit code ${code}, signal ${signal}`;
  });
  // If vitest ends without running teardown, do not leave the server behind.
  const onExit = () => killGroup(child, 'SIGKILL');
  process.once('exit', onExit);

  const stop = async () => {
    process.removeListener('exit', onExit);
    killGroup(child, 'SIGTERM');
    for (let i = 0; i < 100 && exited === null; i++) await sleep(100);
    if (exited === null) killGroup(child, 'SIGKILL');
    log.end();
    if (process.env.HEELWOOD_KEEP_DATA) console.log(`[browser setup] kept DATA_DIR ${dataDir}`);
    else rmSync(dataDir, { recursive: true, force: true });
  };

  try {
    let lastError = '';
    for (;;) {
      if (exited !== null) throw new Error(`server stopped before it was ready (${exited})`);
      if (Date.now() - started > STARTUP_TIMEOUT_MS) {
        throw new Error(`server not healthy after ${STARTUP_TIMEOUT_MS / 1000} s (last: ${lastError})`);
      }
      try {
        const res = await fetch(`${baseURL}/api/health`, { signal: AbortSignal.timeout(5_000) });
        const body = (await res.json().catch(() => null)) as { ok?: unknown } | null;
        if (res.ok && body?.ok === true) break;
        lastError = `HTTP ${res.status} ${JSON.stringify(body)}`;
      } catch (err) {
        lastError = err instanceof Error ? `${err.name}: ${err.message}` : String(err);
      }
      await sleep(250);
    }
  } catch (err) {
    await stop();
    const message = err instanceof Error ? err.message : String(err);
    throw new Error(`${message}\n--- last lines of ${logPath} ---\n${tail.join('\n')}`);
  }

  console.log(`[browser setup] server ready at ${baseURL} in ${((Date.now() - started) / 1000).toFixed(1)} s`);
  project.provide('baseURL', baseURL);
  return stop;
}
