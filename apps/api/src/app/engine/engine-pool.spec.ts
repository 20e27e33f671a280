import { join } from 'node:path';
import request from 'supertest';
import { analyze, EngineInputError } from '@tallyfit/engine';
import { createTestApp, type TestContext } from '../../testing/test-app';
import { createEnginePool } from './engine-pool';
import type { HttpError } from '../http/http-error';
import type { EngineRunner } from './engine-runner';

/** The pool runs the TypeScript worker through a small tsx runner (the server runs the built worker). */
const WORKER_RUNNER = join(__dirname, '../../testing/engine-worker-runner.cjs');

// McDonald, Handbook of Biological Statistics, 3rd ed. (2014): 1752 vs 1895 under 1:1 gives X² = 5.6071, p = 0.0179.
const seedlings = { observed: { labels: ['green', 'yellow'], counts: [1752, 1895] }, hypothesis: { kind: 'equal' as const } };
// Invented: six categories and many Monte Carlo draws, to keep a worker busy for a while.
const heavy = {
  observed: { labels: ['a', 'b', 'c', 'd', 'e', 'f'], counts: [310, 295, 330, 280, 305, 320] },
  hypothesis: { kind: 'equal' as const },
  tests: ['exact' as const],
  exact: { method: 'monte-carlo' as const, samples: 100_000_000, seed: 7 },
};
// Invented: a large-lane run (more Monte Carlo draws than the default) that still ends in a fraction of a second.
const brief = {
  observed: { labels: ['a', 'b', 'c'], counts: [10, 12, 15] },
  hypothesis: { kind: 'equal' as const },
  tests: ['exact' as const],
  exact: { method: 'monte-carlo' as const, samples: 200_000, seed: 3 },
};
const pearsonOnly = { ...seedlings, tests: ['pearson' as const] };

describe('engine worker pool', () => {
  let pool: EngineRunner;
  beforeAll(() => {
    pool = createEnginePool({ workerFile: WORKER_RUNNER, timeLimitMs: 60_000, largeThreads: 1, smallThreads: 1 });
  });
  afterAll(() => pool.close());

  it('returns what the engine returns in-process', async () => {
    const result = await pool.analyze(seedlings);
    expect(result).toEqual(analyze(seedlings));
    expect(result.tests.pearson?.p).toBeCloseTo(0.0179, 4);
  });

  it('brings the engine’s input problems back as an EngineInputError naming the field', async () => {
    const bad = { ...seedlings, observed: { labels: ['a', 'b'], counts: [1, -2] } };
    const error = await pool.analyze(bad).catch((caught: unknown) => caught);
    expect(error).toBeInstanceOf(EngineInputError);
    expect((error as EngineInputError).issues[0].path).toMatch(/^observed\.counts/);
  });
});

describe('engine worker pool behind the API', () => {
  let ctx: TestContext;
  beforeAll(async () => {
    ctx = await createTestApp({ engine: createEnginePool({ workerFile: WORKER_RUNNER, timeLimitMs: 1500, queueWaitLimitMs: 300, largeThreads: 1, smallThreads: 1 }) });
  });
  afterAll(() => ctx.close());

  it('keeps answering other requests while a long run is under way, then stops the run at its time limit', async () => {
    const events: string[] = [];
    const long = ctx
      .as('analyst')
      .post('/engine/analyze', heavy)
      .then((response) => {
        events.push('long run answered');
        return response;
      });
    const health = await request(ctx.app).get('/api/v1/health');
    events.push('health answered');
    expect(health.status).toBe(200);
    const response = await long;
    expect(events).toEqual(['health answered', 'long run answered']);
    expect(response.status).toBe(422);
    expect(response.body.error.code).toBe('too_much_work');
    expect(response.body.error.message).toMatch(/did not finish within 1.5 s of computing/);

    // The pool replaces the stopped thread: the next run works.
    const next = await ctx.as('analyst').post('/engine/analyze', seedlings);
    expect(next.status).toBe(200);
  });

  it('answers 503 queued_too_long with Retry-After when a run cannot get a thread in time', async () => {
    const long = ctx.as('analyst').post('/engine/analyze', heavy).then((response) => response);
    const waited = await ctx.as('viewer').post('/engine/analyze', brief);
    expect(waited.status).toBe(503);
    expect(waited.body.error.code).toBe('queued_too_long');
    expect(waited.headers['retry-after']).toBe('2');
    expect((await long).body.error.code).toBe('too_much_work');
  });
});

describe('engine worker pool: queue, lanes and turns', () => {
  const pools: EngineRunner[] = [];
  const makePool = (options: { timeLimitMs: number; queueWaitLimitMs?: number }) => {
    const pool = createEnginePool({ workerFile: WORKER_RUNNER, largeThreads: 1, smallThreads: 1, ...options });
    pools.push(pool);
    return pool;
  };
  afterAll(() => Promise.all(pools.map((pool) => pool.close())));

  it('counts the time limit from when a run starts, not from when it was queued', async () => {
    const pool = makePool({ timeLimitMs: 1500, queueWaitLimitMs: 20_000 });
    const long = pool.analyze(heavy, { owner: 'first' }).catch((caught: unknown) => caught);
    // Queued behind the long run for its whole 1.5 s, then computed in a fraction of a second.
    const queued = await pool.analyze(brief, { owner: 'second' });
    expect(queued.tests.exact?.samples).toBe(200_000);
    expect(((await long) as HttpError).code).toBe('too_much_work');
  });

  it('answers a small run on its own thread while the large lane is busy and others wait', async () => {
    const pool = makePool({ timeLimitMs: 2000, queueWaitLimitMs: 20_000 });
    const events: string[] = [];
    const longRuns = [1, 2].map((i) =>
      pool.analyze(heavy, { owner: 'busy' }).catch(() => {
        events.push(`long ${i} ended`);
      }),
    );
    const result = await pool.analyze(pearsonOnly, { owner: 'other' });
    events.push('small answered');
    expect(result.tests.pearson?.p).toBeCloseTo(0.0179, 4); // McDonald (2014), as above
    await Promise.all(longRuns);
    expect(events).toEqual(['small answered', 'long 1 ended', 'long 2 ended']);
  });

  it('takes turns between people: one person’s queued runs do not all go before another’s', async () => {
    const pool = makePool({ timeLimitMs: 20_000 });
    const order: string[] = [];
    const run = (owner: string, name: string) => pool.analyze(brief, { owner }).then(() => order.push(name));
    // The first run occupies the large thread; the rest queue, three from one person, then one from another.
    await Promise.all([run('busy', 'busy 1'), run('busy', 'busy 2'), run('busy', 'busy 3'), run('busy', 'busy 4'), run('other', 'other 1')]);
    expect(order.indexOf('other 1')).toBeLessThan(order.indexOf('busy 3'));
  });

  it('refuses a run that waited too long for a thread with its own error, apart from too much work', async () => {
    const pool = makePool({ timeLimitMs: 3000, queueWaitLimitMs: 300 });
    const long = pool.analyze(heavy, { owner: 'busy' }).catch((caught: unknown) => caught);
    const waited = (await pool.analyze(brief, { owner: 'other' }).catch((caught: unknown) => caught)) as HttpError;
    expect(waited.status).toBe(503);
    expect(waited.code).toBe('queued_too_long');
    expect(waited.message).toMatch(/waited 0.3 s without starting/);
    expect(waited.headers?.['Retry-After']).toBe('3');
    expect(((await long) as HttpError).code).toBe('too_much_work');
  });
});
