import { createTestApp, type TestContext } from '../../testing/test-app';

/**
 * Engine 0.1.x stored the Cressie–Read test under the key `cressieRead`; from 0.2.0 results use the
 * spec's test name `cressie-read` everywhere. Rows written before the change must read like new ones.
 */
describe('stored results from engine 0.1.x', () => {
  let ctx: TestContext;
  let id: number;

  beforeAll(async () => {
    ctx = await createTestApp();
    const spec = { observed: { labels: ['a', 'b', 'c'], counts: [30, 20, 10] }, hypothesis: { kind: 'equal' }, tests: ['cressie-read'] };
    const created = await ctx.as('analyst').post('/analyses', { title: 'Three shelves', spec }).expect(201);
    id = created.body.id;
    expect(created.body.result.tests['cressie-read']).toBeDefined();
    // Rewrite the stored result the way 0.1.x wrote it.
    const row = await ctx.db('analyses').where({ id }).first();
    const stored = JSON.parse(row.result_json);
    stored.tests = { cressieRead: stored.tests['cressie-read'] };
    stored.report.lines = { cressieRead: stored.report.lines['cressie-read'] };
    stored.conclusion.test = 'cressieRead';
    stored.engineVersion = '0.1.0';
    await ctx.db('analyses').where({ id }).update({ result_json: JSON.stringify(stored) });
  });
  afterAll(() => ctx.close());

  it('are read with the spec test names', async () => {
    const { body } = await ctx.as('analyst').get(`/analyses/${id}`).expect(200);
    expect(Object.keys(body.result.tests)).toEqual(['cressie-read']);
    expect(Object.keys(body.result.report.lines)).toEqual(['cressie-read']);
    expect(body.result.conclusion.test).toBe('cressie-read');
  });

  it('are found by the test filter under the one spelling', async () => {
    expect((await ctx.as('analyst').get('/analyses?test=cressie-read')).body.total).toBe(1);
  });

  it('name the test in the written report by its label', async () => {
    const report = await ctx.as('analyst').get(`/analyses/${id}/report.md`).expect(200);
    expect(report.text).toContain('Cressie–Read power divergence');
  });
});
