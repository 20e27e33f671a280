import request from 'supertest';
import { ENGINE_VERSION } from '@tallyfit/engine';
import { createTestApp, type TestContext } from '../../testing/test-app';

// McDonald, Handbook of Biological Statistics, 3rd ed. (2014), chi-square test of goodness-of-fit:
// 1752 vs 1895 under a 1:1 expectation gives X² = 5.6071, 1 df, p = 0.0179.
const seedlingSpec = {
  observed: { labels: ['green', 'yellow'], counts: [1752, 1895] },
  hypothesis: { kind: 'equal' },
};

describe('analyses', () => {
  let ctx: TestContext;
  beforeAll(async () => (ctx = await createTestApp()));
  afterAll(() => ctx.close());

  const post = (role: keyof TestContext['tokens'], body: unknown) =>
    request(ctx.app).post('/api/v1/analyses').set('Authorization', `Bearer ${ctx.tokens[role]}`).send(body as object);

  it('runs the engine and stores spec, result and engine version', async () => {
    const response = await post('analyst', { title: 'Seedlings', spec: seedlingSpec });
    expect(response.status).toBe(201);
    expect(response.body.engineVersion).toBe(ENGINE_VERSION);
    expect(response.body.author.name).toBe('Test analyst');
    expect(response.body.result.tests.pearson.statistic).toBeCloseTo(5.6071, 4);
    expect(response.body.result.tests.pearson.df).toBe(1);
    expect(response.body.result.tests.pearson.p).toBeCloseTo(0.0179, 4);

    const row = await ctx.db('analyses').where({ id: response.body.id }).first();
    expect(JSON.parse(row.spec_json)).toEqual(seedlingSpec);
    expect(row.engine_version).toBe(ENGINE_VERSION);
    expect(row.p).toBeCloseTo(0.0179, 4);
  });

  it('lists the caller’s own analyses with author=me, newest first, as a page', async () => {
    await post('analyst', { title: 'Second', spec: seedlingSpec });
    await post('admin', { title: 'Admin’s own', spec: seedlingSpec });
    const response = await request(ctx.app).get('/api/v1/analyses?author=me').set('Authorization', `Bearer ${ctx.tokens.analyst}`);
    expect(response.status).toBe(200);
    expect(response.body).toMatchObject({ total: 2, page: 1, pageSize: 25 });
    expect(response.body.items.map((a: { title: string }) => a.title)).toEqual(['Second', 'Seedlings']);
    expect(response.body.items[0]).toMatchObject({ hypothesisKind: 'equal', n: 3647, k: 2, status: 'draft', version: 1 });
  });

  it('answers 400 naming the field, and stores nothing, for an invalid spec', async () => {
    const before = await ctx.db('analyses').count({ count: '*' });
    const response = await post('analyst', {
      title: 'Bad counts',
      spec: { ...seedlingSpec, observed: { labels: ['a', 'b'], counts: [3, -1] } },
    });
    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe('invalid_input');
    expect(response.body.error.message).toMatch(/counts/);
    expect(response.body.error.fields[0].path).toMatch(/^spec\.observed\.counts/);
    expect(response.body.error).not.toHaveProperty('stack');
    expect(await ctx.db('analyses').count({ count: '*' })).toEqual(before);
  });

  it('answers 400 for a body that is not JSON, without a stack trace', async () => {
    const response = await request(ctx.app)
      .post('/api/v1/analyses')
      .set('Authorization', `Bearer ${ctx.tokens.analyst}`)
      .set('Content-Type', 'application/json')
      .send('{"title":');
    expect(response.status).toBe(400);
    expect(response.body).toEqual({ error: { code: 'invalid_json', message: 'the request body is not valid JSON' } });
  });

  it('answers 401 without a token and 403 for a viewer', async () => {
    const anonymous = await request(ctx.app).post('/api/v1/analyses').send({ title: 'x', spec: seedlingSpec });
    expect(anonymous.status).toBe(401);
    expect(anonymous.body.error.code).toBe('unauthorized');
    expect((await post('viewer', { title: 'x', spec: seedlingSpec })).status).toBe(403);
  });

  it('shows an analysis to its author and to a lead, and 404 to another analyst’s eyes', async () => {
    const created = await post('admin', { title: 'Admin only', spec: seedlingSpec });
    const get = (role: keyof TestContext['tokens']) =>
      request(ctx.app).get(`/api/v1/analyses/${created.body.id}`).set('Authorization', `Bearer ${ctx.tokens[role]}`);
    expect((await get('admin')).status).toBe(200);
    expect((await get('lead')).status).toBe(200);
    expect((await get('analyst')).status).toBe(404);
    expect((await get('admin')).body.spec).toEqual(seedlingSpec);
  });

  it('answers 404 for an analysis that does not exist and 400 for a malformed id', async () => {
    const missing = await request(ctx.app).get('/api/v1/analyses/999999').set('Authorization', `Bearer ${ctx.tokens.admin}`);
    expect(missing.status).toBe(404);
    const malformed = await request(ctx.app).get('/api/v1/analyses/abc').set('Authorization', `Bearer ${ctx.tokens.admin}`);
    expect(malformed.status).toBe(400);
    expect(malformed.body.error.fields[0].path).toBe('id');
  });
});
