import { createTestApp, rowCounts, type TestContext } from '../../testing/test-app';
import { refuseAuditWrites } from '../../testing/refuse-audit-writes';

describe('studies', () => {
  let ctx: TestContext;
  beforeAll(async () => (ctx = await createTestApp()));
  afterAll(() => ctx.close());

  async function newStudy(name: string, role: 'analyst' | 'admin' = 'analyst') {
    const response = await ctx.as(role).post('/studies', { name, description: 'made up for a test' });
    expect(response.status).toBe(201);
    return response.body as { id: number; name: string };
  }

  it('creates a study with its creator as owner, and records it in the audit trail', async () => {
    const response = await ctx.as('analyst').post('/studies', { name: '  Checkout split  ' });
    expect(response.status).toBe(201);
    expect(response.body).toMatchObject({
      name: 'Checkout split',
      archived: false,
      myStudyRole: 'owner',
      memberCount: 1,
      members: [{ userId: ctx.userIds.analyst, studyRole: 'owner', role: 'analyst' }],
    });
    const audit = await ctx.db('audit_events').where({ entity_type: 'study', entity_id: String(response.body.id) });
    expect(audit).toHaveLength(1);
    expect(audit[0]).toMatchObject({ action: 'create', actor_id: ctx.userIds.analyst });
    expect(JSON.parse(audit[0].after_json)).toMatchObject({ name: 'Checkout split' });
  });

  it('shows members their studies, leads and admins every study, and others a 404', async () => {
    const study = await newStudy('Panel make-up', 'admin');
    const names = async (role: 'admin' | 'lead' | 'analyst' | 'viewer') =>
      ((await ctx.as(role).get('/studies')).body as Array<{ name: string }>).map((s) => s.name);
    expect(await names('lead')).toContain('Panel make-up');
    expect(await names('analyst')).not.toContain('Panel make-up');
    expect(await names('viewer')).not.toContain('Panel make-up');
    expect((await ctx.as('viewer').get(`/studies/${study.id}`)).status).toBe(404);

    await ctx.as('admin').post(`/studies/${study.id}/members`, { userId: ctx.userIds.viewer, studyRole: 'reader' }).expect(201);
    expect(await names('viewer')).toContain('Panel make-up');
    const detail = await ctx.as('viewer').get(`/studies/${study.id}`);
    expect(detail.status).toBe(200);
    expect(detail.body.myStudyRole).toBe('reader');
  });

  it('lets owners rename and archive; archived studies leave the default list', async () => {
    const study = await newStudy('Tickets by weekday');
    const renamed = await ctx.as('analyst').patch(`/studies/${study.id}`, { name: 'Tickets by weekday, Q3' });
    expect(renamed.status).toBe(200);
    expect(renamed.body.name).toBe('Tickets by weekday, Q3');
    const archived = await ctx.as('analyst').patch(`/studies/${study.id}`, { archived: true });
    expect(archived.body).toMatchObject({ archived: true, archivedAt: expect.any(String) });
    const list = (await ctx.as('analyst').get('/studies')).body as Array<{ id: number }>;
    expect(list.map((s) => s.id)).not.toContain(study.id);
    const all = (await ctx.as('analyst').get('/studies?includeArchived=true')).body as Array<{ id: number }>;
    expect(all.map((s) => s.id)).toContain(study.id);

    const events = await ctx.db('audit_events').where({ entity_type: 'study', entity_id: String(study.id) }).orderBy('id');
    expect(events.map((e) => e.summary)).toEqual([
      'created study "Tickets by weekday"',
      'changed study "Tickets by weekday, Q3"',
      'archived study "Tickets by weekday, Q3"',
    ]);
    expect(JSON.parse(events[1].before_json).name).toBe('Tickets by weekday');
  });

  it('refuses changes from readers (403) and from people who cannot see the study (404)', async () => {
    const study = await newStudy('Owner only');
    await ctx.as('analyst').post(`/studies/${study.id}/members`, { userId: ctx.userIds.viewer, studyRole: 'reader' }).expect(201);
    const asAdminMade = await newStudy('Someone else’s', 'admin');
    expect((await ctx.as('analyst').patch(`/studies/${asAdminMade.id}`, { name: 'mine now' })).status).toBe(404);
    // A lead reads the study but does not own it.
    expect((await ctx.as('lead').get(`/studies/${study.id}`)).status).toBe(200);
    expect((await ctx.as('viewer').patch(`/studies/${study.id}`, { name: 'x' })).status).toBe(403);
  });

  it('names the bad fields with a 400', async () => {
    const empty = await ctx.as('analyst').post('/studies', { name: '' });
    expect(empty.status).toBe(400);
    expect(empty.body.error.fields).toEqual([{ path: 'name', message: 'name must not be empty' }]);
    const member = await ctx.as('admin').post('/studies/1/members', { userId: 'x', studyRole: 'boss' });
    expect(member.status).toBe(400);
    expect(member.body.error.fields.map((f: { path: string }) => f.path).sort()).toEqual(['studyRole', 'userId']);
    const noChange = await ctx.as('admin').patch('/studies/1', {});
    expect(noChange.status).toBe(400);
    expect(noChange.body.error.message).toMatch(/at least one of name, description, archived/);
  });

  it('answers 404 for a study or person that does not exist', async () => {
    expect((await ctx.as('admin').get('/studies/999999')).status).toBe(404);
    const study = await newStudy('Missing person');
    const response = await ctx.as('analyst').post(`/studies/${study.id}/members`, { userId: 999999, studyRole: 'reader' });
    expect(response.status).toBe(404);
    expect(response.body.error.message).toBe('person 999999 does not exist');
  });

  it('answers 409 for a duplicate member and for removing the last owner, 422 for a viewer as contributor', async () => {
    const study = await newStudy('Members');
    await ctx.as('analyst').post(`/studies/${study.id}/members`, { userId: ctx.userIds.lead, studyRole: 'reader' }).expect(201);
    const duplicate = await ctx.as('analyst').post(`/studies/${study.id}/members`, { userId: ctx.userIds.lead, studyRole: 'contributor' });
    expect(duplicate.status).toBe(409);
    expect(duplicate.body.error).toEqual({ code: 'conflict', message: 'Test lead is already a member of this study' });

    const lastOwner = await ctx.as('analyst').delete(`/studies/${study.id}/members/${ctx.userIds.analyst}`);
    expect(lastOwner.status).toBe(409);

    const viewer = await ctx.as('analyst').post(`/studies/${study.id}/members`, { userId: ctx.userIds.viewer, studyRole: 'contributor' });
    expect(viewer.status).toBe(422);
    expect(viewer.body.error.fields).toEqual([{ path: 'studyRole', message: 'a viewer can only be a reader' }]);
  });

  it('changes a member’s study role and removes a member, each audited', async () => {
    const study = await newStudy('Roles');
    await ctx.as('analyst').post(`/studies/${study.id}/members`, { userId: ctx.userIds.admin, studyRole: 'reader' }).expect(201);
    const changed = await ctx.as('analyst').patch(`/studies/${study.id}/members/${ctx.userIds.admin}`, { studyRole: 'owner' });
    expect(changed.status).toBe(200);
    expect(changed.body.members.find((m: { userId: number }) => m.userId === ctx.userIds.admin).studyRole).toBe('owner');
    await ctx.as('analyst').delete(`/studies/${study.id}/members/${ctx.userIds.admin}`).expect(204);
    const actions = await ctx.db('audit_events').where({ entity_type: 'study-member', study_id: study.id }).orderBy('id').pluck('action');
    expect(actions).toEqual(['create', 'role-change', 'delete']);
    expect((await ctx.as('analyst').delete(`/studies/${study.id}/members/${ctx.userIds.admin}`)).status).toBe(404);
  });

  it('leaves no study, member or audit row behind when a write fails half-way', async () => {
    const before = await rowCounts(ctx.db, ['studies', 'study_members', 'audit_events']);
    // A study row is inserted, then the audit insert fails: the transaction must undo the study too.
    const allowAuditWrites = await refuseAuditWrites(ctx.db, "new.entity_type = 'study'");
    try {
      const response = await ctx.as('analyst').post('/studies', { name: 'Half written' });
      expect(response.status).toBe(500);
      expect(response.body).toEqual({ error: { code: 'internal', message: 'something went wrong on our side' } });
    } finally {
      await allowAuditWrites();
    }
    expect(await rowCounts(ctx.db, ['studies', 'study_members', 'audit_events'])).toEqual(before);
  });
});
