import { join } from 'node:path';
import request from 'supertest';
import { analyze, EngineInputError } from '@tallyfit/engine';
import { createTestApp, type TestContext } from '../../testing/test-app';
import { createEnginePool } from './engine-pool';
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

describe('engine worker pool', () => {
  let pool: EngineRunner;
  beforeAll(() => {
    pool = createEnginePool({ workerFile: WORKER_RUNNER, timeLimitMs: 60_000, maxThreads: 1 });
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
    ctx = await createTestApp({ engine: createEnginePool({ workerFile: WORKER_RUNNER, timeLimitMs: 1500, maxThreads: 1 }) });
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
    expect(response.body.error.message).toMatch(/did not finish within 1.5 s/);

    // The pool replaces the stopped thread: the next run works.
    const next = await ctx.as('analyst').post('/engine/analyze', seedlings);
    expect(next.status).toBe(200);
  });
});
