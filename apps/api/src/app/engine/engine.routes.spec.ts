import { createTestApp, rowCounts, type TestContext } from '../../testing/test-app';

// McDonald, Handbook of Biological Statistics, 3rd ed. (2014), chi-square goodness-of-fit:
// 1752 vs 1895 under 1:1 gives X² = 5.6071, 1 df, p = 0.0179.
const seedlings = { observed: { labels: ['green', 'yellow'], counts: [1752, 1895] }, hypothesis: { kind: 'equal' } };

describe('POST /api/v1/engine/analyze', () => {
  let ctx: TestContext;
  beforeAll(async () => (ctx = await createTestApp()));
  afterAll(() => ctx.close());

  it('computes for any signed-in role and stores nothing', async () => {
    const tables = ['analyses', 'audit_events'];
    const before = await rowCounts(ctx.db, tables);
    const response = await ctx.as('viewer').post('/engine/analyze', seedlings);
    expect(response.status).toBe(200);
    expect(response.body.tests.pearson.statistic).toBeCloseTo(5.6071, 4);
    expect(response.body.tests.pearson.p).toBeCloseTo(0.0179, 4);
    expect(await rowCounts(ctx.db, tables)).toEqual(before);
  });

  it('names the bad field with a 400', async () => {
    const response = await ctx.as('analyst').post('/engine/analyze', { ...seedlings, alpha: 2 });
    expect(response.status).toBe(400);
    expect(response.body.error.fields.map((f: { path: string }) => f.path)).toEqual(['alpha']);
  });

  it('answers 413 for a body over the limit and 415 for a body that is not JSON', async () => {
    const huge = { ...seedlings, padding: 'x'.repeat(1_100_000) };
    const tooLarge = await ctx.as('analyst').post('/engine/analyze', huge);
    expect(tooLarge.status).toBe(413);
    expect(tooLarge.body.error.code).toBe('payload_too_large');
    const text = await ctx.as('analyst').post('/engine/analyze').set('Content-Type', 'text/plain').send('observed: 1 2 3');
    expect(text.status).toBe(415);
    expect(text.body.error).toEqual({ code: 'unsupported_media_type', message: 'send the request body as JSON (Content-Type: application/json)' });
  });
});
