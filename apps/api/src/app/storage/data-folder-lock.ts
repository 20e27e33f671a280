import { closeSync, openSync, readFileSync, rmSync, writeSync } from 'node:fs';
import { join } from 'node:path';

export const LOCK_FILE = 'tallyfit.lock';

/** Another live server holds the data folder; the message says which process and what to do. */
export class DataFolderLockedError extends Error {}

export interface DataFolderLock {
  /** Removes the lock file if it is still ours. */
  release(): void;
}

/**
 * Takes the data folder for this process: a lock file created exclusively (O_EXCL) holding our
 * process id. A second server on the same folder finds the file, sees that process still alive
 * and refuses to start. A lock left by a process that no longer exists (a crash, kill -9) is
 * stale: it is removed and taken over. The lock lives as long as the process; `release` on
 * shutdown, and a crashed process leaves a stale lock the next start clears.
 */
export function lockDataFolder(dataDir: string, pid = process.pid): DataFolderLock {
  const path = join(dataDir, LOCK_FILE);
  for (let attempt = 0; attempt < 2; attempt++) {
    let descriptor: number;
    try {
      descriptor = openSync(path, 'wx', 0o600);
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code !== 'EEXIST') throw error;
      const holder = lockHolder(path);
      if (holder !== undefined && holder !== pid && processIsAlive(holder)) {
        throw new DataFolderLockedError(
          `another Tallyfit server (process ${holder}) is using the data folder ${dataDir}; stop it first or set TALLYFIT_DATA_DIR to another folder`,
        );
      }
      // Stale: its process is gone (or it was ours). Remove it and try once more; a racing start may win.
      rmSync(path, { force: true });
      continue;
    }
    writeSync(descriptor, `${pid}\n`);
    closeSync(descriptor);
    return {
      release: () => {
        if (lockHolder(path) === pid) rmSync(path, { force: true });
      },
    };
  }
  throw new DataFolderLockedError(`another Tallyfit server took the data folder ${dataDir} at the same moment; only one may use it`);
}

function lockHolder(path: string): number | undefined {
  try {
    const pid = Number(readFileSync(path, 'utf8').trim());
    return Number.isInteger(pid) && pid > 0 ? pid : undefined;
  } catch {
    return undefined;
  }
}

/** Signal 0 checks that a process exists without touching it; EPERM means it exists under another user. */
function processIsAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (error) {
    return (error as NodeJS.ErrnoException).code === 'EPERM';
  }
}
