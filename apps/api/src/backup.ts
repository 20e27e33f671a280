/**
 * `npm run backup [-- --to <folder>]`: backs up the data folder (TALLYFIT_DATA_DIR) while the
 * server runs, into a timestamped folder under ./backups (or --to). With DATABASE_URL set the
 * database is PostgreSQL: back it up with pg_dump (README), this copies the data folder's files.
 */
import { resolve } from 'node:path';
import { dataDirFrom } from './app/config';
import { backupDataFolder, readManifest } from './app/storage/backup';

const args = process.argv.slice(2);
const toIndex = args.indexOf('--to');
const backupsDir = resolve(toIndex >= 0 ? args[toIndex + 1] : 'backups');
const includeDatabase = !process.env['DATABASE_URL'];
process.umask(0o077);

try {
  const folder = backupDataFolder(dataDirFrom(process.env), backupsDir, { includeDatabase });
  const manifest = readManifest(folder);
  const rows = Object.values(manifest.rows).reduce((sum, count) => sum + count, 0);
  process.stdout.write(`Backed up to ${folder}: ${Object.keys(manifest.files).length} files${includeDatabase ? `, ${rows} database rows` : ''}.\n`);
  if (!includeDatabase) process.stdout.write('The database is PostgreSQL: back it up with pg_dump (see README, "Backup and restore").\n');
} catch (error) {
  process.stderr.write(`Backup failed: ${error instanceof Error ? error.message : String(error)}\n`);
  process.exitCode = 1;
}
