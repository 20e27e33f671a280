import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Knex } from 'knex';
import { migrationNames } from '@tallyfit/migrations';
import { loadConfig } from '../config';
import { migrateToLatest, openDatabase } from '../database';
import { createTestDatabaseUrl } from '../../testing/test-database';

const WATCH_TABLES = ['source_connections', 'watches', 'watch_batches', 'watch_alerts', 'alert_deliveries', 'watch_pull_ticks'];

describe('watch migrations', () => {
  let db: Knex;
  let dataDir: string;
  let database: Awaited<ReturnType<typeof createTestDatabaseUrl>>;

  beforeAll(async () => {
    dataDir = mkdtempSync(join(tmpdir(), 'tallyfit-watch-migrations-'));
    database = await createTestDatabaseUrl();
    db = openDatabase(loadConfig({ TALLYFIT_DATA_DIR: dataDir, JWT_SECRET: 'x', ...(database.url ? { DATABASE_URL: database.url } : {}) }));
    await migrateToLatest(db);
  }, 60_000);
  afterAll(async () => {
    await db.destroy();
    await database.drop();
    rmSync(dataDir, { recursive: true, force: true });
  });

  it('go down and up again', async () => {
    for (const table of WATCH_TABLES) expect(await db.schema.hasTable(table)).toBe(true);
    const watchMigrations = migrationNames.filter((name) => /-00(40|41|42|43|44)-/.test(name));
    expect(watchMigrations).toHaveLength(5);
    for (const name of [...watchMigrations].reverse()) await db.migrate.down({ name });
    for (const table of WATCH_TABLES) expect(await db.schema.hasTable(table)).toBe(false);
    expect(await db.schema.hasTable('datasets')).toBe(true);
    await migrateToLatest(db);
    for (const table of WATCH_TABLES) expect(await db.schema.hasTable(table)).toBe(true);
  }, 60_000);
});
