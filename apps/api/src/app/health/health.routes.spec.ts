import request from 'supertest';
import { ENGINE_VERSION } from '@tallyfit/engine';
import { migrationNames } from '@tallyfit/migrations';
import { createTestApp, type TestContext } from '../../testing/test-app';

describe('GET /api/v1/health', () => {
  let ctx: TestContext;
  beforeAll(async () => (ctx = await createTestApp()));
  afterAll(() => ctx.close());

  it('reports a reachable database, current migrations and the engine version', async () => {
    const response = await request(ctx.app).get('/api/v1/health');
    expect(response.status).toBe(200);
    expect(response.body).toEqual({
      status: 'ok',
      database: { reachable: true, client: process.env['TALLYFIT_TEST_POSTGRES_URL'] ? 'pg' : 'better-sqlite3' },
      migrations: { current: true, pending: [] },
      storage: { writable: true, freeBytes: expect.any(Number) },
      engineVersion: ENGINE_VERSION,
    });
  });

  it('reports pending migrations as degraded with a 503', async () => {
    await ctx.db.migrate.down();
    const response = await request(ctx.app).get('/api/v1/health');
    expect(response.status).toBe(503);
    expect(response.body.migrations.pending).toEqual([migrationNames[migrationNames.length - 1]]);
    await ctx.db.migrate.latest();
  });
});
