import { createTestApp, type TestContext } from '../../testing/test-app';

// Invented: a two-way split of 1 000 visitors.
const spec = { observed: { labels: ['A', 'B'], counts: [478, 522] }, hypothesis: { kind: 'equal' } };

/** A sign-off vouches for a fixed record, made by someone other than its author. */
describe('review integrity', () => {
  let ctx: TestContext;
  beforeAll(async () => (ctx = await createTestApp()));
  afterAll(() => ctx.close());

  const create = async (role: 'analyst' | 'admin', title: string) => {
    const created = await ctx.as(role).post('/analyses', { title, spec });
    expect(created.status).toBe(201);
    return created.body.id as number;
  };
  const signedOff = async (title: string) => {
    const id = await create('analyst', title);
    expect((await ctx.as('analyst').post(`/analyses/${id}/submit`, {})).status).toBe(200);
    expect((await ctx.as('lead').post(`/analyses/${id}/sign-off`, {})).status).toBe(200);
    return id;
  };

  it('freezes a signed-off analysis: the author’s edit answers 409 and changes nothing; a re-run makes a draft that needs its own review', async () => {
    const id = await signedOff('Frozen split check');
    const edit = await ctx.as('analyst').patch(`/analyses/${id}`, { title: 'Quietly renamed' });
    expect(edit.status).toBe(409);
    expect(edit.body.error.message).toBe(
      `analysis ${id} is signed off, so it cannot be edited; re-run it to make a new version, which needs its own review`,
    );
    const after = await ctx.as('analyst').get(`/analyses/${id}`);
    expect(after.body).toMatchObject({ title: 'Frozen split check', status: 'signed_off' });

    const rerun = await ctx.as('analyst').post(`/analyses/${id}/rerun`, { spec: { ...after.body.spec, alpha: 0.01 } });
    expect(rerun.status).toBe(201);
    expect(rerun.body.analysis).toMatchObject({ version: 2, status: 'draft' });
    expect((await ctx.as('analyst').patch(`/analyses/${rerun.body.analysis.id}`, { title: 'Split check, corrected' })).status).toBe(200);
  });

  it('refuses the author’s delete of a signed-off analysis (409); an admin may, and the audit counts every version', async () => {
    const id = await signedOff('Signed-off and wanted gone');
    // A re-run must change something (the same spec on the same engine is refused as a duplicate).
    const { spec } = (await ctx.as('analyst').get(`/analyses/${id}`)).body;
    const v2 = (await ctx.as('analyst').post(`/analyses/${id}/rerun`, { spec: { ...spec, alpha: 0.01 } })).body.analysis.id;
    await ctx.as('analyst').post(`/analyses/${v2}/rerun`, { spec: { ...spec, alpha: 0.02 } }).expect(201);

    const refused = await ctx.as('analyst').delete(`/analyses/${id}`);
    expect(refused.status).toBe(409);
    expect(refused.body.error.message).toMatch(new RegExp(`^analysis ${id} has a signed-off version \\(version 1\\), so only an admin may delete it`));
    expect((await ctx.as('analyst').get(`/analyses/${id}`)).status).toBe(200);

    expect((await ctx.as('admin').delete(`/analyses/${id}`)).status).toBe(204);
    const event = await ctx.db('audit_events').where({ action: 'delete', entity_type: 'analysis' }).orderBy('id', 'desc').first();
    expect(event.summary).toBe('deleted analysis "Signed-off and wanted gone" (all 3 versions, signed off: version 1)');
    expect(event.actor_id).toBe(ctx.userIds.admin);
  });

  it('lets nobody sign off or return their own analysis, admins included', async () => {
    const adminsOwn = await create('admin', 'Admin’s own split');
    expect((await ctx.as('admin').post(`/analyses/${adminsOwn}/submit`, {})).status).toBe(200);
    const selfSignOff = await ctx.as('admin').post(`/analyses/${adminsOwn}/sign-off`, {});
    expect(selfSignOff.status).toBe(403);
    expect(selfSignOff.body.error.message).toBe('you wrote this analysis, so you cannot sign it off: a review needs a second person; ask another lead or an admin');
    expect((await ctx.as('admin').post(`/analyses/${adminsOwn}/return`, { comment: 'mine' })).status).toBe(403);

    // Someone else may: the lead signs off the admin's analysis; the admin signs off an analyst's.
    expect((await ctx.as('lead').post(`/analyses/${adminsOwn}/sign-off`, {})).status).toBe(200);
    expect(await signedOff('Analyst’s split')).toEqual(expect.any(Number));
    const analystsOwn = await create('analyst', 'Checked by an admin');
    await ctx.as('analyst').post(`/analyses/${analystsOwn}/submit`, {});
    expect((await ctx.as('admin').post(`/analyses/${analystsOwn}/sign-off`, {})).status).toBe(200);
  });
});
