import type { Knex } from 'knex';

/**
 * Timestamps come back from SQLite as 'YYYY-MM-DD HH:MM:SS' text in UTC (CURRENT_TIMESTAMP) and
 * from PostgreSQL as Date objects; the API always answers ISO 8601.
 */
export function isoDate(value: string | Date): string;
export function isoDate(value: string | Date | null | undefined): string | null;
export function isoDate(value: string | Date | null | undefined): string | null {
  if (value === null || value === undefined) return null;
  if (value instanceof Date) return value.toISOString();
  const text = value.includes('T') ? value : value.replace(' ', 'T');
  return new Date(/Z|[+-]\d\d:?\d\d$/.test(text) ? text : text + 'Z').toISOString();
}

const isSqlite = (db: Knex) => String(db.client.config.client).includes('sqlite');

/**
 * A client-given date for comparing with stored timestamps: SQLite compares text, so the value
 * must have the stored text's shape; PostgreSQL compares real timestamps.
 */
export function dbTime(db: Knex, iso: string): string | Date {
  const date = new Date(iso);
  if (!isSqlite(db)) return date;
  return date.toISOString().slice(0, 19).replace('T', ' ');
}

/** The database's own clock, so every stored time has one format. */
export const now = (db: Knex) => db.fn.now();

/** The id of a row just inserted: SQLite answers a number, PostgreSQL an object. */
export const insertedId = (row: unknown): number =>
  typeof row === 'object' && row !== null ? Number((row as { id: number }).id) : Number(row);
