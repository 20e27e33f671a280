import { ENGINE_VERSION } from '@tallyfit/engine';
import { createTestApp, rowCounts, type TestContext } from '../../testing/test-app';
import { refuseAuditWrites } from '../../testing/refuse-audit-writes';

// McDonald, Handbook of Biological Statistics, 3rd ed. (2014), chi-square goodness-of-fit:
// 1752 vs 1895 under 1:1 gives X² = 5.6071, 1 df, p = 0.0179.
const seedlings = { observed: { labels: ['green', 'yellow'], counts: [1752, 1895] }, hypothesis: { kind: 'equal' } };
// Invented counts close to 1:1, for a re-run that flips the decision.
const nearlyEven = { observed: { labels: ['green', 'yellow'], counts: [1800, 1810] }, hypothesis: { kind: 'equal' } };

describe('analysis lifecycle: studies, edits, re-runs, deletion', () => {
  let ctx: TestContext;
  let studyId: number;
  beforeAll(async () => {
    ctx = await createTestApp();
    studyId = (await ctx.as('analyst').post('/studies', { name: 'Seed colours' })).body.id;
  });
  afterAll(() => ctx.close());

  const create = (body: object, role: 'analyst' | 'admin' = 'analyst') => ctx.as(role).post('/analyses', body);

  it('stores an analysis in a study with author, study, status, version and audit', async () => {
    const response = await create({ title: 'Seedlings', spec: seedlings, studyId, notes: 'first look' });
    expect(response.status).toBe(201);
    expect(response.body).toMatchObject({
      title: 'Seedlings',
      notes: 'first look',
      study: { id: studyId, name: 'Seed colours' },
      datasetId: null,
      status: 'draft',
      version: 1,
      seriesId: response.body.id,
      previousId: null,
      isLatest: true,
      engineVersion: ENGINE_VERSION,
    });
    const audit = await ctx.db('audit_events').where({ entity_type: 'analysis', entity_id: String(response.body.id) });
    expect(audit).toMatchObject([{ action: 'create', study_id: studyId, summary: 'ran analysis "Seedlings"' }]);
  });

  it('refuses a study the caller cannot see (404), cannot add to (403) or that is archived (409)', async () => {
    const adminStudy = (await ctx.as('admin').post('/studies', { name: 'Not shared' })).body.id;
    expect((await create({ title: 'x', spec: seedlings, studyId: adminStudy })).status).toBe(404);
    const readOnly = (await ctx.as('admin').post('/studies', { name: 'Read only' })).body.id;
    await ctx.as('admin').post(`/studies/${readOnly}/members`, { userId: ctx.userIds.analyst, studyRole: 'reader' }).expect(201);
    const forbidden = await create({ title: 'x', spec: seedlings, studyId: readOnly });
    expect(forbidden.status).toBe(403);
    const archived = (await ctx.as('analyst').post('/studies', { name: 'Closed' })).body.id;
    await ctx.as('analyst').patch(`/studies/${archived}`, { archived: true }).expect(200);
    const closed = await create({ title: 'x', spec: seedlings, studyId: archived });
    expect(closed.status).toBe(409);
    expect(closed.body.error.message).toMatch(/archived/);
  });

  it('edits title and notes, audited with before and after', async () => {
    const id = (await create({ title: 'Draft title', spec: seedlings, studyId })).body.id;
    const edited = await ctx.as('analyst').patch(`/analyses/${id}`, { title: 'Final title', notes: null });
    expect(edited.status).toBe(200);
    expect(edited.body).toMatchObject({ title: 'Final title', notes: null });
    const [event] = await ctx.db('audit_events').where({ entity_type: 'analysis', entity_id: String(id), action: 'update' });
    expect(JSON.parse(event.before_json)).toEqual({ title: 'Draft title', notes: null });
    expect(JSON.parse(event.after_json)).toEqual({ title: 'Final title', notes: null });
    expect((await ctx.as('analyst').patch(`/analyses/${id}`, {})).status).toBe(400);
    expect((await ctx.as('analyst').patch(`/analyses/${id}`, { title: '' })).body.error.fields).toEqual([
      { path: 'title', message: 'title must not be empty' },
    ]);
    expect((await ctx.as('lead').patch(`/analyses/${id}`, { title: 'lead edit' })).status).toBe(403);
  });

  it('re-runs as a new version and reports what changed', async () => {
    const first = (await create({ title: 'Re-run me', spec: seedlings, studyId })).body;
    // The same spec on the same engine would only duplicate the version: refused.
    const same = await ctx.as('analyst').post(`/analyses/${first.id}/rerun`, {});
    expect(same.status).toBe(409);
    expect(same.body.error.message).toContain('already run with the current engine');

    const withExact = await ctx.as('analyst').post(`/analyses/${first.id}/rerun`, { spec: { ...seedlings, tests: ['pearson', 'g', 'exact'] } });
    expect(withExact.status).toBe(201);
    expect(withExact.body.analysis).toMatchObject({ version: 2, seriesId: first.id, previousId: first.id, isLatest: true, status: 'draft' });
    expect(withExact.body.changes).toMatchObject({
      previousId: first.id,
      engineVersion: { before: ENGINE_VERSION, after: ENGINE_VERSION, changed: false },
      specChanged: true,
      decision: { before: true, after: true, changed: false },
    });
    expect(withExact.body.changes.tests.find((t: { test: string }) => t.test === 'pearson')).toMatchObject({ statisticDifference: 0, pDifference: 0 });
    // In words: test names, never spec keys or internal phrases.
    const words = withExact.body.changes.summary.join(' ');
    expect(words).toMatch(/Exact multinomial test was run for the first time \(p [=<] \.?\d*/);
    expect(words).not.toMatch(/pearson:|exact:|The spec is unchanged/);

    const changed = await ctx.as('analyst').post(`/analyses/${withExact.body.analysis.id}/rerun`, { spec: nearlyEven });
    expect(changed.status).toBe(201);
    expect(changed.body.analysis.version).toBe(3);
    expect(changed.body.changes.specChanged).toBe(true);
    expect(changed.body.changes.decision).toEqual({ before: true, after: false, changed: true });
    const pearson = changed.body.changes.tests.find((t: { test: string }) => t.test === 'pearson');
    expect(pearson.before.statistic).toBeCloseTo(5.6071, 4);
    expect(pearson.statisticDifference).toBeCloseTo(pearson.after.statistic - pearson.before.statistic, 12);
    expect(changed.body.changes.summary).toContain('The decision changed: the difference is no longer significant at the chosen level.');
    expect(changed.body.changes.summary).toContain('The observed counts changed.');

    // Kept after a reload: recomputed from the stored versions.
    const reloaded = await ctx.as('analyst').get(`/analyses/${changed.body.analysis.id}/changes`);
    expect(reloaded.status).toBe(200);
    expect(reloaded.body).toEqual(changed.body.changes);
    expect((await ctx.as('analyst').get(`/analyses/${first.id}/changes`)).body).toBeNull();

    const stale = await ctx.as('analyst').post(`/analyses/${first.id}/rerun`, {});
    expect(stale.status).toBe(409);
    const versions = await ctx.as('analyst').get(`/analyses/${first.id}/versions`);
    expect(versions.body.map((v: { version: number; isLatest: boolean }) => [v.version, v.isLatest])).toEqual([
      [1, false],
      [2, false],
      [3, true],
    ]);
    const history = await ctx.as('analyst').get('/analyses?q=Re-run');
    expect(history.body.items.map((v: { version: number }) => v.version)).toEqual([3]);
    expect((await ctx.as('analyst').get('/analyses?q=Re-run&allVersions=true')).body.total).toBe(3);
  });

  it('deletes softly (author or admin only), keeping rows and an audit event', async () => {
    const id = (await create({ title: 'Delete me', spec: seedlings, studyId })).body.id;
    await ctx.as('admin').post(`/studies/${studyId}/members`, { userId: ctx.userIds.lead, studyRole: 'reader' });
    expect((await ctx.as('lead').delete(`/analyses/${id}`)).status).toBe(403);
    expect((await ctx.as('analyst').delete(`/analyses/${id}`)).status).toBe(204);
    expect((await ctx.as('analyst').get(`/analyses/${id}`)).status).toBe(404);
    expect((await ctx.as('analyst').delete(`/analyses/${id}`)).status).toBe(404);
    const row = await ctx.db('analyses').where({ id }).first();
    expect(row.deleted_by).toBe(ctx.userIds.analyst);
    const [event] = await ctx.db('audit_events').where({ entity_type: 'analysis', entity_id: String(id), action: 'delete' });
    expect(JSON.parse(event.before_json)).toMatchObject({ title: 'Delete me', status: 'draft' });
  });

  it('stores nothing when the audit write fails after the analysis row was inserted', async () => {
    const tables = ['analyses', 'audit_events'];
    const before = await rowCounts(ctx.db, tables);
    const allowAuditWrites = await refuseAuditWrites(ctx.db, "new.entity_type = 'analysis'");
    try {
      expect((await create({ title: 'Half written', spec: seedlings, studyId })).status).toBe(500);
      const existing = (await ctx.db('analyses').where({ is_latest: true }).whereNull('deleted_at').first('id')).id;
      expect((await ctx.as('analyst').post(`/analyses/${existing}/rerun`, { spec: { ...nearlyEven, alpha: 0.01 } })).status).toBe(500);
    } finally {
      await allowAuditWrites();
    }
    expect(await rowCounts(ctx.db, tables)).toEqual(before);
    const [{ n }] = await ctx.db('analyses').where({ is_latest: false }).whereNull('deleted_at').count({ n: '*' });
    expect(Number(n)).toBe(2);
  });
});
