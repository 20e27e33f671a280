/**
 * `npm run restore -- <backup folder>`: puts a backup made by `npm run backup` back into the data
 * folder (TALLYFIT_DATA_DIR). Stop the server first: it holds the folder's lock and this refuses.
 */
import { resolve } from 'node:path';
import { dataDirFrom } from './app/config';
import { restoreDataFolder } from './app/storage/backup';

const [backupDir] = process.argv.slice(2);
process.umask(0o077);

if (!backupDir) {
  process.stderr.write('Name the backup to restore: npm run restore -- backups/tallyfit-backup-…\n');
  process.exitCode = 1;
} else {
  try {
    const dataDir = dataDirFrom(process.env);
    const manifest = restoreDataFolder(resolve(backupDir), dataDir);
    process.stdout.write(`Restored the backup of ${manifest.createdAt} into ${dataDir}; what was there is in ${dataDir}/replaced-…\n`);
  } catch (error) {
    process.stderr.write(`Restore failed: ${error instanceof Error ? error.message : String(error)}\n`);
    process.exitCode = 1;
  }
}
