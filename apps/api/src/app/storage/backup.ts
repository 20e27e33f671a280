import { createHash } from 'node:crypto';
import { cpSync, existsSync, mkdirSync, readdirSync, readFileSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import Database from 'better-sqlite3';
import { SQLITE_FILE } from './data-folder';
import { lockDataFolder } from './data-folder-lock';

/** Besides the database: the datasets people uploaded, the generated signing secret, the demo sign-ins. */
const KEPT_BESIDE = ['datasets', 'jwt-secret', 'demo-sign-ins.json'];
const MANIFEST = 'manifest.json';

export interface BackupManifest {
  createdAt: string;
  /** false when the database is PostgreSQL: it is backed up with pg_dump, not here. */
  includesDatabase: boolean;
  /** Rows per table in the backed-up database, to compare after a restore. */
  rows: Record<string, number>;
  /** Every file of the backup but the manifest, with its SHA-256. */
  files: Record<string, string>;
}

export class BackupError extends Error {}

/**
 * Backs up a data folder while the server may be running, into one timestamped folder under
 * `backupsDir`. The database is copied with SQLite's `VACUUM INTO`, which reads one consistent
 * snapshot (the write-ahead log included) while writers carry on; a plain file copy would miss
 * what is still in the WAL. The datasets are copied after the snapshot: a dataset row is only
 * committed once its file is in place, so every dataset the snapshot names has its file. The
 * folder is written under a ".partial" name and renamed when complete.
 */
export function backupDataFolder(dataDir: string, backupsDir: string, options: { includeDatabase: boolean }, now = new Date()): string {
  const name = `tallyfit-backup-${now.toISOString().replace(/[:.]/g, '-')}`;
  const partial = join(backupsDir, `${name}.partial`);
  mkdirSync(partial, { recursive: true, mode: 0o700 });
  try {
    let rows: Record<string, number> = {};
    if (options.includeDatabase) {
      const source = join(dataDir, SQLITE_FILE);
      if (!existsSync(source)) throw new BackupError(`there is no database at ${source}`);
      const connection = new Database(source, { fileMustExist: true });
      try {
        connection.pragma('busy_timeout = 10000');
        connection.prepare('VACUUM INTO ?').run(join(partial, SQLITE_FILE));
      } finally {
        connection.close();
      }
      rows = tableRows(join(partial, SQLITE_FILE));
    }
    for (const entry of KEPT_BESIDE) {
      if (existsSync(join(dataDir, entry))) cpSync(join(dataDir, entry), join(partial, entry), { recursive: true, preserveTimestamps: true });
    }
    const manifest: BackupManifest = { createdAt: now.toISOString(), includesDatabase: options.includeDatabase, rows, files: checksums(partial) };
    writeFileSync(join(partial, MANIFEST), JSON.stringify(manifest, null, 2) + '\n', { mode: 0o600 });
    const complete = join(backupsDir, name);
    renameSync(partial, complete);
    return complete;
  } catch (error) {
    rmSync(partial, { recursive: true, force: true });
    throw error;
  }
}

/**
 * Puts a backup in place of a data folder's database and files, with the server stopped (the
 * data folder's lock is taken for the duration, so a running server makes this refuse). What
 * was there is moved aside into `replaced-<time>/` inside the data folder, not deleted.
 */
export function restoreDataFolder(backupDir: string, dataDir: string, now = new Date()): BackupManifest {
  const manifest = readManifest(backupDir);
  const actual = checksums(backupDir);
  for (const [file, sum] of Object.entries(manifest.files)) {
    if (actual[file] !== sum) throw new BackupError(`the backup is damaged: ${file} ${actual[file] ? 'has changed' : 'is missing'}`);
  }
  if (manifest.includesDatabase) {
    const check = new Database(join(backupDir, SQLITE_FILE), { readonly: true });
    try {
      const result = check.pragma('integrity_check', { simple: true });
      if (result !== 'ok') throw new BackupError(`the backed-up database fails SQLite's integrity check: ${String(result)}`);
    } finally {
      check.close();
    }
  }
  mkdirSync(dataDir, { recursive: true, mode: 0o700 });
  const lock = lockDataFolder(dataDir);
  try {
    const aside = join(dataDir, `replaced-${now.toISOString().replace(/[:.]/g, '-')}`);
    mkdirSync(aside, { mode: 0o700 });
    const replaced = [...(manifest.includesDatabase ? [SQLITE_FILE, `${SQLITE_FILE}-wal`, `${SQLITE_FILE}-shm`] : []), ...KEPT_BESIDE];
    for (const entry of replaced) {
      if (existsSync(join(dataDir, entry))) renameSync(join(dataDir, entry), join(aside, entry));
    }
    for (const entry of [...(manifest.includesDatabase ? [SQLITE_FILE] : []), ...KEPT_BESIDE]) {
      if (existsSync(join(backupDir, entry))) cpSync(join(backupDir, entry), join(dataDir, entry), { recursive: true, preserveTimestamps: true });
    }
  } finally {
    lock.release();
  }
  return manifest;
}

export function readManifest(backupDir: string): BackupManifest {
  const file = join(backupDir, MANIFEST);
  if (!existsSync(file)) throw new BackupError(`${backupDir} is not a Tallyfit backup (it has no ${MANIFEST})`);
  return JSON.parse(readFileSync(file, 'utf8')) as BackupManifest;
}

/** Rows per table of a SQLite file (Knex's own bookkeeping tables left out). */
export function tableRows(file: string): Record<string, number> {
  const connection = new Database(file, { readonly: true });
  try {
    const tables = connection
      .prepare("select name from sqlite_master where type = 'table' and name not like 'sqlite_%' and name not like 'knex_%' order by name")
      .pluck()
      .all() as string[];
    return Object.fromEntries(tables.map((table) => [table, Number(connection.prepare(`select count(*) from "${table}"`).pluck().get())]));
  } finally {
    connection.close();
  }
}

function checksums(folder: string, prefix = ''): Record<string, string> {
  const sums: Record<string, string> = {};
  for (const entry of readdirSync(join(folder, prefix), { withFileTypes: true })) {
    const relative = prefix ? `${prefix}/${entry.name}` : entry.name;
    if (entry.isDirectory()) Object.assign(sums, checksums(folder, relative));
    else if (relative !== MANIFEST) sums[relative] = createHash('sha256').update(readFileSync(join(folder, relative))).digest('hex');
  }
  return sums;
}
