import { chmodSync, existsSync, mkdirSync, readdirSync, rmSync } from 'node:fs';
import { join } from 'node:path';

/** Where uploads are written while they arrive; anything left there at start is from a crash. */
export const UPLOADS_IN_PROGRESS = 'uploads-in-progress';
/** The embedded database's file in the data folder. */
export const SQLITE_FILE = 'tallyfit.sqlite';

/**
 * The data folder holds the database, the signing secret and people's datasets: only the
 * account running Tallyfit may enter it (0700), whatever it was created with.
 */
export function makeDataFolderPrivate(dataDir: string): void {
  mkdirSync(dataDir, { recursive: true, mode: 0o700 });
  chmodSync(dataDir, 0o700);
}

/** Removes uploads a crash interrupted (call only while holding the data folder's lock); returns how many. */
export function clearUnfinishedUploads(dataDir: string): number {
  const folder = join(dataDir, UPLOADS_IN_PROGRESS);
  const left = existsSync(folder) ? readdirSync(folder) : [];
  rmSync(folder, { recursive: true, force: true });
  mkdirSync(folder, { recursive: true, mode: 0o700 });
  return left.length;
}
