import type { Knex } from 'knex';
import { ENGINE_VERSION } from '@tallyfit/engine';
import type { Health } from '@tallyfit/contracts';
import { pendingMigrations } from '../database';
import { publicAccess, type RouteDefinition } from '../http/route-table';

export function healthRoutes(db: Knex): RouteDefinition[] {
  return [
    {
      method: 'get',
      path: '/health',
      access: publicAccess,
      summary: 'Whether the database is reachable and its schema current, and the engine version',
      handler: async (_req, res) => {
        const health = await checkHealth(db);
        res.status(health.status === 'ok' ? 200 : 503).json(health);
      },
    },
  ];
}

async function checkHealth(db: Knex): Promise<Health> {
  const client = String(db.client.config.client);
  try {
    await db.raw('select 1');
  } catch {
    return {
      status: 'degraded',
      database: { reachable: false, client },
      migrations: { current: false, pending: [] },
      engineVersion: ENGINE_VERSION,
    };
  }
  const pending = await pendingMigrations(db);
  return {
    status: pending.length === 0 ? 'ok' : 'degraded',
    database: { reachable: true, client },
    migrations: { current: pending.length === 0, pending },
    engineVersion: ENGINE_VERSION,
  };
}
