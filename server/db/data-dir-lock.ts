// One process at a time on an embedded database. PGlite has no lock of its own: two
// processes writing the same data directory would corrupt it. The server, `npm run backup`
// and `npm run restore` each hold DATA_DIR/heelwood.pid while they use DATA_DIR/pglite; a
// file left by a process that was killed names a process that no longer runs and is taken
// over.
import { closeSync, mkdirSync, openSync, readFileSync, rmSync, writeSync } from 'node:fs';
import path from 'node:path';

export const LOCK_FILE = 'heelwood.pid';

export class DataDirBusyError extends Error {
  constructor(
    public readonly pid: number,
    public readonly holder: string,
    lockPath: string,
  ) {
    super(
      `The data directory is in use by ${holder} (process ${pid}, ${lockPath}). Stop it first; if no such process runs, delete that file.`,
    );
  }
}

export type LockInfo = { pid: number; holder: string; since: string };

function alive(pid: number): boolean {
  if (!Number.isInteger(pid) || pid <= 0) return false;
  // In a container the server is often process 1 on every start: our own pid in the file is
  // a file left by an earlier run, not a live holder.
  if (pid === process.pid) return false;
  try {
    process.kill(pid, 0);
    return true;
  } catch (err) {
    // EPERM: it exists but belongs to someone else.
    return (err as NodeJS.ErrnoException).code === 'EPERM';
  }
}

function readLock(file: string): LockInfo | null {
  try {
    const parsed = JSON.parse(readFileSync(file, 'utf8')) as Partial<LockInfo>;
    if (typeof parsed.pid !== 'number') return null;
    return { pid: parsed.pid, holder: String(parsed.holder ?? 'another process'), since: String(parsed.since ?? '') };
  } catch {
    return null;
  }
}

/** The live holder of the data directory, or null when it is free (no file, or a stale one). */
export function dataDirHolder(dataDir: string): LockInfo | null {
  const info = readLock(path.join(dataDir, LOCK_FILE));
  return info && alive(info.pid) ? info : null;
}

/**
 * Takes the data directory for this process, or throws DataDirBusyError naming the live
 * holder. Returns the release function (removes the file only while it is still ours).
 */
export function lockDataDir(dataDir: string, holder: string): { release(): void; tookOverFrom: LockInfo | null } {
  mkdirSync(dataDir, { recursive: true });
  const file = path.join(dataDir, LOCK_FILE);
  const mine: LockInfo = { pid: process.pid, holder, since: new Date().toISOString() };
  let tookOverFrom: LockInfo | null = null;
  for (let attempt = 0; attempt < 3; attempt++) {
    try {
      const fd = openSync(file, 'wx', 0o644);
      try {
        writeSync(fd, `${JSON.stringify(mine)}\n`);
      } finally {
        closeSync(fd);
      }
      return {
        tookOverFrom,
        release() {
          if (readLock(file)?.pid === process.pid) rmSync(file, { force: true });
        },
      };
    } catch (err) {
      if ((err as NodeJS.ErrnoException).code !== 'EEXIST') throw err;
      const other = readLock(file);
      if (other && alive(other.pid)) throw new DataDirBusyError(other.pid, other.holder, file);
      // Stale (killed process) or unreadable: remove and try again.
      tookOverFrom = other ?? { pid: 0, holder: 'unreadable lock file', since: '' };
      rmSync(file, { force: true });
    }
  }
  throw new Error(`Could not take ${file}: another process keeps creating it.`);
}
