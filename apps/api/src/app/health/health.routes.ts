import type { Knex } from 'knex';
import { ENGINE_VERSION } from '@tallyfit/engine';
import { healthSchema, type Health } from '@tallyfit/contracts';
import { pendingMigrations } from '../database';
import { defineRoute, type RouteDefinition } from '../http/route-table';
import type { WriteHealth } from '../storage/write-health';

export function healthRoutes(db: Knex, writeHealth: WriteHealth): RouteDefinition[] {
  return [
    defineRoute({
      method: 'get',
      path: '/health',
      access: 'public',
      summary: 'Whether the database is reachable, its schema current and writes working, and the engine version',
      responses: {
        200: healthSchema,
        503: { description: 'the database is unreachable, its schema is not current, or writes fail for lack of disk space', schema: healthSchema },
      },
      handler: async ({ res }) => {
        const health = await checkHealth(db, writeHealth);
        res.status(health.status === 'ok' ? 200 : 503).json(health);
      },
    }),
  ];
}

async function checkHealth(db: Knex, writeHealth: WriteHealth): Promise<Health> {
  const client = String(db.client.config.client);
  const storage = await writeHealth.status();
  try {
    await db.raw('select 1');
  } catch {
    return {
      status: 'degraded',
      database: { reachable: false, client },
      migrations: { current: false, pending: [] },
      storage,
      engineVersion: ENGINE_VERSION,
    };
  }
  const pending = await pendingMigrations(db);
  return {
    status: pending.length === 0 && storage.writable ? 'ok' : 'degraded',
    database: { reachable: true, client },
    migrations: { current: pending.length === 0, pending },
    storage,
    engineVersion: ENGINE_VERSION,
  };
}
