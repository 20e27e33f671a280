import knex, { type Knex } from 'knex';
import { join } from 'node:path';
import { migrationNames, migrationSource } from '@tallyfit/migrations';
import type { Config } from './config';

/** Opens the configured database: PostgreSQL when DATABASE_URL is set, else the embedded SQLite file. */
export function openDatabase(config: Pick<Config, 'databaseUrl' | 'dataDir'>): Knex {
  if (config.databaseUrl) {
    return knex({ client: 'pg', connection: config.databaseUrl, migrations: { migrationSource } });
  }
  return knex({
    client: 'better-sqlite3',
    connection: { filename: join(config.dataDir, 'tallyfit.sqlite') },
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
