import type { Notification } from '@tallyfit/contracts';
import { createTestApp, rowCounts, type TestContext } from '../../testing/test-app';
import { refuseAuditWrites } from '../../testing/refuse-audit-writes';

// Invented counts.
const spec = { observed: { labels: ['left', 'right'], counts: [130, 170] }, hypothesis: { kind: 'equal' } };

/** The e-mail copies go out after the decision's answer; wait until none is pending. */
async function mailSettled(ctx: TestContext): Promise<void> {
  for (let attempt = 0; attempt < 100; attempt++) {
    if ((await ctx.db('notifications').where({ mail_status: 'pending' }).count({ count: '*' }))[0].count == 0) return;
    await new Promise((resolve) => setTimeout(resolve, 50));
  }
  throw new Error('notification e-mails still pending after 5 s');
}

describe('notifications of review decisions', () => {
  let ctx: TestContext;
  let studyId: number;
  beforeAll(async () => {
    ctx = await createTestApp();
    studyId = (await ctx.as('analyst').post('/studies', { name: 'Notified work' })).body.id;
  });
  afterAll(async () => {
    await mailSettled(ctx);
    await ctx.close();
  });

  const newAnalysis = async (title = 'Door split') => (await ctx.as('analyst').post('/analyses', { title, spec, studyId })).body.id as number;
  const mine = async (role: 'admin' | 'lead' | 'analyst' | 'viewer', query = '') => (await ctx.as(role).get(`/notifications${query}`)).body;

  it('tells every reviewer but the author of a submission, and the author of a return and a sign-off', async () => {
    await ctx.as('admin').post('/notifications/read-all').expect(200);
    await ctx.as('lead').post('/notifications/read-all').expect(200);
    await ctx.as('analyst').post('/notifications/read-all').expect(200);
    const id = await newAnalysis('Door split, week 3');

    await ctx.as('analyst').post(`/analyses/${id}/submit`, {}).expect(200);
    for (const reviewer of ['lead', 'admin'] as const) {
      const page = await mine(reviewer, '?unread=true');
      expect(page.unreadCount).toBe(1);
      expect(page.items[0]).toMatchObject({ kind: 'submitted', analysis: { id, title: 'Door split, week 3' }, actor: { name: 'Test analyst' }, readAt: null });
    }
    expect((await mine('analyst')).unreadCount).toBe(0);
    expect((await mine('viewer')).unreadCount).toBe(0);

    await ctx.as('lead').post(`/analyses/${id}/return`, { comment: 'Which week do the counts cover?' }).expect(200);
    const returned = (await mine('analyst')).items[0] as Notification;
    expect(returned).toMatchObject({ kind: 'returned', note: 'Which week do the counts cover?', actor: { name: 'Test lead' } });

    await ctx.as('analyst').post(`/analyses/${id}/submit`, { comment: 'Week 3.' }).expect(200);
    await ctx.as('lead').post(`/analyses/${id}/sign-off`, {}).expect(200);
    const analystPage = await mine('analyst');
    expect(analystPage.items.map((n: Notification) => n.kind)).toEqual(['signed_off', 'returned']);
    expect(analystPage.unreadCount).toBe(2);
    // The lead does not hear of their own decisions; the second submission reached them again.
    expect((await mine('lead')).items.map((n: Notification) => n.kind)).toEqual(['submitted', 'submitted']);
  });

  it('e-mails each recipient after the decision, with the note and a link, and records that it was sent', async () => {
    const id = await newAnalysis('Shelf mix');
    await ctx.as('analyst').post(`/analyses/${id}/submit`, {}).expect(200);
    await ctx.as('lead').post(`/analyses/${id}/return`, { comment: 'Add the store number to the title.' }).expect(200);
    await mailSettled(ctx);
    const outbox = ctx.mail.outbox() ?? [];
    const toAnalyst = outbox.find((mail) => mail.to.includes('analyst@test.local') && mail.subject.includes('"Shelf mix"'));
    expect(toAnalyst?.subject).toBe('Tallyfit: Test lead returned "Shelf mix" for changes');
    expect(toAnalyst?.text).toContain('Add the store number to the title.');
    expect(toAnalyst?.text).toContain(`Open it in Tallyfit: http://localhost:3000/analyses/${id}`);
    const toReviewers = outbox.filter((mail) => mail.subject === 'Tallyfit: Test analyst submitted "Shelf mix" for review');
    expect(toReviewers.map((mail) => mail.to).sort()).toEqual([['admin@test.local'], ['lead@test.local']]);
    const rows = await ctx.db('notifications').where({ analysis_id: id });
    expect(rows.map((row) => row.mail_status)).toEqual(['sent', 'sent', 'sent']);
  });

  it('marks one or all read, pages newest first, and hides other people’s notifications', async () => {
    const page = await mine('analyst', '?pageSize=1');
    expect(page.items).toHaveLength(1);
    expect(page.total).toBeGreaterThan(1);
    const first = page.items[0] as Notification;
    const read = await ctx.as('analyst').post(`/notifications/${first.id}/read`);
    expect(read.status).toBe(200);
    expect(read.body.readAt).not.toBeNull();
    expect((await mine('analyst')).unreadCount).toBe(page.unreadCount - 1);
    expect((await ctx.as('lead').post(`/notifications/${first.id}/read`)).status).toBe(404);
    const all = await ctx.as('analyst').post('/notifications/read-all');
    expect(all.body.marked).toBe(page.unreadCount - 1);
    expect((await mine('analyst')).unreadCount).toBe(0);
    expect((await ctx.as('analyst').get('/notifications?unread=maybe')).status).toBe(400);
  });

  it('writes no notification, review or status change when the audit write fails', async () => {
    const id = await newAnalysis('Refused');
    const before = await rowCounts(ctx.db, ['notifications', 'analysis_reviews', 'audit_events']);
    const allowAuditWrites = await refuseAuditWrites(ctx.db, "new.action = 'review'");
    try {
      expect((await ctx.as('analyst').post(`/analyses/${id}/submit`, {})).status).toBe(500);
    } finally {
      await allowAuditWrites();
    }
    expect(await rowCounts(ctx.db, ['notifications', 'analysis_reviews', 'audit_events'])).toEqual(before);
    expect((await ctx.db('analyses').where({ id }).first()).status).toBe('draft');
  });
});

describe('notifications when the mail server refuses', () => {
  let ctx: TestContext;
  beforeAll(async () => {
    // Nothing listens on port 9 of loopback: every message fails, quickly.
    ctx = await createTestApp({ env: { SMTP_URL: 'smtp://127.0.0.1:9' } });
  });
  afterAll(() => ctx.close());

  it('keeps the decision and records the failure on the notification', async () => {
    const id = (await ctx.as('analyst').post('/analyses', { title: 'Offline mail', spec })).body.id;
    const submitted = await ctx.as('analyst').post(`/analyses/${id}/submit`, {});
    expect(submitted.status).toBe(200);
    expect(submitted.body.status).toBe('in_review');
    await mailSettled(ctx);
    const page = await ctx.as('lead').get('/notifications');
    expect(page.body.items[0]).toMatchObject({ kind: 'submitted', mailStatus: 'failed' });
    expect(page.body.items[0].mailFailure).toMatch(/ECONNREFUSED|connect/);
  });
});
