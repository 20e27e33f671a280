import { createTestApp, type TestContext } from '../../testing/test-app';

/** Counts invented for these tests. */
const split = (a: number, b: number) => ({ observed: { labels: ['a', 'b'], counts: [a, b] }, hypothesis: { kind: 'equal' } });

describe('analysis history', () => {
  let ctx: TestContext;
  let studyId: number;
  let otherStudyId: number;

  beforeAll(async () => {
    ctx = await createTestApp();
    studyId = (await ctx.as('analyst').post('/studies', { name: 'Traffic' })).body.id;
    otherStudyId = (await ctx.as('admin').post('/studies', { name: 'Admin only' })).body.id;
    await ctx.as('analyst').post(`/studies/${studyId}/members`, { userId: ctx.userIds.viewer, studyRole: 'reader' }).expect(201);
    const runs: Array<[string, 'analyst' | 'admin', number | undefined, ReturnType<typeof split>, string?]> = [
      ['Even split', 'analyst', studyId, split(500, 500), 'looks fine'],
      ['Skewed split', 'analyst', studyId, split(560, 440), 'the banner variant was cached'],
      ['Personal check', 'analyst', undefined, split(50, 52)],
      ['Admin study run', 'admin', otherStudyId, split(300, 200)],
    ];
    for (const [title, role, study, spec, notes] of runs) {
      await ctx.as(role).post('/analyses', { title, spec, studyId: study, notes }).expect(201);
    }
  });
  afterAll(() => ctx.close());

  const titles = (body: { items: Array<{ title: string }> }) => body.items.map((item) => item.title);

  it('shows each role what it may read', async () => {
    expect(titles((await ctx.as('analyst').get('/analyses')).body).sort()).toEqual(['Even split', 'Personal check', 'Skewed split']);
    expect(titles((await ctx.as('viewer').get('/analyses')).body).sort()).toEqual(['Even split', 'Skewed split']);
    expect((await ctx.as('lead').get('/analyses')).body.total).toBe(4);
    expect((await ctx.as('admin').get('/analyses')).body.total).toBe(4);
  });

  it('filters by study, author, significance, free text, test, status and date', async () => {
    const lead = ctx.as('lead');
    expect(titles((await lead.get(`/analyses?studyId=${otherStudyId}`)).body)).toEqual(['Admin study run']);
    expect((await lead.get(`/analyses?author=${ctx.userIds.analyst}`)).body.total).toBe(3);
    expect(titles((await ctx.as('admin').get('/analyses?author=me')).body)).toEqual(['Admin study run']);
    expect(titles((await lead.get('/analyses?significant=true&sort=date&order=asc')).body)).toEqual(['Skewed split', 'Admin study run']);
    expect(titles((await lead.get('/analyses?significant=false')).body).sort()).toEqual(['Even split', 'Personal check']);
    expect(titles((await lead.get('/analyses?q=CACHED')).body)).toEqual(['Skewed split']);
    expect(titles((await lead.get('/analyses?q=personal')).body)).toEqual(['Personal check']);
    expect((await lead.get('/analyses?q=50%25')).body.total).toBe(0);
    expect((await lead.get('/analyses?test=pearson')).body.total).toBe(4);
    expect((await lead.get('/analyses?test=cressie-read')).body.total).toBe(0);
    expect((await lead.get('/analyses?status=draft')).body.total).toBe(4);
    expect((await lead.get('/analyses?status=signed_off')).body.total).toBe(0);
    expect((await lead.get('/analyses?from=2000-01-01&to=2999-12-31')).body.total).toBe(4);
    expect((await lead.get('/analyses?to=2000-01-01')).body.total).toBe(0);
  });

  it('sorts by p, author and study, and pages', async () => {
    const lead = ctx.as('lead');
    const byP = (await lead.get('/analyses?sort=p&order=asc')).body.items.map((item: { p: number }) => item.p);
    expect(byP).toEqual([...byP].sort((a, b) => a - b));
    expect((await lead.get('/analyses?sort=author&order=asc')).body.items[0].author.name).toBe('Test admin');
    const byStudy = (await lead.get('/analyses?sort=study&order=asc')).body.items.map((item: { study: { name: string } | null }) => item.study?.name ?? null);
    expect(byStudy).toEqual(['Admin only', 'Traffic', 'Traffic', null]);
    const first = await lead.get('/analyses?pageSize=3&page=1');
    const second = await lead.get('/analyses?pageSize=3&page=2');
    expect(first.body).toMatchObject({ total: 4, page: 1, pageSize: 3 });
    expect(first.body.items).toHaveLength(3);
    expect(second.body.items).toHaveLength(1);
    expect(titles(second.body)).not.toContain(titles(first.body)[0]);
  });

  it('names every bad query field with a 400', async () => {
    const response = await ctx.as('lead').get('/analyses?pageSize=101&sort=colour&status=done&significant=maybe&from=soon&author=someone');
    expect(response.status).toBe(400);
    expect(response.body.error.fields.map((f: { path: string }) => f.path).sort()).toEqual([
      'author', 'from', 'pageSize', 'significant', 'sort', 'status',
    ]);
    expect(response.body.error.message).toMatch(/pageSize must be at most 100/);
  });
});
