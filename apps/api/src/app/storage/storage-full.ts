import { HttpError } from '../http/http-error';

/**
 * Error codes meaning "no room to write": SQLite's SQLITE_FULL (better-sqlite3 puts it on
 * `code`, also as SQLITE_FULL_* extended codes), the operating system's ENOSPC and EDQUOT, and
 * PostgreSQL's SQLSTATE 53100 disk_full (PostgreSQL documentation, Appendix A, "Error Codes").
 */
const FULL_CODES = /^(SQLITE_FULL|ENOSPC|EDQUOT|53100)/;

export function isStorageFull(error: unknown): boolean {
  const code = (error as { code?: unknown } | null)?.code;
  return typeof code === 'string' && FULL_CODES.test(code);
}

/** 507 Insufficient Storage (RFC 4918, section 11.5): the request was fine, the server had no room. */
export const storageFull = () =>
  new HttpError(507, 'storage_full', 'the server has run out of disk space, so nothing was saved; ask an administrator to free space, then try again');
