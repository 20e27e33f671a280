import { createServer, type AddressInfo } from 'node:net';
import { createTestApp, rowCounts, type TestContext } from '../../testing/test-app';

// Invented: a two-way split of 1 000 visitors.
const spec = { observed: { labels: ['A', 'B'], counts: [478, 522] }, hypothesis: { kind: 'equal' } };

describe('sharing by e-mail through the local stand-in', () => {
  let ctx: TestContext;
  let analysisId: number;
  beforeAll(async () => {
    ctx = await createTestApp();
    analysisId = (await ctx.as('analyst').post('/analyses', { title: 'Split check, week 49', spec })).body.id;
  });
  afterAll(() => ctx.close());

  it('delivers the report to the recipients, records the share and its audit event', async () => {
    const response = await ctx.as('analyst').post(`/analyses/${analysisId}/shares`, {
      to: ['Ana@Example.test', 'bo@example.test'],
      message: 'Please look before Friday.',
    });
    expect(response.status).toBe(201);
    expect(response.body).toMatchObject({
      analysisId,
      sentBy: { id: ctx.userIds.analyst, name: 'Test analyst' },
      to: ['ana@example.test', 'bo@example.test'],
      status: 'sent',
      failureReason: null,
    });

    const outbox = await ctx.as('admin').get('/outbox');
    expect(outbox.status).toBe(200);
    expect(outbox.body.available).toBe(true);
    const [mail] = outbox.body.messages;
    expect(mail.to).toEqual(['ana@example.test', 'bo@example.test']);
    expect(mail.subject).toBe('Tallyfit analysis: Split check, week 49');
    expect(mail.text).toContain('Test analyst shared the Tallyfit analysis "Split check, week 49" with you.');
    expect(mail.text).toContain('Please look before Friday.');
    expect(mail.text).toContain(`Open it in Tallyfit: http://localhost:3000/analyses/${analysisId}`);
    // 478 vs 500 expected: X² = 2 × 22² / 500 = 1.936 (hand arithmetic).
    expect(mail.text).toContain('χ²(1, N = 1,000) = 1.94');
    expect(mail.attachments).toEqual([
      { fileName: `analysis-${analysisId}-split-check-week-49.md`, contentType: 'text/markdown', sizeBytes: expect.any(Number) },
    ]);
    // The HTML alternative renders the report: headings and tables, not raw Markdown.
    expect(mail.html).toContain('<h1>Split check, week 49</h1>');
    expect(mail.html).toContain('<table>');
    expect(mail.html).toContain('χ²(1, N = 1,000) = 1.94');
    expect(mail.html).not.toContain('**Study:**');
    expect(mail.html).not.toMatch(/^\|/m);
    expect(mail.html).toContain(`<a href="http://localhost:3000/analyses/${analysisId}">Open it in Tallyfit</a>`);
    const attached = ctx.mail.outbox()![0].attachments[0].content;
    expect(attached).toMatch(/^# Split check, week 49\n/);

    const audit = await ctx.db('audit_events').where({ action: 'share', entity_id: String(analysisId) }).first();
    expect(audit.summary).toBe('shared analysis "Split check, week 49" with ana@example.test, bo@example.test');
    const shares = await ctx.as('analyst').get(`/analyses/${analysisId}/shares`);
    expect(shares.body).toHaveLength(1);
  });

  it('answers 400 naming the field for a bad address and sends nothing', async () => {
    const before = ctx.mail.outbox()!.length;
    const response = await ctx.as('analyst').post(`/analyses/${analysisId}/shares`, { to: ['not-an-address'] });
    expect(response.status).toBe(400);
    expect(response.body.error.fields[0].path).toBe('to.0');
    expect((await ctx.as('analyst').post(`/analyses/${analysisId}/shares`, { to: [] })).status).toBe(400);
    expect(ctx.mail.outbox()!.length).toBe(before);
  });

  it('refuses a viewer (403), an analysis the caller cannot read (404), and the outbox to non-admins', async () => {
    expect((await ctx.as('viewer').post(`/analyses/${analysisId}/shares`, { to: ['a@example.test'] })).status).toBe(403);
    const adminsOwn = (await ctx.as('admin').post('/analyses', { title: 'Admin only', spec })).body.id;
    expect((await ctx.as('analyst').post(`/analyses/${adminsOwn}/shares`, { to: ['a@example.test'] })).status).toBe(404);
    for (const role of ['lead', 'analyst', 'viewer'] as const) expect((await ctx.as(role).get('/outbox')).status).toBe(403);
  });
});

describe('sharing when the mail server cannot be reached', () => {
  let ctx: TestContext;
  let analysisId: number;
  beforeAll(async () => {
    // A port that was free a moment ago and that nothing listens on.
    const probe = createServer();
    await new Promise<void>((resolve) => probe.listen(0, '127.0.0.1', resolve));
    const { port } = probe.address() as AddressInfo;
    await new Promise<void>((resolve) => probe.close(() => resolve()));
    ctx = await createTestApp({ env: { SMTP_URL: `smtp://127.0.0.1:${port}` } });
    analysisId = (await ctx.as('analyst').post('/analyses', { title: 'Unsent', spec })).body.id;
  });
  afterAll(() => ctx.close());

  it('answers 502, sends nothing, and records the share as failed with the reason', async () => {
    const response = await ctx.as('analyst').post(`/analyses/${analysisId}/shares`, { to: ['ana@example.test'] });
    expect(response.status).toBe(502);
    expect(response.body.error.code).toBe('mail_not_sent');
    expect(response.body.error.message).toMatch(/^nothing was sent: the mail server \(smtp:\/\/127\.0\.0\.1:\d+\/?\) did not take the message: .*ECONNREFUSED/);
    const [share] = (await ctx.as('analyst').get(`/analyses/${analysisId}/shares`)).body;
    expect(share).toMatchObject({ status: 'failed', to: ['ana@example.test'] });
    expect(share.failureReason).toMatch(/ECONNREFUSED/);
    const audit = await ctx.db('audit_events').where({ action: 'share' }).first();
    expect(audit.summary).toMatch(/^tried to share analysis "Unsent" with ana@example.test; the mail server did not take it/);
    expect(await rowCounts(ctx.db, ['shares'])).toEqual({ shares: 1 });
    const outbox = await ctx.as('admin').get('/outbox');
    expect(outbox.body).toEqual({ available: false, destination: expect.stringMatching(/^smtp:\/\/127\.0\.0\.1:\d+/), messages: [] });
  });
});
