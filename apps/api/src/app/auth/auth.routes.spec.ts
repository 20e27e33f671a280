import request from 'supertest';
import { createTestApp, TEST_PASSWORD, type TestContext } from '../../testing/test-app';

describe('sign-in', () => {
  let ctx: TestContext;
  beforeAll(async () => (ctx = await createTestApp()));
  afterAll(() => ctx.close());

  it('returns a bearer token and the person for the right password', async () => {
    const response = await request(ctx.app).post('/api/v1/auth/login').send({ email: 'Analyst@Test.local', password: TEST_PASSWORD });
    expect(response.status).toBe(200);
    expect(response.body.user).toEqual({ id: expect.any(Number), email: 'analyst@test.local', name: 'Test analyst', role: 'analyst' });
    expect(response.body.expiresIn).toBe(900);
    const me = await request(ctx.app).get('/api/v1/auth/me').set('Authorization', `Bearer ${response.body.accessToken}`);
    expect(me.status).toBe(200);
    expect(me.body.email).toBe('analyst@test.local');
  });

  it('gives one 401 message for a wrong password and for an unknown e-mail', async () => {
    const wrong = await request(ctx.app).post('/api/v1/auth/login').send({ email: 'analyst@test.local', password: 'nope' });
    const unknown = await request(ctx.app).post('/api/v1/auth/login').send({ email: 'nobody@test.local', password: 'nope' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body).toEqual(unknown.body);
    expect(wrong.body.error.message).toBe('e-mail or password is wrong');
  });

  it('names the bad field with a 400', async () => {
    const response = await request(ctx.app).post('/api/v1/auth/login').send({ email: 'not-an-email', password: '' });
    expect(response.status).toBe(400);
    expect(response.body.error.fields.map((field: { path: string }) => field.path)).toEqual(['email', 'password']);
  });

  it('stores the password as a bcrypt hash, never in clear', async () => {
    const row = await ctx.db('users').where({ email: 'analyst@test.local' }).first();
    expect(row.password_hash).toMatch(/^\$2[aby]\$10\$/);
    expect(row.password_hash).not.toContain(TEST_PASSWORD);
  });

  it('refuses a token signed with another secret, and a disabled person', async () => {
    const jwt = await import('jsonwebtoken');
    const forged = jwt.sign({ sub: '1', role: 'admin' }, 'another-secret', { issuer: 'tallyfit' });
    expect((await request(ctx.app).get('/api/v1/auth/me').set('Authorization', `Bearer ${forged}`)).status).toBe(401);

    await ctx.db('users').where({ email: 'viewer@test.local' }).update({ disabled: true });
    const response = await request(ctx.app).get('/api/v1/auth/me').set('Authorization', `Bearer ${ctx.tokens.viewer}`);
    expect(response.status).toBe(401);
    await ctx.db('users').where({ email: 'viewer@test.local' }).update({ disabled: false });
  });
});
