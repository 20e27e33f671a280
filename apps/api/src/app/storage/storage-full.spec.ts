import request from 'supertest';
import { createTestApp, type TestContext } from '../../testing/test-app';
import { isStorageFull } from './storage-full';

describe('isStorageFull', () => {
  it('knows the codes of SQLite, the operating system and PostgreSQL for a full disk', () => {
    for (const code of ['SQLITE_FULL', 'ENOSPC', 'EDQUOT', '53100']) expect(isStorageFull({ code })).toBe(true);
    for (const value of [{ code: 'SQLITE_BUSY' }, { code: '23505' }, new Error('no code'), null, undefined]) expect(isStorageFull(value)).toBe(false);
  });
});

const onSqlite = process.env['TALLYFIT_TEST_POSTGRES_URL'] ? describe.skip : describe;

onSqlite('writes on a full disk (SQLite capped by max_page_count)', () => {
  let ctx: TestContext;
  beforeAll(async () => (ctx = await createTestApp()));
  afterAll(() => ctx.close());

  it('answers 507 storage_full instead of 500, and writes work again once there is room', async () => {
    const [{ page_count: pages }] = (await ctx.db.raw('PRAGMA page_count')) as Array<{ page_count: number }>;
    // The one pooled connection may not grow the file past its size now: the next new page is "disk full".
    await ctx.db.raw(`PRAGMA max_page_count = ${pages}`);
    let response;
    for (let i = 0; i < 200; i++) {
      response = await ctx.as('analyst').post('/studies', { name: `Study ${i} ${'x'.repeat(180)}` });
      if (response.status !== 201) break;
    }
    expect(response?.status).toBe(507);
    expect(response?.body.error).toEqual({
      code: 'storage_full',
      message: 'the server has run out of disk space, so nothing was saved; ask an administrator to free space, then try again',
    });

    const health = await request(ctx.app).get('/api/v1/health');
    expect(health.status).toBe(503);
    expect(health.body.status).toBe('degraded');
    expect(health.body.storage).toMatchObject({ writable: false, problem: expect.stringMatching(/^a write failed for lack of disk space at \S+; none has succeeded since$/) });

    await ctx.db.raw(`PRAGMA max_page_count = ${pages * 100}`);
    expect((await ctx.as('analyst').post('/studies', { name: 'Room again' })).status).toBe(201);
    expect((await request(ctx.app).get('/api/v1/health')).body).toMatchObject({ status: 'ok', storage: { writable: true } });
  });
});
