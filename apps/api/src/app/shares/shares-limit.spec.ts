import { createTestApp, type TestContext } from '../../testing/test-app';
import { SHARES_PER_HOUR } from './shares.service';

// Invented counts: a two-way split.
const spec = { observed: { labels: ['a', 'b'], counts: [510, 490] }, hypothesis: { kind: 'equal' } };

describe('e-mail shares per person per hour', () => {
  let ctx: TestContext;
  let analysisId: number;
  beforeAll(async () => {
    ctx = await createTestApp();
    analysisId = (await ctx.as('analyst').post('/analyses', { title: 'Split check', spec })).body.id;
  });
  afterAll(() => ctx.close());

  it('counts the shares table (so every server sees the same count) and answers 429 with Retry-After past the limit', async () => {
    // Shares recorded earlier in this hour, by this server or another one on the same database.
    const earlier = Array.from({ length: SHARES_PER_HOUR - 1 }, () => ({
      analysis_id: analysisId,
      sent_by: ctx.userIds.analyst,
      recipients_json: '["a@example.test"]',
      status: 'sent',
    }));
    await ctx.db('shares').insert(earlier);
    const last = await ctx.as('analyst').post(`/analyses/${analysisId}/shares`, { to: ['b@example.test'] });
    expect(last.status).toBe(201);

    const outboxBefore = ctx.mail.outbox()!.length;
    const refused = await ctx.as('analyst').post(`/analyses/${analysisId}/shares`, { to: ['c@example.test'] });
    expect(refused.status).toBe(429);
    expect(refused.body.error.code).toBe('too_many_shares');
    expect(refused.body.error.message).toMatch(/^you have shared 20 times in the last hour, the most allowed; try again in \d+ minutes$/);
    expect(Number(refused.headers['retry-after'])).toBeGreaterThan(0);
    expect(ctx.mail.outbox()!.length).toBe(outboxBefore);

    // Another person's allowance is their own.
    expect((await ctx.as('lead').post(`/analyses/${analysisId}/shares`, { to: ['d@example.test'] })).status).toBe(201);
  });
});
