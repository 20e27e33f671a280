import { randomBytes } from 'node:crypto';
import knex from 'knex';

/**
 * With TALLYFIT_TEST_POSTGRES_URL set (a PostgreSQL server URL whose user may create databases),
 * each suite gets a database of its own on that server, dropped when the suite closes; otherwise
 * the suite uses the embedded SQLite file. The same migrations and tests run on both.
 */
export async function createTestDatabaseUrl(): Promise<{ url?: string; drop(): Promise<void> }> {
  const serverUrl = process.env['TALLYFIT_TEST_POSTGRES_URL'];
  if (!serverUrl) return { drop: async () => undefined };
  const name = `tallyfit_test_${randomBytes(6).toString('hex')}`;
  const admin = knex({ client: 'pg', connection: serverUrl, pool: { min: 0, max: 1 } });
  await admin.raw('create database ??', [name]);
  const url = new URL(serverUrl);
  url.pathname = `/${name}`;
  return {
    url: url.toString(),
    drop: async () => {
      await admin.raw('drop database if exists ?? with (force)', [name]);
      await admin.destroy();
    },
  };
}
