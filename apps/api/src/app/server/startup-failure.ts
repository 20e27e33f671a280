import { ConfigError } from '../config';
import { DataFolderLockedError } from '../storage/data-folder-lock';
import { StartupError } from './listen';

/** A SQLite result code (SQLITE_CONSTRAINT…) or a PostgreSQL SQLSTATE (five characters). */
const DATABASE_CODE = /^(SQLITE_[A-Z_]+|[0-9A-Z]{5})$/;

/**
 * The one line printed when the server cannot start. Our own start-up errors already read well.
 * A database error is reduced to its code and the driver's own words: Knex puts the SQL and its
 * values in front of them, and those may hold a password hash or personal data.
 */
export function startupFailureLine(error: unknown): string {
  const reason = (() => {
    if (error instanceof ConfigError || error instanceof StartupError || error instanceof DataFolderLockedError) return error.message;
    const code = (error as { code?: unknown } | null)?.code;
    const message = error instanceof Error ? error.message : String(error);
    if (typeof code === 'string' && DATABASE_CODE.test(code)) {
      const driverWords = message.split(' - ').pop() ?? '';
      return `the database refused a start-up step (${code}: ${driverWords})`;
    }
    return message;
  })();
  return `Tallyfit could not start: ${reason.split('\n')[0]}`;
}
