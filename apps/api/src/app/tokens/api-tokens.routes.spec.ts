import { createTestApp, type TestContext } from '../../testing/test-app';

// Invented counts.
const spec = { observed: { labels: ['x', 'y', 'z'], counts: [40, 35, 25] }, hypothesis: { kind: 'equal' } };

describe('personal API tokens', () => {
  let ctx: TestContext;
  beforeAll(async () => (ctx = await createTestApp()));
  afterAll(() => ctx.close());

  it('shows a new token once, stores only its hash, and lists it without the secret', async () => {
    const created = await ctx.as('analyst').post('/tokens', { name: 'nightly pipeline' });
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({ name: 'nightly pipeline', token: expect.stringMatching(/^tf_[A-Za-z0-9_-]{43}$/), lastUsedAt: null, revokedAt: null });
    expect(created.body.hint).toBe(created.body.token.slice(0, 8));
    const row = await ctx.db('api_tokens').where({ id: created.body.id }).first();
    expect(row.token_hash).toMatch(/^[0-9a-f]{64}$/);
    expect(JSON.stringify(row)).not.toContain(created.body.token);
    const list = await ctx.as('analyst').get('/tokens');
    expect(list.body).toEqual([expect.not.objectContaining({ token: expect.anything() })]);
    expect(list.body[0].name).toBe('nightly pipeline');
  });

  it('acts with its owner’s role and notes when it was last used', async () => {
    const { token, id } = (await ctx.as('analyst').post('/tokens', { name: 'ci' })).body;
    const me = await ctx.as(token).get('/auth/me');
    expect(me.status).toBe(200);
    expect(me.body).toMatchObject({ email: 'analyst@test.local', role: 'analyst' });
    const computed = await ctx.as(token).post('/engine/analyze', spec);
    expect(computed.status).toBe(200);
    expect(computed.body.tests.pearson.df).toBe(2);
    expect((await ctx.as(token).get('/audit')).status).toBe(403);
    const listed = (await ctx.as('analyst').get('/tokens')).body.find((t: { id: number }) => t.id === id);
    expect(listed.lastUsedAt).toEqual(expect.any(String));
  });

  it('gets 401 once revoked; admins see and revoke anyone’s tokens', async () => {
    const { token, id } = (await ctx.as('viewer').post('/tokens', { name: 'report fetcher' })).body;
    expect((await ctx.as('viewer').get('/auth/me')).status).toBe(200);
    expect((await ctx.as('analyst').get('/tokens?owner=all')).status).toBe(403);
    expect((await ctx.as('analyst').delete(`/tokens/${id}`)).status).toBe(404);
    const everyone = await ctx.as('admin').get('/tokens?owner=all');
    expect(everyone.body.map((t: { owner: { name: string } }) => t.owner.name)).toContain('Test viewer');
    const ofViewer = await ctx.as('admin').get(`/tokens?owner=${ctx.userIds.viewer}`);
    expect(ofViewer.body.map((t: { id: number }) => t.id)).toEqual([id]);

    const revoked = await ctx.as('admin').delete(`/tokens/${id}`);
    expect(revoked.status).toBe(200);
    expect(revoked.body.revokedAt).toEqual(expect.any(String));
    const refused = await ctx.as(token).get('/auth/me');
    expect(refused.status).toBe(401);
    expect(refused.body.error).toEqual({ code: 'unauthorized', message: 'the API token is unknown or revoked' });
    const audit = await ctx.db('audit_events').where({ entity_type: 'api-token', entity_id: String(id) }).pluck('action');
    expect(audit).toEqual(['create', 'revoke']);
  });

  it('refuses a token whose owner is disabled, and one that was never issued', async () => {
    const { token } = (await ctx.as('lead').post('/tokens', { name: 'exports' })).body;
    await ctx.as('admin').patch(`/people/${ctx.userIds.lead}`, { disabled: true }).expect(200);
    expect((await ctx.as(token).get('/auth/me')).status).toBe(401);
    await ctx.as('admin').patch(`/people/${ctx.userIds.lead}`, { disabled: false }).expect(200);
    expect((await ctx.as(token).get('/auth/me')).status).toBe(200);
    expect((await ctx.as('tf_never-issued').get('/auth/me')).status).toBe(401);
  });

  it('names a bad token name with a 400 and answers 404 for an unknown token', async () => {
    const response = await ctx.as('analyst').post('/tokens', { name: '' });
    expect(response.status).toBe(400);
    expect(response.body.error.fields).toEqual([{ path: 'name', message: 'name must not be empty' }]);
    expect((await ctx.as('admin').delete('/tokens/999999')).status).toBe(404);
    expect((await ctx.as('admin').get('/tokens?owner=everyone')).body.error.fields[0].path).toBe('owner');
  });
});
