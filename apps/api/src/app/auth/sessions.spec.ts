import request from 'supertest';
import { createTestApp, rowCounts, TEST_PASSWORD, type TestContext } from '../../testing/test-app';
import { refuseAuditWrites } from '../../testing/refuse-audit-writes';

describe('sessions: refresh, sign-out, password change, rate limit', () => {
  let ctx: TestContext;
  beforeAll(async () => (ctx = await createTestApp({ env: { LOGIN_ATTEMPTS_PER_15_MINUTES: '3' } })));
  afterAll(() => ctx.close());

  const login = (email: string, password = TEST_PASSWORD) => request(ctx.app).post('/api/v1/auth/login').send({ email, password });
  const refresh = (refreshToken: string) => request(ctx.app).post('/api/v1/auth/refresh').send({ refreshToken });

  it('returns a refresh token with the sign-in, stored only as a hash', async () => {
    const response = await login('lead@test.local');
    expect(response.body).toMatchObject({ accessToken: expect.any(String), expiresIn: 900, refreshToken: expect.stringMatching(/^tfr_/) });
    const rows = await ctx.db('refresh_tokens').where({ user_id: ctx.userIds.lead });
    expect(rows.length).toBeGreaterThan(0);
    expect(JSON.stringify(rows)).not.toContain(response.body.refreshToken);
  });

  it('rotates: a refresh gives a new pair and the old refresh token stops working', async () => {
    const first = (await login('lead@test.local')).body;
    const second = await refresh(first.refreshToken);
    expect(second.status).toBe(200);
    expect(second.body.refreshToken).not.toBe(first.refreshToken);
    expect(second.body.user.email).toBe('lead@test.local');
    expect((await ctx.as(second.body.accessToken).get('/auth/me')).status).toBe(200);

    // Using the old one again looks like a stolen copy: it fails and signs the person out everywhere.
    const replay = await refresh(first.refreshToken);
    expect(replay.status).toBe(401);
    expect(replay.body.error.message).toBe('the refresh token is not valid; sign in again');
    expect((await refresh(second.body.refreshToken)).status).toBe(401);
  });

  it('records a real sign-in in words, and no sign-in for a session restored by refresh', async () => {
    const signIns = () => ctx.db('audit_events').where({ action: 'sign-in', actor_id: ctx.userIds.viewer });
    const before = (await signIns()).length;
    const session = (await login('viewer@test.local')).body;
    const after = await signIns();
    expect(after.length).toBe(before + 1);
    expect(after[after.length - 1].summary).toBe('Test viewer signed in');
    expect((await refresh(session.refreshToken)).status).toBe(200);
    expect((await signIns()).length).toBe(before + 1);
  });

  it('signs out: the refresh token is revoked, and signing out twice is harmless', async () => {
    const session = (await login('analyst@test.local')).body;
    const out = await request(ctx.app).post('/api/v1/auth/logout').send({ refreshToken: session.refreshToken });
    expect(out.status).toBe(204);
    expect((await refresh(session.refreshToken)).status).toBe(401);
    expect((await request(ctx.app).post('/api/v1/auth/logout').send({ refreshToken: session.refreshToken })).status).toBe(204);
    expect((await request(ctx.app).post('/api/v1/auth/logout').send({})).body.error.fields[0].path).toBe('refreshToken');
    expect((await refresh('tfr_made-up')).status).toBe(401);
  });

  it('changes one’s own password only with the current one, and signs out other sessions', async () => {
    const session = (await login('viewer@test.local')).body;
    const wrong = await ctx.as('viewer').post('/auth/password', { currentPassword: 'not it', newPassword: 'a brand new secret' });
    expect(wrong.status).toBe(422);
    expect(wrong.body.error.fields).toEqual([{ path: 'currentPassword', message: 'is wrong' }]);
    const short = await ctx.as('viewer').post('/auth/password', { currentPassword: TEST_PASSWORD, newPassword: 'short' });
    expect(short.status).toBe(400);
    expect(short.body.error.fields).toEqual([{ path: 'newPassword', message: 'password must be at least 10 characters' }]);

    await ctx.as('viewer').post('/auth/password', { currentPassword: TEST_PASSWORD, newPassword: 'a brand new secret' }).expect(204);
    expect((await refresh(session.refreshToken)).status).toBe(401);
    // This session's access token ended with the change too: sign in again to change it back.
    expect((await ctx.as('viewer').get('/auth/me')).status).toBe(401);
    const fresh = await login('viewer@test.local', 'a brand new secret');
    expect(fresh.status).toBe(200);
    await ctx.as(fresh.body.accessToken).post('/auth/password', { currentPassword: 'a brand new secret', newPassword: TEST_PASSWORD }).expect(204);
  });

  it('records sign-ins and failed sign-ins in the audit trail', async () => {
    await login('admin@test.local', 'wrong password');
    const failed = await ctx.db('audit_events').where({ action: 'sign-in-failed', actor_id: ctx.userIds.admin });
    expect(failed.length).toBe(1);
    expect(failed[0].summary).toBe('failed sign-in for admin@test.local');
  });

  it('answers 429 in the usual error shape after too many failed sign-ins for one e-mail', async () => {
    const email = 'limited@test.local';
    for (let attempt = 0; attempt < 3; attempt += 1) expect((await login(email, 'guess')).status).toBe(401);
    const limited = await login(email, 'guess');
    expect(limited.status).toBe(429);
    expect(limited.body).toEqual({
      error: { code: 'too_many_attempts', message: 'too many failed sign-ins for this e-mail or from this address; wait 15 minutes and try again' },
    });
    expect(limited.headers['retry-after']).toBe('900');
    // Other people behind the same address are not locked out, and successful sign-ins do not count.
    for (let attempt = 0; attempt < 4; attempt += 1) expect((await login('lead@test.local')).status).toBe(200);
  });

  it('stores no refresh token when the sign-in audit write fails', async () => {
    const before = await rowCounts(ctx.db, ['refresh_tokens', 'audit_events']);
    const allowAuditWrites = await refuseAuditWrites(ctx.db, "new.action = 'sign-in'");
    try {
      expect((await login('lead@test.local')).status).toBe(500);
    } finally {
      await allowAuditWrites();
    }
    expect(await rowCounts(ctx.db, ['refresh_tokens', 'audit_events'])).toEqual(before);
  });
});
