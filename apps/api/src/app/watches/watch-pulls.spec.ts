import { execFile } from 'node:child_process';
import { join } from 'node:path';
import { promisify } from 'node:util';
import type { User } from '@tallyfit/contracts';
import { createWatchRequestSchema } from '@tallyfit/contracts';
import { findUserById } from '../identity/users.service';
import { createTestApp, type TestContext } from '../../testing/test-app';
import { createPostgresSource, testPostgresUrl, type PostgresSource } from '../../testing/postgres-source';
import { PullQueryError, runPullQuery } from './pull-query';
import { createConnection, openSourceDatabase, testConnection } from './source-connections.service';
import { createWatch } from './watches.service';

const run = promisify(execFile);
const repositoryRoot = join(__dirname, '../../../../..');

// A team's own events database is PostgreSQL; these run where a server is offered (CI starts one).
const describeWithPostgres = testPostgresUrl() ? describe : describe.skip;

describeWithPostgres('pull-fed watches reading a PostgreSQL source', () => {
  let ctx: TestContext;
  let source: PostgresSource;
  let analyst: User;
  let studyId: number;
  let connectionId: number;

  const query = `select variant as category, count(*) as count from checkout_visits
    where visited_at >= :periodStart and visited_at < :periodEnd group by variant`;

  /** Visits in the source: `perVariant` of each variant at minute `minute` of the given hour. */
  async function addVisits(hour: string, perVariant: Record<string, number>, table = 'checkout_visits'): Promise<void> {
    const rows = Object.entries(perVariant).flatMap(([variant, count]) =>
      Array.from({ length: count }, (_, i) => ({ variant, visited_at: `${hour}:${String(i % 60).padStart(2, '0')}:00Z` })),
    );
    await source.db.batchInsert(table, rows, 500);
  }

  async function pullWatch(name: string, schedule: string, sql = query): Promise<number> {
    const watch = await createWatch(
      ctx.watches.context,
      analyst,
      createWatchRequestSchema.parse({
        studyId,
        name,
        labels: ['blue', 'green'],
        hypothesis: { kind: 'equal' },
        feed: { kind: 'pull', connectionId, query: sql, schedule },
      }),
    );
    return watch.id;
  }

  beforeAll(async () => {
    ctx = await createTestApp();
    source = await createPostgresSource();
    for (const name of ['checkout_visits', 'basket_visits']) {
      await source.db.schema.createTable(name, (table) => {
        table.increments('id');
        table.string('variant').notNullable();
        table.timestamp('visited_at', { useTz: true }).notNullable();
      });
    }
    analyst = (await findUserById(ctx.db, ctx.userIds.analyst))!;
    studyId = (await ctx.as('analyst').post('/studies', { name: 'Checkout button colour trial' }).expect(201)).body.id;
    const connection = await createConnection(ctx.db, ctx.config.secretKey, analyst, {
      name: 'Shop events',
      kind: 'postgres',
      host: source.host,
      port: source.port,
      database: source.database,
      user: source.user,
      password: source.password,
      ssl: false,
    });
    connectionId = connection.id;
  }, 60_000);

  afterAll(async () => {
    await ctx?.close();
    await source?.drop();
  }, 30_000);

  it('stores the password sealed and connects with it', async () => {
    const stored = await ctx.db('source_connections').where({ id: connectionId }).first();
    expect(stored.password_encrypted).not.toContain(source.password || 'no password');
    expect(stored.password_encrypted).toMatch(/^v1\./);
    const result = await testConnection(ctx.db, ctx.config.secretKey, connectionId);
    expect(result).toMatchObject({ ok: true, message: expect.stringMatching(/^connected: PostgreSQL \d+/) });
  });

  it('pulls each period once, from the end of the last pulled period', async () => {
    await addVisits('2026-03-01T09', { blue: 40, green: 38 });
    await addVisits('2026-03-01T10', { blue: 25, green: 31 });
    const watchId = await pullWatch('Hourly split', '0 * * * *');

    expect(await ctx.watches.scheduler.runTick(watchId, new Date('2026-03-01T10:00:00Z'))).toBe('batch');
    // The same tick again (a second server, or a retry) finds its lease taken.
    expect(await ctx.watches.scheduler.runTick(watchId, new Date('2026-03-01T10:00:00Z'))).toBe('taken');
    expect(await ctx.watches.scheduler.runTick(watchId, new Date('2026-03-01T11:00:00Z'))).toBe('batch');

    const batches = await ctx.db('watch_batches').where({ watch_id: watchId }).orderBy('sequence');
    expect(batches.map((batch) => JSON.parse(batch.counts_json))).toEqual([
      { blue: 40, green: 38 },
      { blue: 25, green: 31 },
    ]);
    expect(batches.map((batch) => batch.idempotency_key)).toEqual(['pull-2026-03-01T10:00:00.000Z', 'pull-2026-03-01T11:00:00.000Z']);
    expect(batches.map((batch) => batch.source)).toEqual(['pull', 'pull']);
    const watch = await ctx.db('watches').where({ id: watchId }).first();
    expect(Number(watch.n)).toBe(134);
    expect(watch.last_error).toBeNull();
  });

  it('shows a failing query on the watch, and clears it after the next good pull', async () => {
    const watchId = await pullWatch('Broken query', '0 * * * *', 'select variant as category from checkout_visits group by variant');
    expect(await ctx.watches.scheduler.runTick(watchId, new Date('2026-03-01T10:00:00Z'))).toBe('error');
    const failed = await ctx.db('watches').where({ id: watchId }).first();
    expect(failed.last_error).toBe(
      'scheduled pull at 2026-03-01T10:00:00.000Z failed: the query must return the columns "category" and "count"; row 1 has "category"',
    );
    const tick = await ctx.db('watch_pull_ticks').where({ watch_id: watchId }).first();
    expect(tick).toMatchObject({ outcome: 'error' });

    await ctx.db('watches').where({ id: watchId }).update({ pull_query: query });
    expect(await ctx.watches.scheduler.runTick(watchId, new Date('2026-03-01T11:00:00Z'))).toBe('batch');
    expect((await ctx.db('watches').where({ id: watchId }).first()).last_error).toBeNull();
  });

  it('runs the query read-only and within its statement timeout', async () => {
    const db = await openSourceDatabase(ctx.db, ctx.config.secretKey, connectionId);
    const period = { start: new Date('2026-03-01T09:00:00Z'), end: new Date('2026-03-01T10:00:00Z') };
    const visits = async () => Number((await source.db('checkout_visits').count({ n: '*' }))[0].n);
    const before = await visits();
    try {
      await expect(
        runPullQuery(db, "insert into checkout_visits (variant, visited_at) values ('blue', now()) returning 'blue' as category, 1 as count", period),
      ).rejects.toThrow(/read-only transaction/);
      await expect(runPullQuery(db, 'select pg_sleep(2), \'blue\' as category, 1 as count', period, 200)).rejects.toThrow(/statement timeout/);
      await expect(runPullQuery(db, "select 'blue' as category, 1.5 as count", period)).rejects.toThrow(PullQueryError);
      // Only :periodStart and :periodEnd are placeholders; a question mark stays what it is.
      const literal = "select 'why?' as category, 3 as count where '{\"k\": 1}'::jsonb ? 'k' union all select :periodStart::date::text, 2";
      expect(await runPullQuery(db, literal, period)).toEqual({ 'why?': 3, '2026-03-01': 2 });
    } finally {
      await db.destroy();
    }
    expect(await visits()).toBe(before);
  });

  it('arms the schedule from the database and pulls when it fires', async () => {
    await addVisits(new Date().toISOString().slice(0, 13), { blue: 1, green: 1 });
    const watchId = await pullWatch('Every second', '* * * * * *');
    const deadline = Date.now() + 8000;
    let ticks: Array<{ outcome: string | null }> = [];
    while (Date.now() < deadline) {
      ticks = await ctx.db('watch_pull_ticks').where({ watch_id: watchId }).whereNotNull('outcome');
      if (ticks.length >= 2) break;
      await new Promise((resolve) => setTimeout(resolve, 200));
    }
    expect(ticks.length).toBeGreaterThanOrEqual(2);
    expect(ticks.every((tick) => tick.outcome === 'batch' || tick.outcome === 'empty')).toBe(true);
    await ctx.db('watches').where({ id: watchId }).update({ state: 'paused' });
    await ctx.watches.scheduler.sync();
  }, 15_000);

  it('with two server processes on one database, runs each tick exactly once', async () => {
    await addVisits('2026-04-02T08', { blue: 12, green: 9 }, 'basket_visits');
    await addVisits('2026-04-02T09', { blue: 7, green: 11 }, 'basket_visits');
    await addVisits('2026-04-02T10', { blue: 5, green: 6 }, 'basket_visits');
    // A yearly schedule, so neither process's own timers fire during the test; the ticks are given.
    const watchId = await pullWatch('Two servers', '0 0 1 1 *', query.replace('checkout_visits', 'basket_visits'));
    const ticks = ['2026-04-02T09:00:00.000Z', '2026-04-02T10:00:00.000Z', '2026-04-02T11:00:00.000Z'];
    const env = {
      ...process.env,
      ...(ctx.config.databaseUrl ? { DATABASE_URL: ctx.config.databaseUrl } : {}),
      TALLYFIT_DATA_DIR: ctx.config.dataDir,
      TALLYFIT_SECRET_KEY: ctx.config.secretKey.toString('hex'),
      WATCH_ID: String(watchId),
      TICKS: ticks.join(','),
    };
    const script = ['tsx', '--tsconfig', 'tsconfig.base.json', 'apps/api/src/testing/pull-tick-process.ts'];
    const processes = await Promise.all([0, 1].map(() => run('npx', script, { cwd: repositoryRoot, env, timeout: 60_000 })));
    const outcomes = processes.map((child) => JSON.parse(child.stdout.trim().split('\n').pop() ?? '{}').outcomes as string[]);
    for (const [i] of ticks.entries()) {
      expect(outcomes.map((perProcess) => perProcess[i]).sort()).toEqual(['batch', 'taken']);
    }
    const batches = await ctx.db('watch_batches').where({ watch_id: watchId }).orderBy('sequence');
    expect(batches.map((batch) => JSON.parse(batch.counts_json))).toEqual([
      { blue: 12, green: 9 },
      { blue: 7, green: 11 },
      { blue: 5, green: 6 },
    ]);
  }, 120_000);
});
