import request from 'supertest';
import { createTestApp, rowCounts, type TestContext } from '../../testing/test-app';
import { refuseAuditWrites } from '../../testing/refuse-audit-writes';

// Invented counts.
const spec = { observed: { labels: ['left', 'right'], counts: [130, 170] }, hypothesis: { kind: 'equal' } };

describe('reviews and comments', () => {
  let ctx: TestContext;
  let studyId: number;
  beforeAll(async () => {
    ctx = await createTestApp();
    studyId = (await ctx.as('analyst').post('/studies', { name: 'Reviewed work' })).body.id;
    await ctx.as('analyst').post(`/studies/${studyId}/members`, { userId: ctx.userIds.viewer, studyRole: 'reader' }).expect(201);
  });
  afterAll(() => ctx.close());

  const newAnalysis = async () => (await ctx.as('analyst').post('/analyses', { title: 'For review', spec, studyId })).body.id as number;

  it('walks draft → in review → returned → in review → signed off, recording each decision', async () => {
    const id = await newAnalysis();
    const submitted = await ctx.as('analyst').post(`/analyses/${id}/submit`, {});
    expect(submitted.status).toBe(200);
    expect(submitted.body.status).toBe('in_review');
    const returned = await ctx.as('lead').post(`/analyses/${id}/return`, { comment: 'Say which week the counts cover.' });
    expect(returned.body.status).toBe('returned');
    await ctx.as('analyst').post(`/analyses/${id}/submit`, { comment: 'Week 14.' }).expect(200);
    const signed = await ctx.as('lead').post(`/analyses/${id}/sign-off`, {});
    expect(signed.body.status).toBe('signed_off');

    const reviews = await ctx.as('viewer').get(`/analyses/${id}/reviews`);
    expect(reviews.body.map((r: { decision: string; comment: string | null; by: { name: string } }) => [r.decision, r.comment, r.by.name])).toEqual([
      ['submitted', null, 'Test analyst'],
      ['returned', 'Say which week the counts cover.', 'Test lead'],
      ['submitted', 'Week 14.', 'Test analyst'],
      ['signed_off', null, 'Test lead'],
    ]);
    const audit = await ctx.db('audit_events').where({ entity_type: 'analysis', entity_id: String(id), action: 'review' }).orderBy('id');
    expect(audit.map((e) => JSON.parse(e.after_json).status)).toEqual(['in_review', 'returned', 'in_review', 'signed_off']);
    expect((await ctx.as('lead').get(`/analyses?status=signed_off`)).body.items.map((a: { id: number }) => a.id)).toEqual([id]);
  });

  it('answers 409 for a decision the status does not allow', async () => {
    const id = await newAnalysis();
    const early = await ctx.as('lead').post(`/analyses/${id}/sign-off`, {});
    expect(early.status).toBe(409);
    expect(early.body.error.message).toBe(`analysis ${id} is a draft, so it cannot be signed off`);
    await ctx.as('analyst').post(`/analyses/${id}/submit`, {}).expect(200);
    expect((await ctx.as('analyst').post(`/analyses/${id}/submit`, {})).status).toBe(409);
  });

  it('lets only the author submit and only leads and admins decide', async () => {
    const id = await newAnalysis();
    const colleague = await ctx.as('admin').post('/people', { email: 'second@test.local', name: 'Second analyst', role: 'analyst', password: 'long enough password' });
    await ctx.as('analyst').post(`/studies/${studyId}/members`, { userId: colleague.body.id, studyRole: 'contributor' }).expect(201);
    const login = await request(ctx.app).post('/api/v1/auth/login').send({ email: 'second@test.local', password: 'long enough password' });
    const notAuthor = await ctx.as(login.body.accessToken).post(`/analyses/${id}/submit`, {});
    expect(notAuthor.status).toBe(403);
    expect(notAuthor.body.error.message).toBe('only the author of an analysis (or an admin) may submit it for review');
    expect((await ctx.as('admin').post(`/analyses/${id}/submit`, {})).status).toBe(200);
    expect((await ctx.as('viewer').post(`/analyses/${id}/sign-off`, {})).status).toBe(403);
    expect((await ctx.as('analyst').post(`/analyses/${id}/return`, { comment: 'no' })).status).toBe(403);
  });

  it('needs a reason to return an analysis (400 naming comment)', async () => {
    const id = await newAnalysis();
    await ctx.as('analyst').post(`/analyses/${id}/submit`, {}).expect(200);
    const response = await ctx.as('lead').post(`/analyses/${id}/return`, { comment: '  ' });
    expect(response.status).toBe(400);
    expect(response.body.error.fields).toEqual([{ path: 'comment', message: 'comment must say why the analysis is returned' }]);
  });

  it('takes comments from anyone who can read the analysis, and 404 from others', async () => {
    const id = await newAnalysis();
    const fromViewer = await ctx.as('viewer').post(`/analyses/${id}/comments`, { body: 'Is the right column the new layout?' });
    expect(fromViewer.status).toBe(201);
    expect(fromViewer.body).toMatchObject({ analysisId: id, body: 'Is the right column the new layout?', author: { name: 'Test viewer' } });
    await ctx.as('lead').post(`/analyses/${id}/comments`, { body: 'Yes.' }).expect(201);
    const list = await ctx.as('analyst').get(`/analyses/${id}/comments`);
    expect(list.body.map((c: { body: string }) => c.body)).toEqual(['Is the right column the new layout?', 'Yes.']);

    const hidden = (await ctx.as('admin').post('/analyses', { title: 'Admin own', spec })).body.id;
    expect((await ctx.as('viewer').post(`/analyses/${hidden}/comments`, { body: 'peek' })).status).toBe(404);
    expect((await ctx.as('viewer').get(`/analyses/999999/comments`)).status).toBe(404);
    const empty = await ctx.as('viewer').post(`/analyses/${id}/comments`, { body: '' });
    expect(empty.status).toBe(400);
    expect(empty.body.error.fields[0].path).toBe('body');
  });

  it('leaves status and reviews untouched when the audit write fails', async () => {
    const id = await newAnalysis();
    const before = await rowCounts(ctx.db, ['analysis_reviews', 'analysis_comments', 'audit_events']);
    const allowAuditWrites = await refuseAuditWrites(ctx.db, "new.action in ('review', 'create')");
    try {
      expect((await ctx.as('analyst').post(`/analyses/${id}/submit`, {})).status).toBe(500);
      expect((await ctx.as('analyst').post(`/analyses/${id}/comments`, { body: 'lost' })).status).toBe(500);
    } finally {
      await allowAuditWrites();
    }
    expect(await rowCounts(ctx.db, ['analysis_reviews', 'analysis_comments', 'audit_events'])).toEqual(before);
    expect((await ctx.db('analyses').where({ id }).first()).status).toBe('draft');
  });
});

describe('withdrawing a submission', () => {
  let ctx: TestContext;
  beforeAll(async () => {
    ctx = await createTestApp();
  });
  afterAll(() => ctx.close());

  it('takes an analysis in review back to draft, by its author only, recorded and audited', async () => {
    const id = (await ctx.as('analyst').post('/analyses', { title: 'Second thoughts', spec })).body.id;
    const early = await ctx.as('analyst').post(`/analyses/${id}/withdraw`, {});
    expect(early.status).toBe(409);
    expect(early.body.error.message).toBe(`analysis ${id} is a draft, so it cannot be withdrawn from review`);
    await ctx.as('analyst').post(`/analyses/${id}/submit`, {}).expect(200);
    const byAdmin = await ctx.as('admin').post(`/analyses/${id}/withdraw`, {});
    expect(byAdmin.status).toBe(403);
    expect(byAdmin.body.error.message).toBe('only the author of an analysis may withdraw its submission');
    expect((await ctx.as('viewer').post(`/analyses/${id}/withdraw`, {})).status).toBe(403);

    const withdrawn = await ctx.as('analyst').post(`/analyses/${id}/withdraw`, { comment: 'Wrong week.' });
    expect(withdrawn.status).toBe(200);
    expect(withdrawn.body.status).toBe('draft');
    const reviews = await ctx.as('analyst').get(`/analyses/${id}/reviews`);
    expect(reviews.body.map((r: { decision: string }) => r.decision)).toEqual(['submitted', 'withdrawn']);
    const audit = await ctx.db('audit_events').where({ entity_type: 'analysis', entity_id: String(id), action: 'review' }).orderBy('id');
    expect(audit.map((e) => e.summary)).toEqual(['submitted for review analysis "Second thoughts"', 'withdrawn from review analysis "Second thoughts"']);
    // A lead can no longer decide on it, and it can be submitted again.
    expect((await ctx.as('lead').post(`/analyses/${id}/sign-off`, {})).status).toBe(409);
    await ctx.as('analyst').post(`/analyses/${id}/submit`, {}).expect(200);
  });
});
