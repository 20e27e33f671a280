import type { Knex } from 'knex';
import { ENGINE_VERSION } from '@tallyfit/engine';
import { healthSchema, type Health } from '@tallyfit/contracts';
import { pendingMigrations } from '../database';
import { defineRoute, type RouteDefinition } from '../http/route-table';

export function healthRoutes(db: Knex): RouteDefinition[] {
  return [
    defineRoute({
      method: 'get',
      path: '/health',
      access: 'public',
      summary: 'Whether the database is reachable and its schema current, and the engine version',
      responses: {
        200: healthSchema,
        503: { description: 'the database is unreachable or its schema is not current', schema: healthSchema },
      },
      handler: async ({ res }) => {
        const health = await checkHealth(db);
        res.status(health.status === 'ok' ? 200 : 503).json(health);
      },
    }),
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
