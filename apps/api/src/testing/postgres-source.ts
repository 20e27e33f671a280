import { randomBytes } from 'node:crypto';
import knex, { type Knex } from 'knex';

/**
 * A throwaway database on the test PostgreSQL server (TALLYFIT_TEST_POSTGRES_URL) standing in for a
 * team's own events database that a pull-fed watch reads. Undefined when no server is offered.
 */
export interface PostgresSource {
  db: Knex;
  host: string;
  port: number;
  database: string;
  user: string;
  password: string;
  drop(): Promise<void>;
}

export const testPostgresUrl = (): string | undefined => process.env['TALLYFIT_TEST_POSTGRES_URL'] || undefined;

export async function createPostgresSource(): Promise<PostgresSource> {
  const serverUrl = testPostgresUrl();
  if (!serverUrl) throw new Error('TALLYFIT_TEST_POSTGRES_URL is not set');
  const name = `tallyfit_source_${randomBytes(6).toString('hex')}`;
  const admin = knex({ client: 'pg', connection: serverUrl, pool: { min: 0, max: 1 } });
  await admin.raw('create database ??', [name]);
  const url = new URL(serverUrl);
  url.pathname = `/${name}`;
  const db = knex({ client: 'pg', connection: url.toString(), pool: { min: 0, max: 2 } });
  return {
    db,
    host: url.hostname,
    port: Number(url.port || 5432),
    database: name,
    user: decodeURIComponent(url.username),
    password: decodeURIComponent(url.password),
    drop: async () => {
      await db.destroy();
      await admin.raw('drop database if exists ?? with (force)', [name]);
      await admin.destroy();
    },
  };
}
