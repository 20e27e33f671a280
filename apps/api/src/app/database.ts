import knex, { type Knex } from 'knex';
import { chmodSync, closeSync, existsSync, openSync } from 'node:fs';
import { join } from 'node:path';
import { migrationNames, migrationSource } from '@tallyfit/migrations';
import type { Config } from './config';
import { SQLITE_FILE } from './storage/data-folder';

/** Opens the configured database: PostgreSQL when DATABASE_URL is set, else the embedded SQLite file. */
export function openDatabase(config: Pick<Config, 'databaseUrl' | 'dataDir'>): Knex {
  if (config.databaseUrl) {
    return knex({ client: 'pg', connection: config.databaseUrl, migrations: { migrationSource } });
  }
  const filename = join(config.dataDir, SQLITE_FILE);
  createOwnerOnly(filename);
  const db = knex({
    client: 'better-sqlite3',
    connection: { filename },
    useNullAsDefault: true,
    migrations: { migrationSource },
    pool: {
      afterCreate: (connection: { pragma(sql: string): unknown }, done: (error: Error | null) => void) => {
        // Foreign keys are off by default in SQLite; WAL lets readers work while a write is under way.
        connection.pragma('foreign_keys = ON');
        connection.pragma('journal_mode = WAL');
        done(null);
      },
    },
  });
  keepErrorsSqliteRolledBack(db);
  return db;
}

/**
 * The database file is readable by its owner only (0600), created so before SQLite opens it;
 * SQLite gives its -wal and -shm files the database file's mode.
 */
function createOwnerOnly(filename: string): void {
  if (!existsSync(filename)) closeSync(openSync(filename, 'a', 0o600));
  for (const file of [filename, `${filename}-wal`, `${filename}-shm`]) {
    if (existsSync(file)) chmodSync(file, 0o600);
  }
}

type QueryRunner = (connection: { inTransaction: boolean }, query: { sql?: string }) => Promise<unknown>;
const PATCHED = Symbol('keeps errors SQLite rolled back');

/**
 * SQLite rolls a transaction back by itself after some errors, SQLITE_FULL among them (sqlite.org,
 * "Transaction", section "Response To Errors Within A Transaction"). Knex then sends ROLLBACK,
 * which fails with "no transaction is active" and replaces the real error, so a full disk would
 * read as an unknown failure. A ROLLBACK on a connection no longer in a transaction is skipped.
 * Knex builds each transaction's client from the dialect's prototype, so the prototype is where
 * this goes (once).
 */
function keepErrorsSqliteRolledBack(db: Knex): void {
  const dialect = Object.getPrototypeOf(db.client) as { _query: QueryRunner; [PATCHED]?: true };
  if (dialect[PATCHED]) return;
  const runQuery = dialect._query;
  dialect._query = async function (this: unknown, connection, query) {
    if (/^\s*ROLLBACK\b/i.test(query.sql ?? '') && !connection.inTransaction) return { sql: query.sql, response: [] };
    return runQuery.call(this, connection, query);
  };
  dialect[PATCHED] = true;
}

export async function migrateToLatest(db: Knex): Promise<void> {
  await db.migrate.latest();
}

/** The names of migrations not yet applied (empty when the schema is current). */
export async function pendingMigrations(db: Knex): Promise<string[]> {
  const [completed] = (await db.migrate.list()) as [Array<{ name: string } | string>, unknown[]];
  const applied = new Set(completed.map((entry) => (typeof entry === 'string' ? entry : entry.name)));
  return migrationNames.filter((name) => !applied.has(name));
}
