import { createTestApp, type TestContext } from '../../testing/test-app';

describe('audit trail', () => {
  let ctx: TestContext;
  beforeAll(async () => (ctx = await createTestApp()));
  afterAll(() => ctx.close());

  it('lists events newest first with who, what, when and before/after, for leads and admins', async () => {
    const study = (await ctx.as('analyst').post('/studies', { name: 'Audited' })).body;
    await ctx.as('analyst').patch(`/studies/${study.id}`, { name: 'Audited again' }).expect(200);
    const response = await ctx.as('lead').get(`/audit?entityType=study&entityId=${study.id}`);
    expect(response.status).toBe(200);
    expect(response.body).toMatchObject({ total: 2, page: 1, pageSize: 50 });
    expect(response.body.items[0]).toMatchObject({
      action: 'update',
      actor: { id: ctx.userIds.analyst, name: 'Test analyst' },
      entityType: 'study',
      entityId: String(study.id),
      studyId: study.id,
      before: { name: 'Audited' },
      after: { name: 'Audited again' },
      at: expect.stringMatching(/^\d{4}-\d\d-\d\dT/),
    });
    expect(response.body.items[1].action).toBe('create');
  });

  it('filters by person, action and time, and pages', async () => {
    const bySignIn = await ctx.as('admin').get(`/audit?action=sign-in&actorId=${ctx.userIds.viewer}`);
    expect(bySignIn.body.items.length).toBeGreaterThan(0);
    expect(bySignIn.body.items.every((e: { action: string; actor: { id: number } }) => e.action === 'sign-in' && e.actor.id === ctx.userIds.viewer)).toBe(true);
    const future = await ctx.as('admin').get('/audit?from=2999-01-01');
    expect(future.body).toMatchObject({ items: [], total: 0 });
    const paged = await ctx.as('admin').get('/audit?pageSize=1&page=2');
    expect(paged.body.items).toHaveLength(1);
    expect(paged.body.total).toBeGreaterThan(2);
  });

  it('names bad filters with a 400 and refuses analysts and viewers', async () => {
    const bad = await ctx.as('admin').get('/audit?pageSize=500&from=yesterday&action=dance');
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.map((f: { path: string }) => f.path).sort()).toEqual(['action', 'from', 'pageSize']);
    expect((await ctx.as('analyst').get('/audit')).status).toBe(403);
    expect((await ctx.as('viewer').get('/audit')).status).toBe(403);
  });
});
